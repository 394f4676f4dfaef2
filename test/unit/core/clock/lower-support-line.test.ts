import { describe, expect, it } from 'vitest';
import { lowerSupportLine } from '../../../../app/core/clock/lower-support-line';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

describe('lowerSupportLine (Moon, Skelly and Towsley, 1999, the linear programme of their skew estimate)', () => {
  it('is the line through the envelope, whatever lies above it', () => {
    const x = Array.from({ length: 10 }, (_, i) => i);
    const y = x.map((v) => 1 + 2 * v);
    for (const i of [0, 1, 2, 9]) y[i]! += 5 + i;
    const line = lowerSupportLine(x, y);
    expect(line.slope).toBeCloseTo(2, 12);
    expect(line.intercept).toBeCloseTo(1, 12);
  });

  it('lies under every point and is the highest such line at the mean x, as a brute force over all point pairs finds', () => {
    const rng = new Xoshiro128(12);
    for (let trial = 0; trial < 20; trial++) {
      const n = 4 + rng.nextInt(30);
      const x = Array.from({ length: n }, (_, i) => i + rng.next() * 0.9);
      const y = x.map((v) => 0.3 * v + rng.nextExponential(1) + (rng.next() < 0.2 ? 20 : 0));
      const meanX = x.reduce((s, v) => s + v, 0) / n;
      const line = lowerSupportLine(x, y);
      x.forEach((v, i) => expect(line.intercept + line.slope * v).toBeLessThanOrEqual(y[i]! + 1e-12));
      // An optimum of the linear programme lies on two of the points: try every pair.
      let best = -Infinity;
      for (let a = 0; a < n; a++) {
        for (let b = a + 1; b < n; b++) {
          const slope = (y[b]! - y[a]!) / (x[b]! - x[a]!);
          const under = x.every((v, i) => y[a]! + slope * (v - x[a]!) <= y[i]! + 1e-12);
          if (under) best = Math.max(best, y[a]! + slope * (meanX - x[a]!));
        }
      }
      expect(line.intercept + line.slope * meanX).toBeCloseTo(best, 10);
    }
  });

  it('throws RangeError for fewer than two points or x out of order', () => {
    expect(() => lowerSupportLine([1], [1])).toThrow(/at least 2/);
    expect(() => lowerSupportLine([0, 2, 1], [0, 0, 0])).toThrow(/strictly increasing/);
  });
});
