import { crc32 } from '../../checksum/crc32';
import type { EventBatch } from '../event-batch';
import { EventFormatError } from '../event-format-error';
import type { ChunkEntry } from './chunk-index';
import type { GlevHeader } from './header';
import { CHUNK_HEAD_BYTES, chunkByteLength, readU64 } from './layout';
import { chunkAt, hex32 } from './messages';

/**
 * Decodes one chunk, given its stored bytes, into out[at, at + count). Checks the chunk
 * against its index entry (first timestamp, count, last timestamp), its CRC32 unless
 * `verifyCrc` is false, time order within the chunk and the sensor bounds, so that every
 * batch Gazeloom decodes is in time order and on the sensor even if the file is not.
 *
 * The columns are read through typed-array views in place (host byte order; every
 * platform Gazeloom runs on is little-endian), which needs the chunk 4-byte aligned in
 * memory: chunks are at multiples of 8 in the file, so only a misaligned carrier copies.
 */
export function decodeChunkInto(
  stored: Uint8Array,
  chunk: number,
  entry: ChunkEntry,
  header: GlevHeader,
  fileName: string,
  out: EventBatch,
  at: number,
  verifyCrc: boolean,
): void {
  const n = entry.count;
  const bytes = stored.byteOffset & 3 ? stored.slice() : stored;
  const view = new DataView(bytes.buffer, bytes.byteOffset, chunkByteLength(n));
  const fail = (offset: number, problem: string): EventFormatError => new EventFormatError(fileName, chunkAt(chunk, entry.byteOffset + offset), problem);

  const firstTick = readU64(view, 0);
  if (firstTick !== entry.firstTick) throw fail(0, `first timestamp ${firstTick} ticks differs from the index's ${entry.firstTick}`);
  const count = view.getUint32(8, true);
  if (count !== n) throw fail(8, `event count ${count} differs from the index's ${n}`);
  const crcAt = CHUNK_HEAD_BYTES + 8 * n;
  if (verifyCrc) {
    const storedCrc = view.getUint32(crcAt, true);
    const computedCrc = crc32(bytes.subarray(0, crcAt));
    if (storedCrc !== computedCrc) {
      throw fail(0, `CRC32 mismatch: stored ${hex32(storedCrc)} at byte ${entry.byteOffset + crcAt}, computed ${hex32(computedCrc)} over bytes ${entry.byteOffset}..${entry.byteOffset + crcAt - 1}; the chunk is damaged`);
    }
  }

  const columns = bytes.byteOffset + CHUNK_HEAD_BYTES;
  const dt = new Uint32Array(bytes.buffer, columns, n);
  const x = new Uint16Array(bytes.buffer, columns + 4 * n, n);
  const yp = new Uint16Array(bytes.buffer, columns + 6 * n, n);
  const dtAt = (i: number) => CHUNK_HEAD_BYTES + 4 * i;

  if (dt[0] !== 0) throw fail(dtAt(0), `the first event's dt is ${dt[0]}, expected 0 (the chunk's first timestamp is its first event's)`);
  const t = out.t.subarray(at, at + n);
  const disorder = header.resolution === 'ns' ? fillTimesNs(t, dt, firstTick) : fillTimesUs(t, dt, firstTick);
  if (disorder >= 0) throw fail(dtAt(disorder), `dt ${dt[disorder]} is smaller than the previous event's ${dt[disorder - 1]}; events must be in time order`);
  if (firstTick + dt[n - 1]! !== entry.lastTick) {
    throw fail(dtAt(n - 1), `the last event is at tick ${firstTick + dt[n - 1]!}, but the index says ${entry.lastTick}`);
  }

  out.x.set(x, at);
  const { width, height } = header.sensor;
  if (maxOf(x) >= width) {
    const i = x.findIndex((v) => v >= width);
    throw fail(CHUNK_HEAD_BYTES + 4 * n + 2 * i, `x = ${x[i]} is outside the sensor width ${width} (0..${width - 1})`);
  }
  if (splitRowsAndPolarities(yp, out.y.subarray(at, at + n), out.p.subarray(at, at + n)) >> 1 >= height) {
    const i = yp.findIndex((v) => v >> 1 >= height);
    throw fail(CHUNK_HEAD_BYTES + 6 * n + 2 * i, `y = ${yp[i]! >> 1} is outside the sensor height ${height} (0..${height - 1})`);
  }
}

