import { meanPosition, rmsAround, rmsSampleToSample, type Position } from './angular-rms';

/**
 * Data-quality measures on gaze already in degrees on a flat plane (x right, y down), the
 * form of the worked examples in REFERENCES.md section 3 and of the published definitions
 * (Holmqvist, Nyström and Mulvey 2012, ETRA). Live gaze in screen pixels goes through
 * pointQuality instead, which measures the true angle seen from the eye.
 *
 * NaN and gaps: a sample whose x or y is not finite is invalid. It is left out of every
 * mean, and sample-to-sample steps are taken only between neighbours that are both valid.
 * With too few valid samples a measure is NaN.
 */
const flatAngle = (a: Position, b: Position): number => Math.hypot(a.x - b.x, a.y - b.y);

function positions(xs: ArrayLike<number>, ys: ArrayLike<number>): (Position | null)[] {
  if (xs.length !== ys.length) throw new RangeError(`xs and ys must have the same length, got ${xs.length} and ${ys.length}`);
  return Array.from({ length: xs.length }, (_, i) => (Number.isFinite(xs[i]) && Number.isFinite(ys[i]) ? { x: xs[i]!, y: ys[i]! } : null));
}

const validOnly = (points: readonly (Position | null)[]): Position[] => points.filter((p): p is Position => p !== null);

/**
 * Accuracy as the offset of the mean gaze: the distance from the target to the mean of the
 * valid samples (not the mean of each sample's distance, which noise inflates).
 */
export function accuracyOfMeanDeg(gx: ArrayLike<number>, gy: ArrayLike<number>, tx: number, ty: number): number {
  if (!Number.isFinite(tx) || !Number.isFinite(ty)) throw new RangeError(`target must be finite, got (${tx}, ${ty})`);
  const mean = meanPosition(validOnly(positions(gx, gy)));
  return mean ? flatAngle(mean, { x: tx, y: ty }) : Number.NaN;
}

/** Precision as RMS of sample-to-sample distances, √(mean θᵢ²). */
export function rmsS2SDeg(xs: ArrayLike<number>, ys: ArrayLike<number>): number {
  return rmsSampleToSample(positions(xs, ys), flatAngle);
}

/** Precision as √(mean[(xᵢ−x̄)² + (yᵢ−ȳ)²]) over the valid samples (population form). */
export function stdDeg(xs: ArrayLike<number>, ys: ArrayLike<number>): number {
  const valid = validOnly(positions(xs, ys));
  const mean = meanPosition(valid);
  return mean ? rmsAround(valid, mean, flatAngle) : Number.NaN;
}
