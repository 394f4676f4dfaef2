import type { HotPixels } from './event-stats';

/** "Hot" means more than this many times the median count of the pixels that fired (common practice, no source). */
export const HOT_PIXEL_FACTOR = 10;

/** The median of the non-zero counts (even number: mean of the two middle ones); null if all are zero. */
export function medianFiredCount(counts: Uint32Array): number | null {
  let fired = 0;
  for (let i = 0; i < counts.length; i++) if (counts[i] !== 0) fired++;
  if (fired === 0) return null;
  const values = new Uint32Array(fired);
  let j = 0;
  for (let i = 0; i < counts.length; i++) if (counts[i] !== 0) values[j++] = counts[i]!;
  values.sort();
  const mid = fired >>> 1;
  return fired % 2 === 1 ? values[mid]! : (values[mid - 1]! + values[mid]!) / 2;
}

/** Hot pixels of a row-major per-pixel count grid `width` pixels wide (see HotPixels for the rules). */
export function findHotPixels(counts: Uint32Array, width: number, factor = HOT_PIXEL_FACTOR): HotPixels {
  if (!Number.isFinite(factor) || factor < 1) throw new RangeError(`factor must be a finite number >= 1, got ${factor}`);
  const median = medianFiredCount(counts);
  if (median === null) return { threshold_factor: factor, median_count: null, pixels: [] };
  const threshold = factor * median;
  const hot: number[] = [];
  for (let i = 0; i < counts.length; i++) if (counts[i]! > threshold) hot.push(i);
  // hot is in row-major order already, and Array.prototype.sort is stable.
  hot.sort((a, b) => counts[b]! - counts[a]!);
  const pixels = hot.map((i) => ({ x: i % width, y: Math.floor(i / width), count: counts[i]! }));
  return { threshold_factor: factor, median_count: median, pixels };
}
