import { describe, expect, it } from 'vitest';
import { batchFrom, concatBatches, sliceBatch, type EventBatch } from '../../../../app/core/events/event-batch';
import { BackgroundActivityFilter, DEFAULT_BACKGROUND_ACTIVITY_DT_US } from '../../../../app/core/events/ops';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

// Delbruck (2008), "Frame-free dynamic digital vision", Proc. Intl. Symp. on Secure-Life
// Electronics: an event passes only if an 8-neighbour (not the pixel itself) fired within dt
// before it; every event updates its own pixel's timestamp.

const rows = (b: EventBatch) => Array.from(b.t, (t, i) => [t, b.x[i], b.y[i], b.p[i]]);
const sensor = { width: 10, height: 8 };
const filtered = (events: ReadonlyArray<readonly [number, number, number, number]>, dtUs = 1000) =>
  rows(new BackgroundActivityFilter(sensor, { dtUs }).push(batchFrom(events)));

/** The definition, event by event, searching the whole past (quadratic; for checking only). */
function referenceFilter(b: EventBatch, dtUs: number): number[][] {
  const out: number[][] = [];
  for (let i = 0; i < b.t.length; i++) {
    const latest = new Map<string, number>();
    for (let j = 0; j < i; j++) latest.set(`${b.x[j]},${b.y[j]}`, b.t[j]!);
    let supported = false;
    for (let dy = -1; dy <= 1; dy++) {
      for (let dx = -1; dx <= 1; dx++) {
        const last = latest.get(`${b.x[i]! + dx},${b.y[i]! + dy}`);
        if ((dx !== 0 || dy !== 0) && last !== undefined && b.t[i]! - last <= dtUs) supported = true;
      }
    }
    if (supported) out.push([b.t[i]!, b.x[i]!, b.y[i]!, b.p[i]!]);
  }
  return out;
}

/** A forklift edge sweeping across the aisle through sparse background noise. */
function forkliftStream(seed: number, events: number): EventBatch {
  const g = new Xoshiro128(seed);
  let t = 0;
  return batchFrom(Array.from({ length: events }, () => {
    t += g.nextInt(40);
    const edge = g.nextInt(3) > 0;
    const x = edge ? Math.min(9, Math.floor(t / 2000) % 10 + g.nextInt(2)) : g.nextInt(10);
    return [t, x, g.nextInt(8), g.nextInt(2)] as const;
  }));
}

describe('BackgroundActivityFilter worked cases (Delbruck 2008)', () => {
  it('drops an isolated event', () => {
    expect(filtered([[100, 5, 5, 1]])).toEqual([]);
    expect(filtered([[100, 5, 5, 1], [150, 8, 1, 1]])).toEqual([]);
  });

  it('keeps an event whose neighbour fired 1 µs earlier, for each of the 8 neighbours', () => {
    for (const [dx, dy] of [[-1, -1], [0, -1], [1, -1], [-1, 0], [1, 0], [-1, 1], [0, 1], [1, 1]] as const) {
      expect(filtered([[100, 5 + dx, 4 + dy, 0], [101, 5, 4, 1]])).toEqual([[101, 5, 4, 1]]);
    }
  });

  it('does not count a neighbour that fired longer than dt ago; exactly dt still counts (our inclusive choice)', () => {
    expect(filtered([[100, 4, 4, 0], [1101, 5, 4, 1]], 1000)).toEqual([]);
    expect(filtered([[100, 4, 4, 0], [1100, 5, 4, 1]], 1000)).toEqual([[1100, 5, 4, 1]]);
  });

  it('does not count the pixel itself, nor a pixel two away', () => {
    expect(filtered([[100, 5, 4, 0], [101, 5, 4, 1]])).toEqual([]);
    expect(filtered([[100, 7, 4, 0], [101, 5, 4, 1], [102, 5, 6, 1]])).toEqual([]);
  });

  it('counts a neighbour at the same timestamp earlier in the stream, and lets dropped events support others', () => {
    // The first event is dropped (isolated) yet still supports the second.
    expect(filtered([[100, 5, 4, 0], [100, 6, 4, 1]])).toEqual([[100, 6, 4, 1]]);
    expect(filtered([[100, 5, 4, 0], [300, 6, 5, 1], [500, 7, 6, 0]])).toEqual([[300, 6, 5, 1], [500, 7, 6, 0]]);
  });

  it('handles the sensor borders without wrapping to the next row', () => {
    expect(filtered([[100, 9, 0, 0], [101, 0, 1, 1]])).toEqual([]); // (9,0) and (0,1) are far apart
    expect(filtered([[100, 1, 1, 0], [101, 0, 0, 1], [102, 9, 7, 1], [103, 8, 6, 0]])).toEqual([[101, 0, 0, 1], [103, 8, 6, 0]]);
  });
});

describe('BackgroundActivityFilter invariants (common practice, no source)', () => {
  it('matches the definition applied event by event', () => {
    const b = forkliftStream(4, 2500);
    for (const dtUs of [1, 50, 200, 1000]) {
      expect(rows(new BackgroundActivityFilter(sensor, { dtUs }).push(b))).toEqual(referenceFilter(b, dtUs));
    }
  });

  it('gives the same events for a stream in split batches as in one, and starts afresh after reset', () => {
    const b = forkliftStream(6, 8000);
    const whole = rows(new BackgroundActivityFilter(sensor, { dtUs: 150 }).push(b));
    const filter = new BackgroundActivityFilter(sensor, { dtUs: 150 });
    const cuts = [0, 1, 1, 333, 4000, 7999, 8000];
    const split = concatBatches(cuts.slice(1).map((end, i) => filter.push(sliceBatch(b, cuts[i]!, end))));
    expect(rows(split)).toEqual(whole);
    filter.reset();
    expect(rows(filter.push(b))).toEqual(whole);
  });

  it('defaults to 10 ms and refuses a window that is not a positive number of µs', () => {
    expect(new BackgroundActivityFilter(sensor).dtUs).toBe(DEFAULT_BACKGROUND_ACTIVITY_DT_US);
    expect(DEFAULT_BACKGROUND_ACTIVITY_DT_US).toBe(10_000);
    for (const dtUs of [0, -5, Number.NaN, Infinity]) expect(() => new BackgroundActivityFilter(sensor, { dtUs })).toThrow(/dtUs/);
    expect(() => new BackgroundActivityFilter(sensor).push(batchFrom([[1, 10, 0, 1]]))).toThrow(/outside the 10x8 sensor/);
  });
});
