import { z } from 'zod';
import type { CorrectionModel, CorrectionRecord } from '../../study/records';
import { evaluateMap, fitMap, polynomialMapParams, type Point } from './map-terms';

export type { CorrectionModel } from '../../study/records';

/** One check point: where the gaze sat (mean of its window, screen px), where the target was, and when. */
export interface CorrectionPair {
  readonly gaze: Point;
  readonly target: Point;
  readonly hostNs: number;
}

const finite = z.number().refine(Number.isFinite, 'expected a finite number');
const knot = z.object({ hostNs: finite, dx: finite, dy: finite });

/**
 * The parameters of each model, screen px throughout:
 *   offset               {dx, dy} added to every sample
 *   offset_interpolated  {knots: [{hostNs, dx, dy}]} in time order: the offset at each check,
 *                        linear in host time between checks, the first (last) knot's offset
 *                        before (after) them
 *   affine, polynomial2  {centre, scale, ax, ay}: the corrected x is Σ ax[k]·term_k(u, v) (map-terms.ts)
 */
export const correctionParams = {
  offset: z.object({ dx: finite, dy: finite }),
  offset_interpolated: z.object({ knots: z.array(knot).min(1).refine((ks) => ks.every((k, i) => i === 0 || k.hostNs > ks[i - 1]!.hostNs), 'expected knots in increasing hostNs') }),
  affine: polynomialMapParams('affine'),
  polynomial2: polynomialMapParams('polynomial2'),
} as const;

export interface CorrectionFit {
  readonly params: Record<string, unknown>;
  /** Distance from each pair's corrected gaze to its target, px, in the order given. */
  readonly residualsPx: number[];
  readonly rmsResidualPx: number;
}

export type CorrectionMap = (x: number, y: number, hostNs: number) => Point;

const meanOffset = (pairs: readonly CorrectionPair[]) => ({
  dx: pairs.reduce((s, p) => s + (p.target.x - p.gaze.x), 0) / pairs.length,
  dy: pairs.reduce((s, p) => s + (p.target.y - p.gaze.y), 0) / pairs.length,
});

function checkPairs(pairs: readonly CorrectionPair[]): void {
  pairs.forEach((p, i) => {
    for (const [name, v] of [['gaze.x', p.gaze.x], ['gaze.y', p.gaze.y], ['target.x', p.target.x], ['target.y', p.target.y], ['hostNs', p.hostNs]] as const) {
      if (!Number.isFinite(v)) throw new RangeError(`pairs[${i}].${name} must be finite, got ${v}`);
    }
  });
}

function fitParams(model: CorrectionModel, pairs: readonly CorrectionPair[]): Record<string, unknown> {
  if (model === 'offset') return meanOffset(pairs);
  if (model === 'offset_interpolated') {
    const times = [...new Set(pairs.map((p) => p.hostNs))].sort((a, b) => a - b);
    return { knots: times.map((hostNs) => ({ hostNs, ...meanOffset(pairs.filter((p) => p.hostNs === hostNs)) })) };
  }
  return fitMap(model, pairs.map((p) => ({ from: p.gaze, to: p.target })), 'check points');
}

/**
 * Fits a correction from check points by least squares: the offset as the mean of
 * target − gaze; the interpolated offset with one knot per check (pairs of the same hostNs);
 * affine and polynomial2 maps from gaze to target (map-terms.ts). Throws a RangeError with
 * too few or degenerate points (offset ≥ 1, affine ≥ 3, polynomial2 ≥ 6).
 */
export function fitCorrection(model: CorrectionModel, pairs: readonly CorrectionPair[]): CorrectionFit {
  if (!(model in correctionParams)) throw new RangeError(`model must be one of ${Object.keys(correctionParams).join(', ')}, got ${String(model)}`);
  if (pairs.length === 0) throw new RangeError(`${model} needs at least one check point with valid gaze, got none`);
  checkPairs(pairs);
  const params = fitParams(model, pairs);
  const map = correctionMap({ model, params });
  const residualsPx = pairs.map((p) => {
    const c = map(p.gaze.x, p.gaze.y, p.hostNs);
    return Math.hypot(c.x - p.target.x, c.y - p.target.y);
  });
  return { params, residualsPx, rmsResidualPx: Math.sqrt(residualsPx.reduce((s, r) => s + r * r, 0) / residualsPx.length) };
}

function interpolatedOffset(knots: readonly z.infer<typeof knot>[], hostNs: number): { dx: number; dy: number } {
  const first = knots[0]!;
  const last = knots[knots.length - 1]!;
  if (hostNs <= first.hostNs) return first;
  if (hostNs >= last.hostNs) return last;
  let i = 1;
  while (knots[i]!.hostNs < hostNs) i++;
  const a = knots[i - 1]!;
  const b = knots[i]!;
  const f = (hostNs - a.hostNs) / (b.hostNs - a.hostNs);
  return { dx: a.dx + f * (b.dx - a.dx), dy: a.dy + f * (b.dy - a.dy) };
}

/**
 * The correction as a function of a sample's position (screen px) and host time, with its
 * params checked once: a stored record whose params do not fit its model throws a
 * RangeError naming the field.
 */
export function correctionMap(record: Pick<CorrectionRecord, 'model' | 'params'>): CorrectionMap {
  const schema = correctionParams[record.model];
  if (!schema) throw new RangeError(`correction model must be one of ${Object.keys(correctionParams).join(', ')}, got ${String(record.model)}`);
  const parsed = schema.safeParse(record.params);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new RangeError(`correction params.${issue.path.join('.')}: ${issue.message} (model ${record.model})`);
  }
  const params = parsed.data;
  if (record.model === 'offset') {
    const { dx, dy } = params as z.infer<typeof correctionParams.offset>;
    return (x, y) => ({ x: x + dx, y: y + dy });
  }
  if (record.model === 'offset_interpolated') {
    const { knots } = params as z.infer<typeof correctionParams.offset_interpolated>;
    return (x, y, hostNs) => {
      const o = interpolatedOffset(knots, hostNs);
      return { x: x + o.dx, y: y + o.dy };
    };
  }
  const kind = record.model;
  const map = params as z.infer<typeof correctionParams.affine>;
  return (x, y) => evaluateMap(kind, map, x, y);
}

/** One sample corrected (for many, use correctionMap once, or correctSamples). */
export function applyCorrection(record: Pick<CorrectionRecord, 'model' | 'params'>, x: number, y: number, hostNs: number): Point {
  return correctionMap(record)(x, y, hostNs);
}
