import { describe, expect, it } from 'vitest';
import { allocateBatch, batchFrom, concatBatches, type EventBatch, type SensorSize, type TimeResolution } from '../../../../app/core/events/event-batch';
import { bytesSource, decodeGlev, encodeGlev, GlevWriter, openGlev } from '../../../../app/core/events/glev';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

// Round trips are checked bit for bit: each column's bytes, so that -0, NaN payloads or
// a last-digit difference in a float64 time would all fail.
const bytesOf = (a: ArrayBufferView) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);
function expectSameEvents(actual: EventBatch, expected: EventBatch): void {
  expect(actual.t.length).toBe(expected.t.length);
  expect(bytesOf(actual.t).equals(bytesOf(expected.t)), 't').toBe(true);
  expect(bytesOf(actual.x).equals(bytesOf(expected.x)), 'x').toBe(true);
  expect(bytesOf(actual.y).equals(bytesOf(expected.y)), 'y').toBe(true);
  expect(bytesOf(actual.p).equals(bytesOf(expected.p)), 'p').toBe(true);
}

/** Time-ordered random events; steps of 0 make runs of equal timestamps. */
function randomStream(seed: number, n: number, sensor: SensorSize, resolution: TimeResolution, maxStepTicks = 4): EventBatch {
  const g = new Xoshiro128(seed);
  const out = allocateBatch(n);
  let tick = g.nextInt(1_000_000);
  for (let i = 0; i < n; i++) {
    tick += g.nextInt(maxStepTicks + 1);
    out.t[i] = resolution === 'ns' ? tick / 1000 : tick;
    out.x[i] = g.nextInt(sensor.width);
    out.y[i] = g.nextInt(sensor.height);
    out.p[i] = g.nextInt(2);
  }
  return out;
}

async function expectAllReadersAgree(file: Uint8Array, expected: EventBatch): Promise<void> {
  expectSameEvents(decodeGlev(file, 'clip.glev'), expected);
  expectSameEvents(decodeGlev(file, 'clip.glev', { verifyChecksums: false }), expected);
  const reader = await openGlev(bytesSource(file), 'clip.glev');
  expect(reader.eventCount).toBe(expected.t.length);
  expectSameEvents(await reader.readRange(-Infinity, Infinity), expected);
  const chunks = await Promise.all(reader.chunks.map((_, k) => reader.readChunk(k)));
  expectSameEvents(chunks.length ? concatBatches(chunks) : allocateBatch(0), expected);
}

const vga = { width: 640, height: 480 };

