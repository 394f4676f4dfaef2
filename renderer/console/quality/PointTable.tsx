import type { ValidationRecord } from '../../../app/core/study/records';
import { formatDeg, formatPct } from './quality-format';

/** Accuracy, precision and data loss at each target of one validation or drift check. */
export function PointTable({ validation, caption }: { validation: ValidationRecord; caption: string }) {
  return (
    <table className="quality-table" aria-label={caption}>
      <thead>
        <tr>
          <th scope="col">Point</th>
          <th scope="col">Target (px)</th>
          <th scope="col">Accuracy</th>
          <th scope="col">Offset x, y</th>
          <th scope="col">Precision RMS-S2S</th>
          <th scope="col">Precision SD</th>
          <th scope="col">Data loss</th>
          <th scope="col">Samples</th>
        </tr>
      </thead>
      <tbody>
        {validation.points.map((p, i) => (
          <tr key={i}>
            <th scope="row">{i + 1}</th>
            <td>
              {p.x.toFixed(0)}, {p.y.toFixed(0)}
            </td>
            <td>{formatDeg(p.accuracyDeg)}</td>
            <td>
              {formatDeg(p.dxDeg)}, {formatDeg(p.dyDeg)}
            </td>
            <td>{formatDeg(p.precisionRmsS2SDeg)}</td>
            <td>{formatDeg(p.precisionSdDeg)}</td>
            <td>{formatPct(p.dataLossPct)}</td>
            <td>{p.samples}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
