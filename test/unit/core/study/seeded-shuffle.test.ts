import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { seededShuffle } from '../../../../app/core/study/counterbalance';

/**
 * Fisher–Yates as given by Durstenfeld, R. (1964), "Algorithm 235: Random permutation",
 * Communications of the ACM 7(7):420, driven by xoshiro128** (Blackman and Vigna 2018).
 * reference/shuffle-reference.py is an independent Python implementation of the same published
 * algorithms; its output is kept in reference/shuffle-reference.json for machines without Python.
 */
const script = join(__dirname, 'reference/shuffle-reference.py');
interface Reference {
  shuffles: { n: number; seed: number; order: number[] }[];
  chi2_upper_0_001?: Record<string, number>;
}
const fixture = JSON.parse(readFileSync(join(__dirname, 'reference/shuffle-reference.json'), 'utf8')) as Reference;

let live: Reference | null | undefined;
function liveReference(): Reference | null {
  if (live !== undefined) return live;
  try {
    live = JSON.parse(execFileSync('/usr/bin/python3', [script], { encoding: 'utf8' })) as Reference;
  } catch {
    live = null;
  }
  return live;
}

/**
 * Upper 0.1 % points of the chi-square distribution: NIST/SEMATECH e-Handbook of Statistical
 * Methods, section 1.3.6.7.4 "Critical values of the chi-square distribution" (7 df: 24.322,
 * 23 df: 49.728; table values from memory), confirmed against scipy.stats.chi2.ppf(0.999, df).
 */
const CHI2_999 = { 7: 24.322, 23: 49.728 } as const;

const chiSquare = (counts: number[], expected: number): number => counts.reduce((sum, c) => sum + (c - expected) ** 2 / expected, 0);

describe('seededShuffle', () => {
  it('matches the independent Python implementation (fixture, and live when Python is present)', () => {
    const reference = liveReference();
    if (reference) expect(reference.shuffles).toEqual(fixture.shuffles);
    expect(fixture.shuffles.length).toBeGreaterThan(20);
    for (const { n, seed, order } of fixture.shuffles) expect(seededShuffle([...Array(n).keys()], seed), `n ${n} seed ${seed}`).toEqual(order);
  });

  it('uses the cited chi-square critical values (scipy agrees)', () => {
    const fromScipy = liveReference()?.chi2_upper_0_001 ?? fixture.chi2_upper_0_001;
    expect(fromScipy).toBeDefined();
    for (const [df, value] of Object.entries(CHI2_999)) expect(fromScipy![df]).toBeCloseTo(value, 2);
  });

  it('returns a reordered copy, the same for the same seed, and leaves its input alone', () => {
    const clips = ['forklift-crossing', 'conveyor-parcels', 'warning-beacon', 'person-walking', 'aisle-empty'];
    const copy = [...clips];
    const a = seededShuffle(clips, 20261202);
    expect(clips).toEqual(copy);
    expect([...a].sort()).toEqual([...clips].sort());
    expect(seededShuffle(clips, 20261202)).toEqual(a);
    const thirty = [...Array(30).keys()];
    expect(seededShuffle(thirty, 1)).not.toEqual(seededShuffle(thirty, 2));
    expect(seededShuffle([], 1)).toEqual([]);
    expect(() => seededShuffle(clips, 0.5)).toThrow(RangeError);
  });

  it('gives each of the 24 orders of 4 clips equally often over seeds 0..23999 (chi-square, 23 df, alpha 0.001)', () => {
    const counts = new Map<string, number>();
    const draws = 24_000;
    for (let seed = 0; seed < draws; seed++) {
      const key = seededShuffle([0, 1, 2, 3], seed).join('');
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
    expect(counts.size).toBe(24);
    expect(chiSquare([...counts.values()], draws / 24)).toBeLessThan(CHI2_999[23]);
  });

  it('puts the first and the last of 8 clips equally often in each position (chi-square, 7 df, alpha 0.001)', () => {
    const draws = 16_000;
    const firstAt = new Array<number>(8).fill(0);
    const lastAt = new Array<number>(8).fill(0);
    for (let seed = 0; seed < draws; seed++) {
      const order = seededShuffle([0, 1, 2, 3, 4, 5, 6, 7], seed);
      firstAt[order.indexOf(0)]++;
      lastAt[order.indexOf(7)]++;
    }
    expect(chiSquare(firstAt, draws / 8)).toBeLessThan(CHI2_999[7]);
    expect(chiSquare(lastAt, draws / 8)).toBeLessThan(CHI2_999[7]);
  });
});
