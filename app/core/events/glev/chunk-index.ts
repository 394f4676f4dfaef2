import { crc32 } from '../../checksum/crc32';
import { EventFormatError } from '../event-format-error';
import type { GlevHeader } from './header';
import { chunkByteLength, HEADER, HEADER_BYTES, INDEX_ENTRY_BYTES, MAX_CHUNK_EVENTS, MAX_CHUNK_SPAN_TICKS, MAX_TICKS, readU64, writeU64 } from './layout';
import { headerAt, hex32, indexAt, indexEntryAt } from './messages';

/** One chunk as the index describes it (timestamps in the file's ticks). */
export interface ChunkEntry {
  readonly firstTick: number;
  readonly lastTick: number;
  readonly byteOffset: number;
  readonly count: number;
  /** Events in all earlier chunks; not stored, summed from the counts. */
  readonly firstEvent: number;
}

export function encodeIndex(entries: readonly ChunkEntry[]): Uint8Array {
  const bytes = new Uint8Array(INDEX_ENTRY_BYTES * entries.length + 4);
  const view = new DataView(bytes.buffer);
  entries.forEach((entry, k) => {
    const at = k * INDEX_ENTRY_BYTES;
    writeU64(view, at, entry.firstTick);
    writeU64(view, at + 8, entry.lastTick);
    writeU64(view, at + 16, entry.byteOffset);
    view.setUint32(at + 24, entry.count, true);
  });
  const crcAt = bytes.length - 4;
  view.setUint32(crcAt, crc32(bytes.subarray(0, crcAt)), true);
  return bytes;
}

/**
 * Reads the index (its bytes, CRC included) and checks that it describes the file: chunks
 * that follow one another from the header's end to the index, in time order, each spanning
 * no more ticks than dt can hold, with counts adding up to the header's event count.
 */
export function parseIndex(bytes: Uint8Array, header: GlevHeader, fileName: string): ChunkEntry[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const crcAt = bytes.length - 4;
  const storedCrc = view.getUint32(crcAt, true);
  const computedCrc = crc32(bytes.subarray(0, crcAt));
  if (storedCrc !== computedCrc) {
    throw new EventFormatError(fileName, indexAt(header.indexOffset), `index CRC32 mismatch: stored ${hex32(storedCrc)} at byte ${header.indexOffset + crcAt}, computed ${hex32(computedCrc)}; the index is damaged`);
  }
  const maxTicks = MAX_TICKS[header.resolution];
  const entries: ChunkEntry[] = [];
  let expectedOffset = HEADER_BYTES;
  let firstEvent = 0;
  let previousLast = 0;
  for (let k = 0; k < header.chunkCount; k++) {
    const at = k * INDEX_ENTRY_BYTES;
    const fail = (field: number, problem: string): EventFormatError => new EventFormatError(fileName, indexEntryAt(k, header.indexOffset + at + field), problem);
    const firstTick = readU64(view, at);
    const lastTick = readU64(view, at + 8);
    const byteOffset = readU64(view, at + 16);
    const count = view.getUint32(at + 24, true);
    if (!(firstTick <= maxTicks)) throw fail(0, `first timestamp ${firstTick} is beyond ${maxTicks} ticks, the most a ${header.resolution} file holds exactly`);
    if (firstTick < previousLast) throw fail(0, `chunk ${k} starts at tick ${firstTick}, before chunk ${k - 1} ends (tick ${previousLast}); chunks must be in time order`);
    if (!(lastTick >= firstTick && lastTick - firstTick <= MAX_CHUNK_SPAN_TICKS)) {
      throw fail(8, `last timestamp ${lastTick} must lie between the first (${firstTick}) and ${MAX_CHUNK_SPAN_TICKS} ticks after it`);
    }
    if (byteOffset !== expectedOffset) throw fail(16, `chunk offset ${byteOffset}, expected ${expectedOffset} (chunks follow one another without gaps)`);
    if (count < 1 || count > MAX_CHUNK_EVENTS) throw fail(24, `event count ${count} is outside 1..${MAX_CHUNK_EVENTS}`);
    entries.push({ firstTick, lastTick, byteOffset, count, firstEvent });
    expectedOffset += chunkByteLength(count);
    firstEvent += count;
    previousLast = lastTick;
  }
  if (expectedOffset !== header.indexOffset) {
    throw new EventFormatError(fileName, headerAt(HEADER.indexOffset), `index offset ${header.indexOffset}, but the index's chunks end at byte ${expectedOffset}`);
  }
  if (firstEvent !== header.eventCount) {
    throw new EventFormatError(fileName, headerAt(HEADER.eventCount), `event count ${header.eventCount}, but the index's chunks hold ${firstEvent} events`);
  }
  return entries;
}
