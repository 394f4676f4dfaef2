import { describe, expect, it } from 'vitest';
import { decimateToColumns } from '../../../renderer/console/plots/decimate';

// Min/max decimation for plotting (common practice, no source): each pixel column keeps
// the extremes of its points, so no spike is lost however long the series.
describe('min/max decimation', () => {
  it('keeps every column’s extremes, so a one-sample spike survives 3.6 million points', () => {
    const n = 3_600_000;
    const xs = new Float64Array(n);
    const ys = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      xs[i] = i / 1000;
      ys[i] = Math.sin(i / 5000);
    }
    ys[1_234_567] = 42;
    const cols = decimateToColumns(xs, ys, xs[0]!, xs[n - 1]!, 800);
    expect(Math.max(...cols.max)).toBe(42);
    expect(cols.count.reduce((a, b) => a + b, 0)).toBe(n); // every point lands in exactly one column
    expect(Math.min(...cols.min)).toBeCloseTo(-1, 6);
  });

  it('marks missing values as gaps and leaves columns without points empty', () => {
    const cols = decimateToColumns([0, 1, 2, 3, 10], [1, Number.NaN, 3, 4, 5], 0, 10, 10);
    expect(Array.from(cols.gap)).toEqual([0, 1, 0, 0, 0, 0, 0, 0, 0, 0]);
    expect(Array.from(cols.count)).toEqual([1, 0, 1, 1, 0, 0, 0, 0, 0, 1]);
    expect(cols.max[9]).toBe(5); // the last x falls in the last column
  });

  it('ignores points outside the range', () => {
    const cols = decimateToColumns([-1, 0.5, 2], [9, 1, 9], 0, 1, 2);
    expect(Array.from(cols.count)).toEqual([0, 1]);
  });
});
