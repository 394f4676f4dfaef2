import type { Columns } from './decimate';

/**
 * The polyline a plot strokes for one decimated series: per column with data, a vertical
 * stroke from its smallest to its largest y, joined to the previous column unless a gap
 * (a missing value with no point in the column) breaks the line. Vertices are canvas px.
 */
export interface DrawPath {
  /** x, y pairs, `vertices` of them. */
  readonly xy: Float32Array;
  readonly vertices: number;
  /** The vertex index at which each separate run of the line begins. */
  readonly runStarts: Uint32Array;
}

export function buildDrawPath(cols: Columns, left: number, yToPx: (y: number) => number): DrawPath {
  const n = cols.count.length;
  const xy = new Float32Array(n * 4);
  const starts = new Uint32Array(n);
  let vertices = 0;
  let runs = 0;
  let pen = false;
  for (let c = 0; c < n; c++) {
    if (cols.gap[c] === 1 && cols.count[c] === 0) pen = false;
    if (cols.count[c] === 0) continue; // no point here: the line runs on to the next one
    if (!pen) starts[runs++] = vertices;
    const px = left + c + 0.5;
    xy[vertices * 2] = px;
    xy[vertices * 2 + 1] = yToPx(cols.min[c]!);
    vertices++;
    xy[vertices * 2] = px;
    xy[vertices * 2 + 1] = yToPx(cols.max[c]!);
    vertices++;
    pen = true;
  }
  return { xy, vertices, runStarts: starts.slice(0, runs) };
}

/** Strokes a path built by buildDrawPath on a 2D canvas (or anything with the same three calls). */
export function strokeDrawPath(ctx: Pick<CanvasRenderingContext2D, 'beginPath' | 'moveTo' | 'lineTo'>, path: DrawPath): void {
  ctx.beginPath();
  for (let r = 0; r < path.runStarts.length; r++) {
    const from = path.runStarts[r]!;
    const to = r + 1 < path.runStarts.length ? path.runStarts[r + 1]! : path.vertices;
    ctx.moveTo(path.xy[from * 2]!, path.xy[from * 2 + 1]!);
    for (let v = from + 1; v < to; v++) ctx.lineTo(path.xy[v * 2]!, path.xy[v * 2 + 1]!);
  }
}

/** The x span (first to last, xs ascending) and the finite y range of several series; null when none has data. */
export function seriesExtent(series: readonly { xs: ArrayLike<number>; ys: ArrayLike<number> }[]): { x0: number; x1: number; y0: number; y1: number } | null {
  let x0 = Infinity;
  let x1 = -Infinity;
  let y0 = Infinity;
  let y1 = -Infinity;
  for (const s of series) {
    if (s.xs.length === 0) continue;
    x0 = Math.min(x0, s.xs[0]!);
    x1 = Math.max(x1, s.xs[s.xs.length - 1]!);
    for (let i = 0; i < s.ys.length; i++) {
      const y = s.ys[i]!;
      if (!Number.isFinite(y)) continue; // missing values
      if (y < y0) y0 = y;
      if (y > y1) y1 = y;
    }
  }
  return Number.isFinite(x0) && Number.isFinite(y0) ? { x0, x1, y0, y1 } : null;
}
