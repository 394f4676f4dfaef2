import type { RawCalibrationResult } from './calibration-step';

const fixed = (v: number | null, digits: number, unit: string) => (v === null ? 'no valid gaze' : `${v.toFixed(digits)} ${unit}`);

/** The residual at each point of Gazeloom's raw-coordinate calibration, so the operator can judge it or repeat it. */
export function CalibrationResiduals({ fit }: { fit: RawCalibrationResult }) {
  return (
    <table aria-label="Calibration residuals per point" className="calibration-residuals">
      <caption>
        Calibration residuals (second-order polynomial, RMS {fit.rmsDeg.toFixed(2)}°)
      </caption>
      <thead>
        <tr>
          <th scope="col">Point</th>
          <th scope="col">Target (px)</th>
          <th scope="col">Residual (px)</th>
          <th scope="col">Residual (°)</th>
        </tr>
      </thead>
      <tbody>
        {fit.residuals.map((r, i) => (
          <tr key={`${r.x},${r.y}`}>
            <td>{i + 1}</td>
            <td>
              {Math.round(r.x)}, {Math.round(r.y)}
            </td>
            <td>{fixed(r.px, 1, 'px')}</td>
            <td>{fixed(r.deg, 2, '°')}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
