import { describe, expect, it } from 'vitest';
import { batchFrom, concatBatches, sliceBatch, type EventBatch } from '../../../../app/core/events/event-batch';
import { trimToTimeRange } from '../../../../app/core/events/ops';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const rows = (b: EventBatch) => Array.from(b.t, (t, i) => [t, b.x[i], b.y[i], b.p[i]]);

/** A person walking down the aisle: a few events per timestamp, many repeated timestamps. */
function walkerStream(seed: number, events: number): EventBatch {
  const g = new Xoshiro128(seed);
  let t = 5_000;
  return batchFrom(Array.from({ length: events }, (_, i) => {
    t += g.nextInt(4) === 0 ? g.nextInt(30) : 0;
    return [t, (i >> 3) % 64, 20 + g.nextInt(8), g.nextInt(2)] as const;
  }));
}

describe('trimToTimeRange: [fromUs, toUs), absolute times kept (common practice, no source)', () => {
  const b = batchFrom([[0, 1, 1, 1], [10, 2, 1, 0], [10, 3, 1, 1], [20, 4, 1, 0], [30, 5, 1, 1]]);

  it('keeps the start and drops the end', () => {
    expect(rows(trimToTimeRange(b, 10, 30))).toEqual([[10, 2, 1, 0], [10, 3, 1, 1], [20, 4, 1, 0]]);
    expect(rows(trimToTimeRange(b, 11, 30.5))).toEqual([[20, 4, 1, 0], [30, 5, 1, 1]]);
  });

  it('treats infinite ends as open and an empty range as no events', () => {
    expect(rows(trimToTimeRange(b, -Infinity, 10))).toEqual([[0, 1, 1, 1]]);
    expect(rows(trimToTimeRange(b, 20, Infinity))).toEqual([[20, 4, 1, 0], [30, 5, 1, 1]]);
    expect(trimToTimeRange(b, 10, 10).t.length).toBe(0);
    expect(trimToTimeRange(b, 31, 99).t.length).toBe(0);
  });

  it('refuses NaN and a range that ends before it starts', () => {
    expect(() => trimToTimeRange(b, Number.NaN, 10)).toThrow(/fromUs/);
    expect(() => trimToTimeRange(b, 0, Number.NaN)).toThrow(/toUs/);
    expect(() => trimToTimeRange(b, 20, 10)).toThrow(/toUs \(10\) must not be earlier than fromUs \(20\)/);
  });
});

describe('trimToTimeRange invariants (common practice, no source)', () => {
  const stream = walkerStream(3, 4000);
  const g = new Xoshiro128(9);
  const someTime = () => 4_990 + g.nextInt(stream.t[stream.t.length - 1]! - 4_970);
  const ranges = Array.from({ length: 50 }, () => [someTime(), someTime()].sort((a, b) => a - b) as [number, number]);

  it('trimming twice equals trimming once to the intersection', () => {
    for (let i = 1; i < ranges.length; i++) {
      const [a1, b1] = ranges[i - 1]!;
      const [a2, b2] = ranges[i]!;
      const twice = trimToTimeRange(trimToTimeRange(stream, a1, b1), a2, b2);
      const from = Math.max(a1, a2);
      const to = Math.min(b1, b2);
      expect(rows(twice)).toEqual(to >= from ? rows(trimToTimeRange(stream, from, to)) : []);
    }
  });

  it('keeps exactly the events with fromUs <= t < toUs, and adjacent ranges split without loss', () => {
    for (const [from, to] of ranges) {
      const kept = trimToTimeRange(stream, from, to);
      expect(kept.t.length).toBe(stream.t.filter((t) => t >= from && t < to).length);
      expect(kept.t.length + trimToTimeRange(stream, to, Infinity).t.length + trimToTimeRange(stream, -Infinity, from).t.length).toBe(stream.t.length);
    }
  });

  it('gives the same events batch by batch as on the whole stream', () => {
    const cuts = [0, 17, 17, 900, 2501, 3999, 4000];
    const batches = cuts.slice(1).map((end, i) => sliceBatch(stream, cuts[i]!, end));
    for (const [from, to] of ranges.slice(0, 10)) {
      expect(rows(concatBatches(batches.map((b) => trimToTimeRange(b, from, to))))).toEqual(rows(trimToTimeRange(stream, from, to)));
    }
  });
});