describe('.glev round trips', () => {
  it.each([
    [1, 10_000, 'us', 65536],
    [2, 200_000, 'us', 65536],
    [3, 5_000, 'us', 7],
    [4, 50_000, 'ns', 4096],
    [5, 3_001, 'ns', 999],
  ] as const)('seed %i: %i random events (%s, %i per chunk) come back bit-exact', async (seed, n, resolution, chunkEvents) => {
    const events = randomStream(seed, n, vga, resolution);
    const file = encodeGlev(events, { sensor: vga, resolution, chunkEvents });
    await expectAllReadersAgree(file, events);
  });

  it('stores 8 bytes per event plus 16 per chunk, 28 per index entry and a 52-byte frame', () => {
    const events = randomStream(6, 65536 * 3 + 5, vga, 'us');
    const file = encodeGlev(events, { sensor: vga, resolution: 'us' });
    expect(file.length).toBe(48 + 8 * events.t.length + 4 * 16 + 4 * 28 + 4);
  });

  it('starts with the signature, version 1 and the sensor, resolution and counts', () => {
    const file = encodeGlev(randomStream(7, 70_000, vga, 'ns'), { sensor: vga, resolution: 'ns' });
    const view = new DataView(file.buffer);
    expect(Array.from(file.subarray(0, 8))).toEqual([0xe5, 0x47, 0x4c, 0x45, 0x56, 0x0d, 0x0a, 0x0a]);
    expect([view.getUint16(8, true), view.getUint16(10, true)]).toEqual([1, 48]);
    expect([view.getUint32(12, true), view.getUint32(16, true), view.getUint32(20, true)]).toEqual([640, 480, 1e9]);
    expect([Number(view.getBigUint64(24, true)), view.getUint32(40, true)]).toEqual([70_000, 2]);
    expect(Number(view.getBigUint64(32, true))).toBe(48 + 8 * 70_000 + 2 * 16);
  });

  it('handles an empty stream', async () => {
    const file = encodeGlev(allocateBatch(0), { sensor: vga, resolution: 'us' });
    expect(file.length).toBe(52);
    await expectAllReadersAgree(file, allocateBatch(0));
    const reader = await openGlev(bytesSource(file), 'empty.glev');
    expect([reader.chunkCount, reader.tStartUs, reader.tEndUs]).toEqual([0, NaN, NaN]);
    expect(await reader.seek(0)).toEqual({ chunk: 0, index: 0, event: 0 });
  });

  it('handles one event, and many events at one timestamp', async () => {
    const one = batchFrom([[123, 5, 6, 1]]);
    await expectAllReadersAgree(encodeGlev(one, { sensor: vga, resolution: 'us' }), one);
    const same = randomStream(8, 100_000, vga, 'us', 0);
    expect(same.t[0]).toBe(same.t[99_999]);
    const file = encodeGlev(same, { sensor: vga, resolution: 'us' });
    await expectAllReadersAgree(file, same);
    expect((await openGlev(bytesSource(file), 'same.glev')).chunkCount).toBe(2);
  });

  it('starts a new chunk where a gap exceeds 2^32 - 1 ticks', async () => {
    for (const resolution of ['us', 'ns'] as const) {
      const scale = resolution === 'ns' ? 1000 : 1;
      const events = batchFrom([
        [10 / scale, 1, 1, 0],
        [(10 + 2 ** 32 - 1) / scale, 2, 2, 1], // the largest dt: same chunk
        [(10 + 2 ** 32) / scale, 3, 3, 0], // one tick more than dt holds: a new chunk
        [(10 + 2 ** 32 + 2 ** 40) / scale, 4, 4, 1], // far beyond
      ]);
      const file = encodeGlev(events, { sensor: vga, resolution });
      await expectAllReadersAgree(file, events);
      expect((await openGlev(bytesSource(file), 'gap.glev')).chunks.map((c) => c.count)).toEqual([2, 1, 1]);
    }
  });

  it('keeps the largest coordinates: x = 65535 and y = 32767', async () => {
    const sensor = { width: 65536, height: 32768 };
    const events = batchFrom([
      [0, 65535, 32767, 1],
      [1, 0, 0, 0],
      [2, 65535, 0, 1],
      [3, 0, 32767, 0],
    ]);
    await expectAllReadersAgree(encodeGlev(events, { sensor, resolution: 'us' }), events);
  });

  it('keeps nanosecond times exactly, fractional microseconds included, up to 2^52 ns', async () => {
    // 4417800003641363 ns: tUs * 1000 rounds to the next tick, so the writer must look beside it.
    const ticks = [0, 1, 999, 1001, 123_456_789, 4_417_800_003_641_363, 2 ** 52];
    const events = batchFrom(ticks.map((tick, i) => [tick / 1000, i, i, i % 2]));
    await expectAllReadersAgree(encodeGlev(events, { sensor: vga, resolution: 'ns' }), events);
  });

  it('fills a chunk with exactly 65536 events and starts another at 65537', async () => {
    for (const [n, counts] of [
      [65536, [65536]],
      [65537, [65536, 1]],
    ] as const) {
      const events = randomStream(9, n, vga, 'us');
      const file = encodeGlev(events, { sensor: vga, resolution: 'us' });
      await expectAllReadersAgree(file, events);
      expect((await openGlev(bytesSource(file), 'full.glev')).chunks.map((c) => c.count)).toEqual(counts);
    }
  });

  it('writes the same bytes however the stream is split into batches', () => {
    const events = randomStream(10, 20_000, vga, 'ns');
    const whole = encodeGlev(events, { sensor: vga, resolution: 'ns', chunkEvents: 3000 });
    const parts: Uint8Array[] = [];
    const writer = new GlevWriter({ sensor: vga, resolution: 'ns', chunkEvents: 3000 }, (b) => parts.push(b));
    const g = new Xoshiro128(11);
    for (let i = 0; i < 20_000; ) {
      const end = Math.min(20_000, i + g.nextInt(2500));
      writer.push({ t: events.t.subarray(i, end), x: events.x.subarray(i, end), y: events.y.subarray(i, end), p: events.p.subarray(i, end) });
      i = end;
    }
    parts[0] = writer.finish();
    expect(Buffer.concat(parts).equals(Buffer.from(whole))).toBe(true);
  });

  it('is lossless from file to batch to file', () => {
    const file = encodeGlev(randomStream(12, 30_000, vga, 'ns', 5_000_000), { sensor: vga, resolution: 'ns', chunkEvents: 1000 });
    const again = encodeGlev(decodeGlev(file, 'a.glev'), { sensor: vga, resolution: 'ns', chunkEvents: 1000 });
    expect(Buffer.from(again).equals(Buffer.from(file))).toBe(true);
  });

  it('decodes a file that sits at an odd offset in memory', async () => {
    const events = randomStream(13, 10_000, vga, 'us');
    const file = encodeGlev(events, { sensor: vga, resolution: 'us', chunkEvents: 999 });
    const carrier = new Uint8Array(file.length + 3);
    carrier.set(file, 3);
    await expectAllReadersAgree(carrier.subarray(3), events);
  });
});
