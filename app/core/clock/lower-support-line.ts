/**
 * The line under a set of points that comes closest to them all: among the lines on or
 * below every point, the one minimizing Σ (y − line), that is the highest at the mean x.
 * It is the edge of the lower convex hull over the mean x (Moon, Skelly and Towsley, 1999,
 * "Estimation and removal of clock skew from network delay measurements", IEEE INFOCOM).
 * Points above the envelope, however many, cannot move it, which makes it the robust start
 * for screening delayed windows before a least-squares fit. x must be strictly increasing
 * (window order), with at least two points.
 */
export function lowerSupportLine(x: ArrayLike<number>, y: ArrayLike<number>): { slope: number; intercept: number } {
  const n = x.length;
  if (n < 2 || y.length !== n) throw new RangeError(`x and y must hold the same number of points, at least 2, got ${x.length} and ${y.length}`);
  // Andrew's monotone chain, lower half: keep only counter-clockwise turns.
  const hull: number[] = [];
  let meanX = 0;
  for (let i = 0; i < n; i++) {
    if (i > 0 && !(x[i]! > x[i - 1]!)) throw new RangeError(`x must be strictly increasing, got x[${i - 1}] = ${x[i - 1]} and x[${i}] = ${x[i]}`);
    meanX += x[i]! / n;
    while (hull.length >= 2) {
      const o = hull[hull.length - 2]!;
      const a = hull[hull.length - 1]!;
      const cross = (x[a]! - x[o]!) * (y[i]! - y[o]!) - (y[a]! - y[o]!) * (x[i]! - x[o]!);
      if (cross > 0) break;
      hull.pop();
    }
    hull.push(i);
  }
  let k = 0;
  while (k < hull.length - 2 && x[hull[k + 1]!]! <= meanX) k++;
  const [a, b] = [hull[k]!, hull[k + 1]!];
  const slope = (y[b]! - y[a]!) / (x[b]! - x[a]!);
  return { slope, intercept: y[a]! - slope * x[a]! };
}
