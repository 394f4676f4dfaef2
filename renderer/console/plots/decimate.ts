/**
 * Min/max decimation for drawing long series: for each pixel column, the smallest and
 * largest y of the points that fall in it, so a 3.6-million-point session draws as a
 * few thousand vertical strokes without losing a single spike. xs must be ascending.
 */
export interface Columns {
  readonly min: Float64Array;
  readonly max: Float64Array;
  /** 0 where no finite point falls in the column. */
  readonly count: Uint32Array;
  /** 1 where a missing value (NaN) falls in the column: the line breaks there. */
  readonly gap: Uint8Array;
}

export function decimateToColumns(xs: ArrayLike<number>, ys: ArrayLike<number>, x0: number, x1: number, columns: number): Columns {
  const min = new Float64Array(columns).fill(Infinity);
  const max = new Float64Array(columns).fill(-Infinity);
  const count = new Uint32Array(columns);
  const gap = new Uint8Array(columns);
  const scale = columns / (x1 - x0 || 1);
  for (let i = 0; i < xs.length; i++) {
    const y = ys[i]!;
    const x = xs[i]!;
    if (x < x0 || x > x1) continue;
    const c = Math.min(columns - 1, Math.floor((x - x0) * scale)); // x1 itself falls in the last column
    if (!Number.isFinite(y)) {
      gap[c] = 1; // missing data stays visibly missing
      continue;
    }
    if (y < min[c]!) min[c] = y;
    if (y > max[c]!) max[c] = y;
    count[c]!++;
  }
  return { min, max, count, gap };
}
