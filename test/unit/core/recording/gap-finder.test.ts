import { describe, expect, it } from 'vitest';
import { GapFinder, mergeGaps } from '../../../../app/core/recording/gap-finder';

// Gap rules as documented in gap-finder.ts (common practice, no source): 3 or more samples
// in a row missing, counted by sequence number when both samples carry one, else estimated
// from tracker time.
const RATE = 500; // 2 ms

function feed(finder: GapFinder, samples: [number | null, number][]) {
  for (const [seq, t] of samples) finder.sample(seq, t);
}

const grid = (from: number, to: number, withSeq = true): [number | null, number][] => Array.from({ length: to - from }, (_, k) => [withSeq ? from + k : null, 10 + (from + k) / RATE]);

describe('GapFinder', () => {
  it('finds no gap in a regular grid, nor for up to 2 samples missing', () => {
    const f = new GapFinder(RATE);
    feed(f, [...grid(0, 100), ...grid(102, 200), ...grid(202, 300)]);
    expect(f.finish()).toEqual([]);
  });

  it('reports 3 or more missing samples as a gap from the sample before to the sample after', () => {
    const f = new GapFinder(RATE);
    feed(f, [...grid(0, 100), ...grid(103, 200)]);
    expect(f.finish()).toEqual([{ start: 10 + 99 / RATE, end: 10 + 103 / RATE }]);
  });

  it('estimates from tracker time when the samples carry no sequence numbers, robust to jitter', () => {
    const f = new GapFinder(RATE);
    feed(f, [...grid(0, 50, false), ...grid(52, 60, false), ...grid(63, 70, false)]);
    expect(f.finish()).toEqual([{ start: 10 + 59 / RATE, end: 10 + 63 / RATE }]);
    // Two missing with 0.4 interval of timestamp jitter: still not a gap; three missing with -0.4: a gap.
    const g = new GapFinder(RATE);
    feed(g, [[null, 10], [null, 10 + 3.4 / RATE], [null, 10 + 6.4 / RATE], [null, 10 + 10 / RATE]]);
    expect(g.finish()).toEqual([{ start: 10 + 6.4 / RATE, end: 10 + 10 / RATE }]);
  });

  it('trusts sequence numbers over timestamps when both samples carry one', () => {
    const g = new GapFinder(RATE);
    feed(g, [[0, 10], [1, 10.002], [2, 10.5], [3, 10.502], [7, 10.504]]);
    expect(g.finish()).toEqual([{ start: 10.502, end: 10.504 }]);
  });

  it('takes the median interval of the first samples when no hello gave a rate', () => {
    const f = new GapFinder(null);
    feed(f, [...grid(0, 600), ...grid(610, 1500)]);
    expect(f.finish()).toEqual([{ start: 10 + 599 / RATE, end: 10 + 610 / RATE }]);
    const short = new GapFinder(null);
    feed(short, [...grid(0, 10), ...grid(20, 30)]);
    expect(short.finish()).toEqual([{ start: 10 + 9 / RATE, end: 10 + 20 / RATE }]);
  });

  it('merges a reported disconnection with the jump it caused; keeps a gap open at the end', () => {
    const f = new GapFinder(RATE);
    feed(f, grid(0, 100));
    f.gapStart(10 + 99 / RATE);
    feed(f, grid(150, 200));
    f.gapEnd(10 + 150 / RATE);
    f.gapStart(10 + 199 / RATE);
    expect(f.finish()).toEqual([
      { start: 10 + 99 / RATE, end: 10 + 150 / RATE },
      { start: 10 + 199 / RATE, end: null },
    ]);
  });

  it('refuses a rate that is not positive', () => {
    expect(() => new GapFinder(0)).toThrow(/nominalRateHz must be positive/);
  });
});

describe('mergeGaps', () => {
  it('merges overlapping and touching gaps, with open ends', () => {
    expect(mergeGaps([{ start: 5, end: 6 }, { start: 1, end: 3 }, { start: 2, end: 4 }, { start: 4, end: 4.5 }, { start: null, end: 0 }, { start: 7, end: null }, { start: 8, end: 9 }])).toEqual([
      { start: null, end: 0 },
      { start: 1, end: 4.5 },
      { start: 5, end: 6 },
      { start: 7, end: null },
    ]);
  });
});
