import { describe, expect, it } from 'vitest';
import { findHotPixels, medianFiredCount } from '../../../../app/core/events/stats';

/** A 4-wide count grid from rows. */
const grid = (...rows: number[][]) => Uint32Array.from(rows.flat());

describe('medianFiredCount (median of an even count: mean of the two middle values; common practice, no source)', () => {
  it('ignores pixels that never fired', () => {
    expect(medianFiredCount(grid([0, 5, 0, 1], [9, 0, 0, 0]))).toBe(5);
  });

  it('averages the two middle values of an even number', () => {
    expect(medianFiredCount(grid([7, 1, 0, 3], [0, 0, 5, 0]))).toBe(4);
    expect(medianFiredCount(grid([2, 1, 0, 0]))).toBe(1.5);
  });

  it('has no median when no pixel fired', () => {
    expect(medianFiredCount(new Uint32Array(8))).toBeNull();
  });
});

describe('findHotPixels (more than 10 x the median fired count; common practice, no source)', () => {
  it('takes counts strictly above the threshold only', () => {
    // Fired 2, 2, 2, 20, 21: median 2, threshold 20, so 20 is not hot and 21 is.
    const hot = findHotPixels(grid([2, 0, 20, 2], [0, 21, 0, 2]), 4);
    expect(hot).toEqual({ threshold_factor: 10, median_count: 2, pixels: [{ x: 1, y: 1, count: 21 }] });
  });

  it('sorts by count, most first, and equal counts in row-major order', () => {
    // Fired: fourteen 1s and 50, 80, 50, 80: median 1, threshold 10.
    const counts = grid([1, 50, 1, 1], [80, 1, 1, 1], [1, 1, 50, 1], [1, 1, 1, 80], [1, 1, 1, 1]);
    expect(findHotPixels(counts, 4).pixels).toEqual([
      { x: 0, y: 1, count: 80 },
      { x: 3, y: 3, count: 80 },
      { x: 1, y: 0, count: 50 },
      { x: 2, y: 2, count: 50 },
    ]);
  });

  it('uses a given factor and refuses a factor below 1', () => {
    expect(findHotPixels(grid([1, 1, 3, 0]), 4, 2).pixels).toEqual([{ x: 2, y: 0, count: 3 }]);
    expect(() => findHotPixels(grid([1, 1, 3, 0]), 4, 0.5)).toThrow(/factor/);
    expect(() => findHotPixels(grid([1, 1, 3, 0]), 4, Number.NaN)).toThrow(/factor/);
  });

  it('finds nothing when nothing fired', () => {
    expect(findHotPixels(new Uint32Array(12), 4)).toEqual({ threshold_factor: 10, median_count: null, pixels: [] });
  });
});
