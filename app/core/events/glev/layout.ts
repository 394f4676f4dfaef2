import type { TimeResolution } from '../event-batch';

/**
 * The .glev event file, version 1. All numbers little-endian; offsets in bytes.
 *
 *   header   48 bytes at offset 0
 *   chunks   one after another from byte 48, each 16 + 8n bytes for n events
 *   index    28 bytes per chunk, then a CRC32 of the entries, at the header's index offset
 *
 * Header: magic E5 47 4C 45 56 0D 0A 0A | version u16 @8 | header length u16 @10 (48) |
 * width u32 @12 | height u32 @16 | ticks per second u32 @20 (1e6 or 1e9) |
 * event count u64 @24 | index offset u64 @32 | chunk count u32 @40 | CRC32 of bytes 0..43 @44.
 *
 * Chunk: first timestamp u64 (ticks) @0 | event count n u32 @8 | dt u32[n] @12 (ticks since
 * the first timestamp) | x u16[n] @12+4n | (y << 1 | p) u16[n] @12+6n | CRC32 of the
 * chunk's bytes 0..12+8n-1 @12+8n. Chunks start at multiples of 8, so dt sits on 4-byte and
 * x and yp on 2-byte boundaries and can be read through typed-array views in place.
 *
 * Index entry k: first timestamp u64 @0 | last timestamp u64 @8 | chunk offset u64 @16 |
 * event count u32 @24. The CRC32 of all entries follows the last one and ends the file.
 */
export const MAGIC = new Uint8Array([0xe5, 0x47, 0x4c, 0x45, 0x56, 0x0d, 0x0a, 0x0a]);
export const FORMAT_VERSION = 1;
export const HEADER_BYTES = 48;

/** Byte offsets of the header's fields. */
export const HEADER = {
  version: 8,
  headerBytes: 10,
  width: 12,
  height: 16,
  ticksPerSecond: 20,
  eventCount: 24,
  indexOffset: 32,
  chunkCount: 40,
  crc: 44,
} as const;

/** First timestamp and event count; the columns follow. */
export const CHUNK_HEAD_BYTES = 12;
export const INDEX_ENTRY_BYTES = 28;
export const MAX_CHUNK_EVENTS = 65536;
/** dt is a u32: a chunk spans at most this many ticks. */
export const MAX_CHUNK_SPAN_TICKS = 0xffffffff;

/** x fills a u16; y shares its u16 with the polarity bit, so 15 bits remain. */
export const MAX_WIDTH = 65536;
export const MAX_HEIGHT = 32768;

export const TICKS_PER_SECOND: Readonly<Record<TimeResolution, number>> = { us: 1e6, ns: 1e9 };

/**
 * The largest tick count Gazeloom reads or writes: where float64 microseconds stop holding
 * every tick exactly (2^53 - 1 µs, about 285 years; 2^52 ns, about 52 days).
 */
export const MAX_TICKS: Readonly<Record<TimeResolution, number>> = { us: Number.MAX_SAFE_INTEGER, ns: 2 ** 52 };

export const chunkByteLength = (count: number): number => 16 + 8 * count;
export const indexByteLength = (chunkCount: number): number => INDEX_ENTRY_BYTES * chunkCount + 4;

/** An unsigned 64-bit field as a number; values above 2^53 - 1 come back inexact, so check them with Number.isSafeInteger. */
export function readU64(view: DataView, offset: number): number {
  return view.getUint32(offset, true) + view.getUint32(offset + 4, true) * 4294967296;
}

export function writeU64(view: DataView, offset: number, value: number): void {
  view.setUint32(offset, value % 4294967296, true);
  view.setUint32(offset + 4, Math.floor(value / 4294967296), true);
}