// The loops below are the decoder's hot path, one typed-array pass each, writing through
// subarrays that start at 0 so that the engine can drop the offset arithmetic. They work on
// four dts, or two u16s (as one u32 word), per step where alignment allows: on this
// engine that is about a third faster than one element per step.

/** Absolute µs times; returns the index of the first dt smaller than its predecessor, or -1. */
function fillTimesUs(t: Float64Array, dt: Uint32Array, firstTick: number): number {
  const n = dt.length;
  let previous = 0;
  let i = 0;
  for (; i + 4 <= n; i += 4) {
    const a = dt[i]!;
    const b = dt[i + 1]!;
    const c = dt[i + 2]!;
    const d = dt[i + 3]!;
    if (a < previous || b < a || c < b || d < c) break; // the single steps below find which
    t[i] = firstTick + a;
    t[i + 1] = firstTick + b;
    t[i + 2] = firstTick + c;
    t[i + 3] = firstTick + d;
    previous = d;
  }
  for (; i < n; i++) {
    const d = dt[i]!;
    if (d < previous) return i;
    previous = d;
    t[i] = firstTick + d;
  }
  return -1;
}

/** As fillTimesUs for nanosecond ticks: the same (tick / 1000) as usFromTicks. */
function fillTimesNs(t: Float64Array, dt: Uint32Array, firstTick: number): number {
  const n = dt.length;
  let previous = 0;
  let i = 0;
  for (; i + 4 <= n; i += 4) {
    const a = dt[i]!;
    const b = dt[i + 1]!;
    const c = dt[i + 2]!;
    const d = dt[i + 3]!;
    if (a < previous || b < a || c < b || d < c) break;
    t[i] = (firstTick + a) / 1000;
    t[i + 1] = (firstTick + b) / 1000;
    t[i + 2] = (firstTick + c) / 1000;
    t[i + 3] = (firstTick + d) / 1000;
    previous = d;
  }
  for (; i < n; i++) {
    const d = dt[i]!;
    if (d < previous) return i;
    previous = d;
    t[i] = (firstTick + d) / 1000;
  }
  return -1;
}

/** The largest u16 of a 4-byte-aligned column, read two at a time. */
function maxOf(values: Uint16Array): number {
  const pairs = new Uint32Array(values.buffer, values.byteOffset, values.length >> 1);
  let low = values.length & 1 ? values[values.length - 1]! : 0;
  let high = 0;
  for (let i = 0; i < pairs.length; i++) {
    const v = pairs[i]!;
    if ((v & 0xffff) > low) low = v & 0xffff;
    if (v >>> 16 > high) high = v >>> 16;
  }
  return low > high ? low : high;
}

/** y = yp >> 1, p = yp & 1; returns the largest yp, for the bounds check. */
function splitRowsAndPolarities(yp: Uint16Array, y: Uint16Array, p: Uint8Array): number {
  const n = yp.length;
  if (n & 1 || yp.byteOffset & 3 || y.byteOffset & 3 || p.byteOffset & 1) {
    let max = 0;
    for (let i = 0; i < n; i++) {
      const v = yp[i]!;
      y[i] = v >> 1;
      p[i] = v & 1;
      if (v > max) max = v;
    }
    return max;
  }
  // Two events per word: (yp1 << 16 | yp0) gives (y1 << 16 | y0) and the bytes p0, p1.
  const source = new Uint32Array(yp.buffer, yp.byteOffset, n >> 1);
  const rows = new Uint32Array(y.buffer, y.byteOffset, n >> 1);
  const polarities = new Uint16Array(p.buffer, p.byteOffset, n >> 1);
  let low = 0;
  let high = 0;
  for (let i = 0; i < source.length; i++) {
    const v = source[i]!;
    rows[i] = (v >>> 1) & 0x7fff7fff;
    polarities[i] = (v & 1) | ((v >>> 8) & 0x100);
    if ((v & 0xffff) > low) low = v & 0xffff;
    if (v >>> 16 > high) high = v >>> 16;
  }
  return low > high ? low : high;
}
