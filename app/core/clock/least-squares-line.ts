/** A straight line y ≈ intercept + slope · x fitted by ordinary least squares. */
export interface LeastSquaresLine {
  readonly slope: number;
  /** The line's value at x = 0. */
  readonly intercept: number;
  readonly meanX: number;
  readonly meanY: number;
  /** Σ (x − x̄)² over the points used: the spread that the slope's standard error divides by. */
  readonly sxx: number;
  /** sqrt(Σ residual² / (n − 2)); NaN when n = 2 (a line through two points has no scatter to measure). */
  readonly residualSd: number;
  readonly n: number;
}

/**
 * Ordinary least squares with the two-pass (centred) sums, which keep their precision when
 * x and y are large and nearly proportional, as paired clock readings are (Chan, Golub and
 * LeVeque, 1983, "Algorithms for computing the sample variance: analysis and
 * recommendations", The American Statistician 37(3)). `include`, when given, marks the
 * points to use (non-zero) so that a robust fit can drop points without copying arrays.
 */
export function leastSquaresLine(x: ArrayLike<number>, y: ArrayLike<number>, include?: ArrayLike<number>): LeastSquaresLine {
  if (x.length !== y.length) throw new RangeError(`x and y must have the same length, got ${x.length} and ${y.length}`);
  if (include !== undefined && include.length !== x.length) {
    throw new RangeError(`include must have the length of x (${x.length}), got ${include.length}`);
  }
  const used = (i: number): boolean => include === undefined || include[i] !== 0;
  let n = 0;
  let sumX = 0;
  let sumY = 0;
  for (let i = 0; i < x.length; i++) {
    if (!used(i)) continue;
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) throw new RangeError(`x[${i}] and y[${i}] must be finite, got ${x[i]} and ${y[i]}`);
    n++;
    sumX += x[i]!;
    sumY += y[i]!;
  }
  if (n < 2) throw new RangeError(`a line needs at least two points, got ${n}`);
  const meanX = sumX / n;
  const meanY = sumY / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < x.length; i++) {
    if (!used(i)) continue;
    const dx = x[i]! - meanX;
    sxx += dx * dx;
    sxy += dx * (y[i]! - meanY);
  }
  if (!(sxx > 0)) throw new RangeError('x must hold at least two distinct values');
  const slope = sxy / sxx;
  let sse = 0;
  for (let i = 0; i < x.length; i++) {
    if (!used(i)) continue;
    const r = y[i]! - meanY - slope * (x[i]! - meanX);
    sse += r * r;
  }
  return { slope, intercept: meanY - slope * meanX, meanX, meanY, sxx, residualSd: n > 2 ? Math.sqrt(sse / (n - 2)) : NaN, n };
}
