import { Xoshiro128 } from '../random/xoshiro128';

/**
 * Clip orders per participant.
 *
 * Balanced Latin square after Williams, E. J. (1949), "Experimental designs balanced for the
 * estimation of residual effects of treatments", Australian Journal of Scientific Research
 * A 2:149–168: the first row is 0, 1, n−1, 2, n−2, 3, …, and row r adds r (mod n) to it. Each
 * clip then takes each position once; for even n each clip directly precedes every other clip
 * exactly once. For odd n that is impossible with n rows, so the n mirrored rows follow
 * (2n rows), and each clip precedes every other exactly twice.
 */
export function williamsSquare(n: number): number[][] {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`n must be a positive integer, got ${n}`);
  const first = Array.from({ length: n }, (_, j) => (j % 2 === 1 ? (j + 1) / 2 : (n - j / 2) % n));
  const rows = Array.from({ length: n }, (_, r) => first.map((v) => (v + r) % n));
  // One clip has nothing to balance: a mirrored copy of its single row would add nothing.
  if (n % 2 === 0 || n === 1) return rows;
  return [...rows, ...rows.map((row) => [...row].reverse())];
}

/** The square's row for a participant: enrolment 1 takes row 0, and the rows repeat in a cycle. */
export function latinSquareRow(n: number, enrolment: number): { row: number; order: number[] } {
  if (!Number.isInteger(enrolment) || enrolment < 1) throw new RangeError(`enrolment must be an integer from 1, got ${enrolment}`);
  const square = williamsSquare(n);
  const row = (enrolment - 1) % square.length;
  return { row, order: square[row] };
}

/**
 * Shuffles `items` in place with the Fisher–Yates method as given by Durstenfeld, R. (1964),
 * "Algorithm 235: Random permutation", Communications of the ACM 7(7):420: for i from the
 * last index down to 1, swap item i with item j, j uniform in 0..i (xoshiro128** nextInt).
 */
export function shuffleInPlace<T>(items: T[], random: Xoshiro128): T[] {
  for (let i = items.length - 1; i > 0; i--) {
    const j = random.nextInt(i + 1);
    [items[i], items[j]] = [items[j], items[i]];
  }
  return items;
}

/** A shuffled copy of `items`: the same seed gives the same order on every machine. */
export function seededShuffle<T>(items: readonly T[], seed: number): T[] {
  return shuffleInPlace([...items], new Xoshiro128(seed));
}
