import type { RateSeries } from './event-stats';

/** The plotted series has at most this many points (RateSeries). */
export const MAX_RATE_POINTS = 1000;

/** The smallest 1-2-5 multiple of 1 ms (1, 2, 5, 10, 20, 50, ...) that fits `msBins` into `maxPoints` bins. */
export function rateBinWidthMs(msBins: number, maxPoints = MAX_RATE_POINTS): number {
  if (!Number.isInteger(maxPoints) || maxPoints < 1) throw new RangeError(`maxPoints must be a positive integer, got ${maxPoints}`);
  for (let decade = 1; ; decade *= 10) {
    for (const step of [1, 2, 5]) {
      if (Math.ceil(msBins / (step * decade)) <= maxPoints) return step * decade;
    }
  }
}

/** Merges the first `used` 1 ms bin counts into RateSeries bins (see RateSeries for the rules). */
export function rateSeriesFromMsBins(msCounts: Uint32Array, used: number, maxPoints = MAX_RATE_POINTS): RateSeries {
  const widthMs = rateBinWidthMs(used, maxPoints);
  const points = Math.ceil(used / widthMs);
  const rate_hz = new Array<number>(points);
  for (let j = 0; j < points; j++) {
    let events = 0;
    const end = Math.min(used, (j + 1) * widthMs);
    for (let i = j * widthMs; i < end; i++) events += msCounts[i]!;
    rate_hz[j] = (events * 1000) / widthMs;
  }
  return { bin_s: widthMs / 1000, rate_hz };
}
