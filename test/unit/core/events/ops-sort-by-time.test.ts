import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { batchFrom, type EventBatch } from '../../../../app/core/events/event-batch';
import { sortByTime } from '../../../../app/core/events/ops';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const rows = (b: EventBatch) => Array.from(b.t, (t, i) => [t, b.x[i], b.y[i], b.p[i]]);

/**
 * The reference stable order: Array.prototype.sort, which must be stable since ECMAScript 2019
 * (ECMA-262, 10th edition, 22.1.3.27).
 */
function referenceSort(b: EventBatch): number[][] {
  return Array.from(b.t, (_, i) => i)
    .sort((i, j) => b.t[i]! - b.t[j]!)
    .map((i) => [b.t[i]!, b.x[i]!, b.y[i]!, b.p[i]!]);
}

/** numpy.argsort(kind='stable') (Debian python3-numpy), or null where python3-numpy is missing. */
function numpyStableOrder(t: Float64Array): number[] | null {
  try {
    const script = 'import json,sys,numpy as np; print(json.dumps(np.argsort(np.array(json.load(sys.stdin)), kind="stable").tolist()))';
    return JSON.parse(execFileSync('/usr/bin/python3', ['-c', script], { input: JSON.stringify(Array.from(t)), encoding: 'utf8' }));
  } catch {
    return null;
  }
}

/** Events from several camera links merged slightly out of order, with many equal timestamps; x records the input position. */
function jumbledStream(seed: number, events: number, times: (g: Xoshiro128, i: number) => number): EventBatch {
  const g = new Xoshiro128(seed);
  return batchFrom(Array.from({ length: events }, (_, i) => [times(g, i), i % 65536, (i >> 16) & 0xffff, g.nextInt(2)] as const));
}

describe('sortByTime (stable; common practice, no source)', () => {
  it('orders a hand-made batch and keeps file order among equal times', () => {
    const b = batchFrom([[30, 0, 0, 1], [10, 1, 0, 0], [20, 2, 0, 1], [10, 3, 0, 1], [30, 4, 0, 0], [10, 5, 0, 0]]);
    expect(rows(sortByTime(b))).toEqual([[10, 1, 0, 0], [10, 3, 0, 1], [10, 5, 0, 0], [20, 2, 0, 1], [30, 0, 0, 1], [30, 4, 0, 0]]);
    expect(rows(b)[0]).toEqual([30, 0, 0, 1]); // the input is untouched
  });

  it('handles negative, fractional and signed-zero times', () => {
    const b = batchFrom([[0.5, 0, 0, 0], [-0, 1, 0, 0], [-2.25, 2, 0, 0], [0, 3, 0, 0], [-0, 4, 0, 0], [-1e300, 5, 0, 0], [1e300, 6, 0, 0]]);
    expect(Array.from(sortByTime(b).x)).toEqual([5, 2, 1, 3, 4, 0, 6]);
  });

  it('copies an ordered batch and an empty one, and refuses NaN', () => {
    const ordered = batchFrom([[1, 0, 0, 0], [1, 1, 0, 1], [2, 2, 0, 0]]);
    const sorted = sortByTime(ordered);
    expect(rows(sorted)).toEqual(rows(ordered));
    expect(sorted.t).not.toBe(ordered.t);
    expect(sortByTime(batchFrom([])).t.length).toBe(0);
    expect(() => sortByTime(batchFrom([[2, 0, 0, 0], [Number.NaN, 0, 0, 0]]))).toThrow(/batch\.t\[1\] is NaN/);
  });

  it('matches the reference stable sort and numpy on jumbled streams', () => {
    const cases: Array<(g: Xoshiro128, i: number) => number> = [
      (g) => g.nextInt(50), // heavy ties
      (g, i) => 1_700_000_000_000_000 + i * 20 + g.nextInt(400), // epoch microseconds, locally out of order
      (g, i) => 1_700_000_000_000 + (i + g.nextInt(100)) * 0.001, // nanosecond source: fractional µs
      (g) => (g.next() - 0.5) * 1e9, // both signs
    ];
    cases.forEach((times, k) => {
      const b = jumbledStream(k, 20_000, times);
      const ours = sortByTime(b);
      expect(rows(ours)).toEqual(referenceSort(b));
      const order = numpyStableOrder(b.t);
      if (order !== null) expect(Array.from(ours.x, (x, i) => x + 65536 * ours.y[i]!)).toEqual(order);
    });
  });
});
