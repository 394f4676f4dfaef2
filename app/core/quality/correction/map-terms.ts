import { z } from 'zod';
import { solveLeastSquares } from './least-squares';

export interface Point {
  readonly x: number;
  readonly y: number;
}

/**
 * The terms of the two mapping functions, per axis, in coefficient order:
 *   affine       1, x, y
 *   polynomial2  1, x, y, xy, x², y²  (the second-order polynomial of Cerrolaza, Villanueva
 *                and Cabeza 2012, "Study of polynomial mapping functions in video-oculography
 *                eye trackers", ACM TOCHI 19(2):13)
 * x and y are normalised first, u = (x − centre.x)/scale.x and v = (y − centre.y)/scale.y,
 * so that the terms are of similar size and the fit well conditioned.
 */
export type MapKind = 'affine' | 'polynomial2';
export const TERM_NAMES = { affine: ['1', 'x', 'y'], polynomial2: ['1', 'x', 'y', 'xy', 'x^2', 'y^2'] } as const;

const finite = z.number().refine(Number.isFinite, 'expected a finite number');
const point = z.object({ x: finite, y: finite });

/** A fitted map's parameters, as stored (correction params, calibration messages). */
export const polynomialMapParams = (kind: MapKind) =>
  z.object({
    centre: point,
    scale: z.object({ x: finite.refine((v) => v > 0, 'expected a number > 0'), y: finite.refine((v) => v > 0, 'expected a number > 0') }),
    ax: z.array(finite).length(TERM_NAMES[kind].length),
    ay: z.array(finite).length(TERM_NAMES[kind].length),
  });
export type PolynomialMapParams = z.infer<ReturnType<typeof polynomialMapParams>>;

/** The terms of one point, after normalisation. */
export function mapTerms(kind: MapKind, u: number, v: number): number[] {
  return kind === 'affine' ? [1, u, v] : [1, u, v, u * v, u * u, v * v];
}

/** Centre (mean) and scale (largest distance from it) per axis of the points the map is fitted on. */
export function normalisationOf(points: readonly Point[], what: string): { centre: Point; scale: Point } {
  const centre = { x: points.reduce((s, p) => s + p.x, 0) / points.length, y: points.reduce((s, p) => s + p.y, 0) / points.length };
  const scale = { x: Math.max(...points.map((p) => Math.abs(p.x - centre.x))), y: Math.max(...points.map((p) => Math.abs(p.y - centre.y))) };
  if (!(scale.x > 0 && scale.y > 0)) throw new RangeError(`${what} must spread in both x and y; all lie on one ${scale.x > 0 ? 'horizontal' : 'vertical'} line`);
  return { centre, scale };
}

/** Evaluates a fitted map at (x, y). */
export function evaluateMap(kind: MapKind, p: PolynomialMapParams, x: number, y: number): Point {
  const t = mapTerms(kind, (x - p.centre.x) / p.scale.x, (y - p.centre.y) / p.scale.y);
  let ox = 0;
  let oy = 0;
  for (let k = 0; k < t.length; k++) {
    ox += p.ax[k]! * t[k]!;
    oy += p.ay[k]! * t[k]!;
  }
  return { x: ox, y: oy };
}

/**
 * Fits the map taking each `from` point to its `to` point by least squares, one fit per
 * output axis on the same design matrix. Throws a RangeError when the points cannot
 * determine every coefficient (too few, or degenerate: e.g. on one line for affine, on one
 * conic for polynomial2).
 */
export function fitMap(kind: MapKind, pairs: readonly { from: Point; to: Point }[], what: string): PolynomialMapParams {
  const cols = TERM_NAMES[kind].length;
  const need = kind === 'affine' ? 'not all on one line' : 'not all on one line or conic';
  if (pairs.length < cols) throw new RangeError(`${kind} needs at least ${cols} ${what} (${need}), got ${pairs.length}`);
  const { centre, scale } = normalisationOf(pairs.map((p) => p.from), what);
  const a = new Float64Array(pairs.length * cols);
  pairs.forEach(({ from }, i) => a.set(mapTerms(kind, (from.x - centre.x) / scale.x, (from.y - centre.y) / scale.y), i * cols));
  const fx = solveLeastSquares(a, pairs.length, cols, Float64Array.from(pairs, (p) => p.to.x));
  const fy = solveLeastSquares(a, pairs.length, cols, Float64Array.from(pairs, (p) => p.to.y));
  if (fx.rank < cols) throw new RangeError(`${kind} cannot be fitted on these ${pairs.length} ${what}: they determine only ${fx.rank} of its ${cols} terms (${need} needed)`);
  return { centre, scale, ax: Array.from(fx.x), ay: Array.from(fy.x) };
}
