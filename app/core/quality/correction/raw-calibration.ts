import { z } from 'zod';
import { angleBetween, checkDisplayGeometry, type DisplayGeometry } from '../../geometry/display-geometry';
import { screenPoint } from '../../geometry/units';
import { evaluateMap, fitMap, polynomialMapParams, type Point } from './map-terms';

/**
 * Gazeloom's own calibration, for trackers that send raw coordinates (the feed's 'raw'
 * units): the second-order polynomial per screen axis in the raw x and y (terms 1, x, y,
 * xy, x², y²; Cerrolaza, Villanueva and Cabeza 2012, ACM TOCHI 19(2):13), fitted by least
 * squares on the calibration points, raw coordinates normalised by the params' centre and
 * scale. The output is screen px.
 */
export const rawCalibrationParams = polynomialMapParams('polynomial2').extend({ model: z.literal('polynomial2') });
export type RawCalibrationParams = z.infer<typeof rawCalibrationParams>;

export interface RawCalibrationFit {
  readonly params: RawCalibrationParams;
  /** Per calibration point, in the order given: the distance from the mapped gaze to the target, px and degrees seen from the eye. */
  readonly residuals: { px: number; deg: number }[];
  /** Root mean square of the residuals in degrees. */
  readonly rmsDeg: number;
}

/** Raw coordinates mapped to screen px. */
export function applyRawCalibration(params: RawCalibrationParams, x: number, y: number): Point {
  return evaluateMap('polynomial2', params, x, y);
}

/**
 * Fits the calibration on points of (mean raw gaze, target in screen px). Needs at least
 * 6 points not on one conic (9 or 13 leave residuals that say how good the fit is); throws
 * a RangeError otherwise, or when a value is not finite.
 */
export function fitRawCalibration(points: readonly { raw: Point; target: Point }[], g: DisplayGeometry): RawCalibrationFit {
  checkDisplayGeometry(g);
  points.forEach((p, i) => {
    for (const [name, v] of [['raw.x', p.raw.x], ['raw.y', p.raw.y], ['target.x', p.target.x], ['target.y', p.target.y]] as const) {
      if (!Number.isFinite(v)) throw new RangeError(`points[${i}].${name} must be finite, got ${v}`);
    }
  });
  const map = fitMap('polynomial2', points.map((p) => ({ from: p.raw, to: p.target })), 'calibration points with valid gaze');
  const params: RawCalibrationParams = { model: 'polynomial2', ...map };
  const residuals = points.map((p) => {
    const s = applyRawCalibration(params, p.raw.x, p.raw.y);
    return { px: Math.hypot(s.x - p.target.x, s.y - p.target.y), deg: angleBetween(g, screenPoint(s.x, s.y), screenPoint(p.target.x, p.target.y)) as number };
  });
  return { params, residuals, rmsDeg: Math.sqrt(residuals.reduce((s, r) => s + r.deg ** 2, 0) / residuals.length) };
}
