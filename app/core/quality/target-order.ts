import { seededShuffle } from '../study/counterbalance';

/**
 * A random order of `count` targets (their indices), reproducible from the seed: the same
 * seeded Fisher–Yates shuffle (Durstenfeld 1964, xoshiro128**) that orders clips.
 */
export function targetOrder(count: number, seed: number): number[] {
  if (!(Number.isInteger(count) && count >= 0)) throw new RangeError(`count must be an integer >= 0, got ${count}`);
  return seededShuffle(Array.from({ length: count }, (_, i) => i), seed);
}
