import { describe, expect, it } from 'vitest';
import { decimateToColumns } from '../../../../renderer/console/plots/decimate';
import { buildDrawPath, seriesExtent, strokeDrawPath } from '../../../../renderer/console/plots/draw-path';

// The draw path of a decimated series (common practice, no source): one vertical stroke per
// column from its min to its max, joined across columns, broken where data is missing.
describe('draw path', () => {
  const xs = Float64Array.from({ length: 8 }, (_, i) => i);
  const ys = Float64Array.from([1, 3, Number.NaN, Number.NaN, 2, 5, 4, 0]);

  it('strokes min then max per column and breaks the line at a gap', () => {
    const cols = decimateToColumns(xs, ys, 0, 7, 4); // columns of two points each
    const path = buildDrawPath(cols, 10, (y) => -y);
    expect(path.vertices).toBe(6); // column 1 holds only missing values
    expect([...path.runStarts]).toEqual([0, 2]);
    expect([...path.xy.subarray(0, 12)]).toEqual([10.5, -1, 10.5, -3, 12.5, -2, 12.5, -5, 13.5, -0, 13.5, -4]);
    const calls: string[] = [];
    strokeDrawPath({ beginPath: () => calls.push('begin'), moveTo: (x, y) => calls.push(`M${x},${y}`), lineTo: (x, y) => calls.push(`L${x},${y}`) }, path);
    expect(calls).toEqual(['begin', 'M10.5,-1', 'L10.5,-3', 'M12.5,-2', 'L12.5,-5', 'L13.5,0', 'L13.5,-4']);
  });

  it('an empty column without a gap does not break the line', () => {
    const cols = decimateToColumns([0, 3], [1, 2], 0, 3, 4);
    const path = buildDrawPath(cols, 0, (y) => y);
    expect([...path.runStarts]).toEqual([0]);
    expect(path.vertices).toBe(4);
  });

  it('the extent skips missing values and is null without finite data', () => {
    expect(seriesExtent([{ xs, ys }])).toEqual({ x0: 0, x1: 7, y0: 0, y1: 5 });
    expect(seriesExtent([{ xs: [0, 1], ys: [Number.NaN, Number.NaN] }])).toBeNull();
    expect(seriesExtent([])).toBeNull();
  });
});
