import { describe, expect, it } from 'vitest';
import { solveLeastSquares } from '../../../../../app/core/quality/correction';
import { Xoshiro128 } from '../../../../../app/core/random/xoshiro128';
import { hasNumpy, numpyReference, storedReference, type MatrixSet } from './reference';

const solve = (m: Pick<MatrixSet, 'a' | 'b'>) => solveLeastSquares(Float64Array.from(m.a.flat()), m.a.length, m.a[0]!.length, Float64Array.from(m.b));

function expectSame(got: ReturnType<typeof solve>, want: MatrixSet) {
  expect(got.rank, want.name).toBe(want.rank);
  if (want.rank < want.a[0]!.length) {
    // numpy returns the minimum-norm solution; Gazeloom refuses to pick one.
    expect([...got.x].every(Number.isNaN), want.name).toBe(true);
    return;
  }
  got.x.forEach((v, i) => expect(v, `${want.name} x[${i}]`).toBeCloseTo(want.x[i]!, 10));
  got.residuals.forEach((v, i) => expect(v, `${want.name} residual ${i}`).toBeCloseTo(want.residuals[i]!, 10));
}

describe('solveLeastSquares (Householder QR with column pivoting)', () => {
  it('solves the 3 x 3 system by hand: x = (1, -2, 3) (common practice, no source)', () => {
    const r = solveLeastSquares(Float64Array.of(4, -2, 1, -2, 4, -2, 1, -2, 4), 3, 3, Float64Array.of(11, -16, 17));
    expect([...r.x].map((v) => Number(v.toFixed(12)))).toEqual([1, -2, 3]);
    expect(r.rank).toBe(3);
  });

  it('matches numpy.linalg.lstsq on the stored sets (test/fixtures/quality/correction_reference.json)', () => {
    for (const m of storedReference().matrices) expectSame(solve(m), m);
  });

  it('leaves a residual orthogonal to every column (the normal equations Aᵀr = 0)', () => {
    const m = storedReference().matrices[0]!;
    const r = solve(m);
    for (let j = 0; j < m.a[0]!.length; j++) expect(m.a.reduce((s, row, i) => s + row[j]! * r.residuals[i]!, 0)).toBeCloseTo(0, 12);
  });

  it('reports the rank of a matrix with a dependent column and gives no solution', () => {
    const r = solve(storedReference().matrices[1]!);
    expect(r.rank).toBe(3);
    expect(Number.isNaN(r.x[0])).toBe(true);
    expect(solveLeastSquares(new Float64Array(6), 3, 2, Float64Array.of(1, 2, 3)).rank).toBe(0);
    // More unknowns than equations can never be determined.
    expect(solveLeastSquares(Float64Array.of(1, 2, 3, 4, 5, 7), 2, 3, Float64Array.of(1, 2)).rank).toBe(2);
  });

  it('does not modify its inputs', () => {
    const a = Float64Array.of(1, 0, 1, 1, 1, 2);
    const b = Float64Array.of(1, 2, 4);
    solveLeastSquares(a, 3, 2, b);
    expect([...a, ...b]).toEqual([1, 0, 1, 1, 1, 2, 1, 2, 4]);
  });

  it('throws a RangeError naming the bad parameter', () => {
    expect(() => solveLeastSquares(new Float64Array(5), 3, 2, new Float64Array(3))).toThrow(/a must hold rows × cols = 6/);
    expect(() => solveLeastSquares(new Float64Array(6), 3, 2, new Float64Array(2))).toThrow(/b must hold one value per row/);
    expect(() => solveLeastSquares(Float64Array.of(1, Number.NaN), 1, 2, new Float64Array(1))).toThrow(/a\[0\]\[1\] must be finite/);
    expect(() => solveLeastSquares(new Float64Array(0), 0, 2, new Float64Array(0))).toThrow(/rows must be/);
  });

  it.skipIf(!hasNumpy)('the stored fixture is what correction_reference.py prints today', () => {
    expect(numpyReference()).toEqual(storedReference());
  });

  it.skipIf(!hasNumpy)('matches numpy.linalg.lstsq run live on random tall systems', () => {
    const rng = new Xoshiro128(77);
    const matrices = [
      [20, 6],
      [7, 7],
      [50, 3],
    ].map(([rows, cols]) => ({ a: Array.from({ length: rows! }, () => Array.from({ length: cols! }, () => rng.nextGaussian() * 100)), b: Array.from({ length: rows! }, () => rng.nextGaussian()) }));
    const live = numpyReference({ maps: [], matrices });
    for (const m of live.matrices) {
      const got = solve(m);
      expect(got.rank).toBe(m.rank);
      got.x.forEach((v, i) => expect(Math.abs(v - m.x[i]!)).toBeLessThan(1e-9 * Math.max(1, Math.abs(m.x[i]!))));
    }
  });
});
