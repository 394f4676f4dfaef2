import { describe, expect, it } from 'vitest';
import { allocateBatch, type EventBatch, type TimeResolution } from '../../../../app/core/events/event-batch';
import { bytesSource, encodeGlev, openGlev, type GlevReader } from '../../../../app/core/events/glev';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const sensor = { width: 320, height: 240 };

/** Bursts and pauses, many equal timestamps, some shared across chunk boundaries. */
function burstyStream(seed: number, n: number, resolution: TimeResolution): EventBatch {
  const g = new Xoshiro128(seed);
  const out = allocateBatch(n);
  let tick = 5_000;
  for (let i = 0; i < n; i++) {
    const r = g.next();
    tick += r < 0.4 ? 0 : r < 0.97 ? 1 + g.nextInt(20) : 10_000 + g.nextInt(100_000);
    out.t[i] = resolution === 'ns' ? tick / 1000 : tick;
    out.x[i] = g.nextInt(sensor.width);
    out.y[i] = g.nextInt(sensor.height);
    out.p[i] = g.nextInt(2);
  }
  return out;
}

/** The reference: the first event at or after tUs, by looking at every event. */
function linearSeek(t: Float64Array, tUs: number): number {
  for (let i = 0; i < t.length; i++) if (t[i]! >= tUs) return i;
  return t.length;
}

/** Times worth probing: random ones, every kind of boundary, and outside the stream. */
function probeTimes(events: EventBatch, reader: GlevReader, g: Xoshiro128): number[] {
  const { tStartUs, tEndUs } = reader;
  const times = [-Infinity, -1, 0, tStartUs - 1, tStartUs, tEndUs, tEndUs + 0.0005, tEndUs + 1, Infinity];
  for (const c of reader.chunks) times.push(c.tFirstUs, c.tLastUs, c.tFirstUs + 0.5, c.tLastUs + 0.5, c.tFirstUs - 0.001);
  for (let i = 0; i < 300; i++) times.push(events.t[g.nextInt(events.t.length)]!);
  for (let i = 0; i < 300; i++) times.push(tStartUs - 100 + g.next() * (tEndUs - tStartUs + 200));
  return times;
}

describe.each(['us', 'ns'] as const)('seeking in a %s file', (resolution) => {
  const events = burstyStream(resolution === 'us' ? 21 : 22, 6_000, resolution);
  const file = encodeGlev(events, { sensor, resolution, chunkEvents: 64 });

  it('finds the first event at or after any time, as a linear scan does', async () => {
    const reader = await openGlev(bytesSource(file), 'aisle.glev');
    expect(reader.chunkCount).toBe(Math.ceil(6_000 / 64));
    const g = new Xoshiro128(1);
    for (const tUs of probeTimes(events, reader, g)) {
      const expected = linearSeek(events.t, tUs);
      const position = await reader.seek(tUs);
      expect(position.event, `t = ${tUs}`).toBe(expected);
      if (expected === events.t.length) expect(position).toEqual({ chunk: reader.chunkCount, index: 0, event: expected });
      else expect(reader.chunks[position.chunk]!.firstEvent + position.index).toBe(expected);
    }
  });

  it('reads exactly the events with fromUs <= t < toUs', async () => {
    const reader = await openGlev(bytesSource(file), 'aisle.glev');
    const g = new Xoshiro128(2);
    const times = probeTimes(events, reader, g);
    for (let i = 0; i < 400; i++) {
      const fromUs = times[g.nextInt(times.length)]!;
      const toUs = times[g.nextInt(times.length)]!;
      const from = linearSeek(events.t, fromUs);
      const to = Math.max(from, linearSeek(events.t, toUs));
      const range = await reader.readRange(fromUs, toUs);
      expect(range.t.length, `[${fromUs}, ${toUs})`).toBe(to - from);
      expect(Array.from(range.t)).toEqual(Array.from(events.t.subarray(from, to)));
      expect(Array.from(range.x)).toEqual(Array.from(events.x.subarray(from, to)));
      expect(Array.from(range.y)).toEqual(Array.from(events.y.subarray(from, to)));
      expect(Array.from(range.p)).toEqual(Array.from(events.p.subarray(from, to)));
    }
  });

  it('describes each chunk by its first and last time and its place in the stream', async () => {
    const reader = await openGlev(bytesSource(file), 'aisle.glev');
    expect(reader.tStartUs).toBe(events.t[0]);
    expect(reader.tEndUs).toBe(events.t[5_999]);
    reader.chunks.forEach((c, k) => {
      expect(c.firstEvent).toBe(64 * k);
      expect([c.tFirstUs, c.tLastUs]).toEqual([events.t[c.firstEvent], events.t[c.firstEvent + c.count - 1]]);
      expect(c.byteOffset).toBe(48 + k * (16 + 8 * 64));
    });
    // The stream was made so that seeking meets timestamps shared across chunk boundaries.
    expect(reader.chunks.some((c, k) => k > 0 && c.tFirstUs === reader.chunks[k - 1]!.tLastUs)).toBe(true);
  });
});
