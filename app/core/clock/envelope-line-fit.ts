import { leastSquaresLine, type LeastSquaresLine } from './least-squares-line';
import { lowerSupportLine } from './lower-support-line';

/** Window minima needed for a line: with fewer, one delayed window could not be told from a slope. */
export const MIN_ENVELOPE_POINTS = 4;
/** A window minimum is dropped when it lies this many robust standard deviations above the median residual... */
const SCREEN_MAD = 5;
/** ...plus this much, so that a very tight envelope does not shed points over microseconds of scheduling noise (common practice, no source)... */
const SCREEN_FLOOR_S = 20e-6;
/** ...and always when it lies this far above the support line: no sample of that window travelled freely, a stall held them all (common practice, no source). */
const STALLED_S = 10e-3;

export interface EnvelopeLine {
  readonly line: LeastSquaresLine;
  /** Points the line rests on, after dropping outliers. */
  readonly kept: number;
  /** Residual standard deviation of the kept points plus the line's standard error at the last kept point (seconds). */
  readonly uncertaintyS: number;
}

/**
 * A least-squares line through the window minima of the delay envelope, made robust against
 * minima far above it. Transport jitter only ever adds delay, so the outliers (a whole
 * window delayed by a stall or a burst) always lie above the envelope, often several in a
 * row, where they would tilt a least-squares line towards themselves and hide from a test
 * of its residuals. So they are screened against the lower support line, which no point
 * above the envelope can move: minima more than SCREEN_MAD robust standard deviations
 * (1.4826 × the median absolute deviation of the residuals) plus SCREEN_FLOOR_S above the
 * median residual, or more than STALLED_S above the line, are dropped, and the least-squares
 * line goes through the rest. The robust rule keeps at least half the minima; only the
 * stall rule can drop more. Returns null when fewer than MIN_ENVELOPE_POINTS minima remain.
 * x must be strictly increasing (window order).
 */
export function fitLowerEnvelope(x: Float64Array, y: Float64Array): EnvelopeLine | null {
  if (x.length < MIN_ENVELOPE_POINTS) return null;
  const include = screenAboveSupport(x, y);
  const kept = include.reduce((sum, v) => sum + v, 0);
  if (kept < MIN_ENVELOPE_POINTS) return null;
  const line = leastSquaresLine(x, y, include);
  let lastX = -Infinity;
  for (let i = 0; i < x.length; i++) if (include[i] && x[i]! > lastX) lastX = x[i]!;
  const s = line.residualSd;
  const standardError = s * Math.sqrt(1 / kept + (lastX - line.meanX) ** 2 / line.sxx);
  return { line, kept, uncertaintyS: s + standardError };
}

/** 1 for the points to keep: those within the robust spread of the residuals above the lower support line, and not stalled. */
function screenAboveSupport(x: Float64Array, y: Float64Array): Uint8Array {
  const support = lowerSupportLine(x, y);
  const residual = y.map((v, i) => v - (support.intercept + support.slope * x[i]!));
  const median = medianOf(residual);
  const robustSd = 1.4826 * medianOf(residual.map((r) => Math.abs(r - median)));
  const limit = Math.min(median + SCREEN_MAD * robustSd + SCREEN_FLOOR_S, STALLED_S);
  return Uint8Array.from(residual, (r) => (r <= limit ? 1 : 0));
}

function medianOf(values: Float64Array): number {
  const sorted = values.slice().sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}
