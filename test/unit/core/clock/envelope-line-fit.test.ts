import { describe, expect, it } from 'vitest';
import { fitLowerEnvelope } from '../../../../app/core/clock/envelope-line-fit';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

/** Window minima on y = 2e-3 + 50e-6 x (x in seconds) with up to 2 µs of positive jitter. */
function minima(n: number, seed: number): { x: Float64Array; y: Float64Array } {
  const rng = new Xoshiro128(seed);
  const x = Float64Array.from({ length: n }, (_, i) => i + 0.2 + 0.6 * rng.next());
  return { x, y: x.map((v) => 2e-3 + 50e-6 * v + 2e-6 * rng.next()) };
}

describe('fitLowerEnvelope (common practice, no source)', () => {
  it('drops a single window delayed whole, wherever it lies, and keeps the rest', () => {
    for (const at of [0, 5, 11]) {
      const { x, y } = minima(12, at);
      y[at]! += 30e-3;
      const fit = fitLowerEnvelope(x, y)!;
      expect(fit.kept).toBe(11);
      expect(Math.abs(fit.line.slope - 50e-6)).toBeLessThan(0.5e-6);
    }
  });

  it('drops a run of three consecutive delayed windows at the end, where they pull the line hardest', () => {
    const { x, y } = minima(30, 1);
    for (const i of [27, 28, 29]) y[i]! += 5e-3 + i * 1e-4;
    const fit = fitLowerEnvelope(x, y)!;
    expect(fit.kept).toBe(27);
    expect(Math.abs(fit.line.slope - 50e-6)).toBeLessThan(0.2e-6);
  });

  it('keeps every window of a clean envelope, and its uncertainty is the scatter plus the standard error at the last window', () => {
    const { x, y } = minima(40, 2);
    const fit = fitLowerEnvelope(x, y)!;
    expect(fit.kept).toBe(40);
    const { residualSd: s, sxx, meanX } = fit.line;
    expect(fit.uncertaintyS).toBeCloseTo(s + s * Math.sqrt(1 / 40 + (x[39]! - meanX) ** 2 / sxx), 15);
    // Uniform jitter over 2 µs has a standard deviation of 2/sqrt(12) = 0.58 µs.
    expect(s).toBeGreaterThan(0.4e-6);
    expect(s).toBeLessThan(0.8e-6);
  });

  it('never drops more than half the windows', () => {
    const { x, y } = minima(10, 3);
    for (let i = 0; i < 10; i += 2) y[i]! += (1 + i) * 1e-3;
    const fit = fitLowerEnvelope(x, y)!;
    expect(fit.kept).toBeGreaterThanOrEqual(5);
  });

  it('drops windows more than 10 ms above the support line even when they are half of them, and gives no line with fewer than 4 left', () => {
    const { x, y } = minima(8, 4);
    for (const i of [1, 2, 3, 4]) y[i]! += 0.5 + i * 0.3; // a 4-second stall after the first window: the median residual is stalled
    expect(fitLowerEnvelope(x, y)!.kept).toBe(4);
    const four = minima(4, 5);
    four.y[1]! += 1.5;
    four.y[2]! += 0.5;
    expect(fitLowerEnvelope(four.x, four.y)).toBeNull();
    expect(fitLowerEnvelope(Float64Array.of(0, 1, 2), Float64Array.of(0, 0, 0))).toBeNull();
  });
});
