import { leastSquaresLine } from '../clock/least-squares-line';

/**
 * How fast the drift grows: the slope of the least-squares line (with intercept) through
 * the drift checks' offsets against session time, in degrees per minute. Null with fewer
 * than two checks or when all were at the same time.
 */
export function driftRateDegPerMin(timesS: readonly number[], offsetsDeg: readonly number[]): number | null {
  if (timesS.length !== offsetsDeg.length) throw new RangeError(`timesS and offsetsDeg must have the same length, got ${timesS.length} and ${offsetsDeg.length}`);
  timesS.forEach((t, i) => {
    if (!Number.isFinite(t)) throw new RangeError(`timesS[${i}] must be finite, got ${t}`);
    if (!Number.isFinite(offsetsDeg[i])) throw new RangeError(`offsetsDeg[${i}] must be finite, got ${offsetsDeg[i]}`);
  });
  if (timesS.length < 2 || timesS.every((t) => t === timesS[0])) return null;
  return leastSquaresLine(timesS, offsetsDeg).slope * 60;
}
