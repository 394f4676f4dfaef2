/**
 * The p-th percentile (0..100) by linear interpolation between the closest ranks:
 * definition 7 of Hyndman and Fan (1996), "Sample quantiles in statistical packages",
 * the default of numpy.percentile. Sorts `values` in place. Null for no values.
 */
export function percentileInPlace(values: Float64Array, p: number): number | null {
  if (!(p >= 0 && p <= 100)) throw new RangeError(`p must be from 0 to 100, got ${p}`);
  if (values.length === 0) return null;
  values.sort();
  const h = ((values.length - 1) * p) / 100;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, values.length - 1);
  return values[lo]! + (h - lo) * (values[hi]! - values[lo]!);
}
