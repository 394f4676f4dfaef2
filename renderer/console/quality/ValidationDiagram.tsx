import { degToScreenPx, screenPxToDeg, type DisplayGeometry } from '../../../app/core/geometry/display-geometry';
import { screenPoint } from '../../../app/core/geometry/units';
import type { ValidationRecord } from '../../../app/core/study/records';
import { formatDeg } from './quality-format';

const SCALES = [1, 2, 5, 10, 20, 50, 100];

/** Where one point's mean gaze sat and how wide its samples spread, in screen px. */
function pointGeometry(p: ValidationRecord['points'][number], g: DisplayGeometry) {
  const t = screenPxToDeg(g, screenPoint(p.x, p.y));
  const gaze = p.dxDeg === null || p.dyDeg === null ? null : degToScreenPx(g, t.x + p.dxDeg, t.y + p.dyDeg);
  const sdPx = p.precisionSdDeg === null ? null : Math.abs(degToScreenPx(g, t.x + p.precisionSdDeg, t.y).x - p.x);
  return { gaze, sdPx };
}

/**
 * The screen with the validation's targets, each with its error vector (target to mean
 * gaze, scaled so small errors stay visible; the scale is written on the diagram) and a
 * circle of one precision SD around the scaled gaze position.
 */
export function ValidationDiagram({ validation, display }: { validation: ValidationRecord; display: DisplayGeometry }) {
  const points = validation.points.map((p) => ({ p, ...pointGeometry(p, display) }));
  const longest = Math.max(1e-9, ...points.map(({ p, gaze }) => (gaze ? Math.hypot(gaze.x - p.x, gaze.y - p.y) : 0)));
  const scale = [...SCALES].reverse().find((s) => longest * s <= display.widthPx * 0.08) ?? 1;
  const mark = display.widthPx / 120;
  const label = `Validation points on the screen, error vectors and precision circles scaled ×${scale}`;
  return (
    <figure className="validation-diagram">
      <svg viewBox={`0 0 ${display.widthPx} ${display.heightPx}`} role="img" aria-label={label}>
        <rect x={0} y={0} width={display.widthPx} height={display.heightPx} className="diagram-screen" />
        {points.map(({ p, gaze, sdPx }, i) => {
          const end = gaze ? { x: p.x + (gaze.x - p.x) * scale, y: p.y + (gaze.y - p.y) * scale } : null;
          return (
            <g key={i} className={p.accuracyDeg === null ? 'diagram-point lost' : 'diagram-point'}>
              <title>{`Point ${i + 1} at (${p.x.toFixed(0)}, ${p.y.toFixed(0)}) px: accuracy ${formatDeg(p.accuracyDeg)}, precision SD ${formatDeg(p.precisionSdDeg)}`}</title>
              <line x1={p.x - mark} y1={p.y} x2={p.x + mark} y2={p.y} className="diagram-target" />
              <line x1={p.x} y1={p.y - mark} x2={p.x} y2={p.y + mark} className="diagram-target" />
              {end && <line x1={p.x} y1={p.y} x2={end.x} y2={end.y} className="diagram-error" />}
              {end && sdPx !== null && <circle cx={end.x} cy={end.y} r={Math.max(1, sdPx * scale)} className="diagram-precision" />}
              <text x={p.x + mark * 1.2} y={p.y - mark * 1.2} className="diagram-label">
                {i + 1}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="muted">
        + target, line: error to the mean gaze, circle: precision (SD), all ×{scale}. Screen {display.widthPx}×{display.heightPx} px at {display.distanceMm} mm.
      </figcaption>
    </figure>
  );
}
