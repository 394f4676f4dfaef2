import { describe, expect, it } from 'vitest';
import { latinSquareRow, williamsSquare } from '../../../../app/core/study/counterbalance';

/**
 * Williams, E. J. (1949), "Experimental designs balanced for the estimation of residual
 * effects of treatments", Australian Journal of Scientific Research A 2:149–168. The defining
 * properties are checked for n = 2..12 over one full cycle of participants (enrolments 1..rows).
 */
const cycle = (n: number): number[][] => {
  const rows = n % 2 === 0 ? n : 2 * n;
  return Array.from({ length: rows }, (_, k) => latinSquareRow(n, k + 1).order);
};

/** How often clip a directly precedes clip b, over all rows. */
function precedes(rows: number[][], n: number): number[][] {
  const counts = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (const row of rows) for (let k = 0; k + 1 < row.length; k++) counts[row[k]][row[k + 1]]++;
  return counts;
}

describe('williamsSquare', () => {
  it('gives the 4-treatment square A B D C / B C A D / C D B A / D A C B (value from memory of the balanced design)', () => {
    expect(williamsSquare(4)).toEqual([
      [0, 1, 3, 2],
      [1, 2, 0, 3],
      [2, 3, 1, 0],
      [3, 0, 2, 1],
    ]);
  });

  it('has n rows for even n and 2n rows (square then mirror) for odd n', () => {
    expect(williamsSquare(3)).toEqual([
      [0, 1, 2],
      [1, 2, 0],
      [2, 0, 1],
      [2, 1, 0],
      [0, 2, 1],
      [1, 0, 2],
    ]);
    for (let n = 2; n <= 12; n++) expect(williamsSquare(n)).toHaveLength(n % 2 === 0 ? n : 2 * n);
    expect(williamsSquare(1)).toEqual([[0]]);
  });

  for (let n = 2; n <= 12; n++) {
    it(`n = ${n}: every order is a permutation and each clip is equally often in each position over a cycle`, () => {
      const rows = cycle(n);
      for (const row of rows) expect([...row].sort((a, b) => a - b)).toEqual([...Array(n).keys()]);
      const perPosition = rows.length / n;
      for (let position = 0; position < n; position++) {
        const counts = new Array<number>(n).fill(0);
        for (const row of rows) counts[row[position]]++;
        expect(counts).toEqual(new Array(n).fill(perPosition));
      }
    });

    it(`n = ${n}: each clip directly precedes every other clip ${n % 2 === 0 ? 'exactly once' : 'exactly twice (odd n, 2n rows)'}`, () => {
      const counts = precedes(cycle(n), n);
      const expected = n % 2 === 0 ? 1 : 2;
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) expect(counts[a][b], `${a} before ${b}`).toBe(a === b ? 0 : expected);
    });
  }

  it('refuses a size that is not a positive integer', () => {
    expect(() => williamsSquare(0)).toThrow(RangeError);
    expect(() => williamsSquare(2.5)).toThrow(/n must be a positive integer/);
  });
});

describe('latinSquareRow', () => {
  it('gives enrolment 1 the first row and repeats the rows in a cycle', () => {
    expect(latinSquareRow(4, 1)).toEqual({ row: 0, order: [0, 1, 3, 2] });
    expect(latinSquareRow(4, 4)).toEqual({ row: 3, order: [3, 0, 2, 1] });
    expect(latinSquareRow(4, 5)).toEqual(latinSquareRow(4, 1));
    expect(latinSquareRow(5, 10).row).toBe(9);
    expect(latinSquareRow(5, 11).row).toBe(0);
  });

  it('refuses an enrolment below 1 or not an integer', () => {
    expect(() => latinSquareRow(4, 0)).toThrow(/enrolment must be an integer from 1/);
    expect(() => latinSquareRow(4, 1.5)).toThrow(RangeError);
  });
});
