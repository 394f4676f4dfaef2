/** Columns whose remaining norm falls below this fraction of the largest count as dependent. */
export const RANK_TOLERANCE = 1e-10;

export interface LeastSquaresSolution {
  /** The minimiser of ‖A·x − b‖₂; every entry NaN when A has dependent columns (rank < cols). */
  readonly x: Float64Array;
  /** b − A·x per row (NaN when x is). */
  readonly residuals: Float64Array;
  /** The numerical rank of A: the number of columns that are independent at RANK_TOLERANCE. */
  readonly rank: number;
}

/**
 * Linear least squares by Householder QR with column pivoting (Golub and Van Loan 2013,
 * "Matrix Computations", 4th ed., §5.1.2 Householder vectors, Algorithm 5.4.1 QR with
 * column pivoting, §5.3.3 the least-squares solution from R·x = Qᵀb). Pivoting puts the
 * largest remaining column first at every step, so the diagonal of R falls and the rank
 * shows in it. `a` is rows × cols, row-major; neither `a` nor `b` is modified.
 */
export function solveLeastSquares(a: Float64Array, rows: number, cols: number, b: Float64Array): LeastSquaresSolution {
  if (!(Number.isInteger(rows) && rows > 0)) throw new RangeError(`rows must be an integer > 0, got ${rows}`);
  if (!(Number.isInteger(cols) && cols > 0)) throw new RangeError(`cols must be an integer > 0, got ${cols}`);
  if (a.length !== rows * cols) throw new RangeError(`a must hold rows × cols = ${rows * cols} values, got ${a.length}`);
  if (b.length !== rows) throw new RangeError(`b must hold one value per row (${rows}), got ${b.length}`);
  for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) throw new RangeError(`a[${Math.floor(i / cols)}][${i % cols}] must be finite, got ${a[i]}`);
  for (let i = 0; i < rows; i++) if (!Number.isFinite(b[i])) throw new RangeError(`b[${i}] must be finite, got ${b[i]}`);

  const r = Float64Array.from(a);
  const qtb = Float64Array.from(b);
  const perm = Array.from({ length: cols }, (_, j) => j);
  const at = (i: number, j: number) => i * cols + j;
  const steps = Math.min(rows, cols);
  let rank = 0;
  let largest = 0;
  for (let k = 0; k < steps; k++) {
    // Pivot: the column with the largest norm below row k.
    let pivot = k;
    let pivotNorm = -1;
    for (let j = k; j < cols; j++) {
      let s = 0;
      for (let i = k; i < rows; i++) s += r[at(i, j)]! ** 2;
      if (s > pivotNorm) [pivot, pivotNorm] = [j, s];
    }
    pivotNorm = Math.sqrt(pivotNorm);
    if (k === 0) largest = pivotNorm;
    if (!(pivotNorm > RANK_TOLERANCE * largest) || pivotNorm === 0) break;
    if (pivot !== k) {
      for (let i = 0; i < rows; i++) [r[at(i, k)], r[at(i, pivot)]] = [r[at(i, pivot)]!, r[at(i, k)]!];
      [perm[k], perm[pivot]] = [perm[pivot]!, perm[k]!];
    }
    // Householder reflection H = I − 2vvᵀ/vᵀv taking column k below the diagonal to (alpha, 0, …).
    const head = r[at(k, k)]!;
    const alpha = head >= 0 ? -pivotNorm : pivotNorm;
    const v = new Float64Array(rows - k);
    v[0] = head - alpha;
    for (let i = k + 1; i < rows; i++) v[i - k] = r[at(i, k)]!;
    let vv = 0;
    for (const e of v) vv += e * e;
    const reflect = (get: (i: number) => number, set: (i: number, value: number) => void) => {
      let dot = 0;
      for (let i = k; i < rows; i++) dot += v[i - k]! * get(i);
      const f = (2 * dot) / vv;
      for (let i = k; i < rows; i++) set(i, get(i) - f * v[i - k]!);
    };
    if (vv > 0) {
      for (let j = k; j < cols; j++) reflect((i) => r[at(i, j)]!, (i, value) => (r[at(i, j)] = value));
      reflect((i) => qtb[i]!, (i, value) => (qtb[i] = value));
    }
    rank++;
  }

  const x = new Float64Array(cols);
  const residuals = new Float64Array(rows);
  if (rank < cols) {
    x.fill(Number.NaN);
    residuals.fill(Number.NaN);
    return { x, residuals, rank };
  }
  // Back substitution R·z = (Qᵀb)[0..cols), then undo the column permutation.
  const z = new Float64Array(cols);
  for (let k = cols - 1; k >= 0; k--) {
    let s = qtb[k]!;
    for (let j = k + 1; j < cols; j++) s -= r[at(k, j)]! * z[j]!;
    z[k] = s / r[at(k, k)]!;
  }
  for (let k = 0; k < cols; k++) x[perm[k]!] = z[k]!;
  for (let i = 0; i < rows; i++) {
    let s = b[i]!;
    for (let j = 0; j < cols; j++) s -= a[at(i, j)]! * x[j]!;
    residuals[i] = s;
  }
  return { x, residuals, rank };
}
