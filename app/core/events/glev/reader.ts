import { allocateBatch, emptyBatch, lowerBound, sliceBatch, type EventBatch, type SensorSize, type TimeResolution } from '../event-batch';
import { EventFormatError } from '../event-format-error';
import { decodeChunkInto } from './chunk-decoder';
import { parseIndex, type ChunkEntry } from './chunk-index';
import { explainShortFile, fileIsShort } from './file-extent';
import { parseHeader, type GlevHeader } from './header';
import { chunkByteLength, HEADER_BYTES, indexByteLength } from './layout';
import { usFromTicks } from './ticks';

/** Random access to a file's bytes. read() returns exactly `length` bytes; callers stay within `size`. */
export interface ByteSource {
  readonly size: number;
  read(offset: number, length: number): Promise<Uint8Array>;
}

/** A ByteSource over bytes already in memory (reads are views, not copies). */
export function bytesSource(bytes: Uint8Array): ByteSource {
  return { size: bytes.length, read: async (offset, length) => bytes.subarray(offset, offset + length) };
}

export interface GlevChunkInfo {
  readonly tFirstUs: number;
  readonly tLastUs: number;
  readonly count: number;
  /** Events in all earlier chunks. */
  readonly firstEvent: number;
  readonly byteOffset: number;
}

export interface GlevInfo {
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
  readonly eventCount: number;
  readonly chunkCount: number;
  /** First and last event times; NaN when the file holds no events. */
  readonly tStartUs: number;
  readonly tEndUs: number;
  readonly chunks: readonly GlevChunkInfo[];
}

/** Where the first event at or after a time is: chunk, index within it, and event number overall. */
export interface GlevPosition {
  readonly chunk: number;
  readonly index: number;
  readonly event: number;
}

export interface GlevVerification {
  readonly corruptChunks: number[];
  readonly problems: EventFormatError[];
}

export interface GlevReader extends GlevInfo {
  readChunk(chunk: number): Promise<EventBatch>;
  /** Events with fromUs <= t < toUs (views into the decoded chunks that hold them). */
  readRange(fromUs: number, toUs: number): Promise<EventBatch>;
  /** Past the last event: { chunk: chunkCount, index: 0, event: eventCount }. */
  seek(tUs: number): Promise<GlevPosition>;
  /** Decodes every chunk, collecting the damaged ones instead of stopping at the first. */
  verify(): Promise<GlevVerification>;
}

async function readLayout(source: ByteSource, fileName: string): Promise<{ header: GlevHeader; entries: ChunkEntry[] }> {
  const header = parseHeader(await source.read(0, Math.min(source.size, HEADER_BYTES)), source.size, fileName);
  if (fileIsShort(fileName, header, source.size)) {
    const walk = explainShortFile(fileName, header, source.size);
    let step = walk.next();
    while (!step.done) {
      const field = await source.read(step.value, 4);
      step = walk.next(new DataView(field.buffer, field.byteOffset, 4).getUint32(0, true));
    }
    throw step.value;
  }
  const index = await source.read(header.indexOffset, indexByteLength(header.chunkCount));
  return { header, entries: parseIndex(index, header, fileName) };
}

function checkTime(name: string, value: number): void {
  if (typeof value !== 'number' || Number.isNaN(value)) throw new RangeError(`${name} must be a time in µs, got ${value}`);
}

/**
 * Opens a .glev file for random access: reads and checks the header and the chunk index
 * (a few hundred bytes per million events), then reads chunks on demand. Seeking is a
 * binary search over the index, then over the one chunk that holds the time.
 */
export async function openGlev(source: ByteSource, fileName: string): Promise<GlevReader> {
  const { header, entries } = await readLayout(source, fileName);
  const { resolution } = header;
  const chunks: GlevChunkInfo[] = entries.map((e) => ({
    tFirstUs: usFromTicks(e.firstTick, resolution),
    tLastUs: usFromTicks(e.lastTick, resolution),
    count: e.count,
    firstEvent: e.firstEvent,
    byteOffset: e.byteOffset,
  }));
  const firstUs = Float64Array.from(chunks, (c) => c.tFirstUs);
  const lastUs = Float64Array.from(chunks, (c) => c.tLastUs);

  /** Chunks [from, to) in one read, decoded into one batch. */
  async function decodeChunks(from: number, to: number): Promise<EventBatch> {
    const start = entries[from]!.byteOffset;
    const last = entries[to - 1]!;
    const bytes = await source.read(start, last.byteOffset + chunkByteLength(last.count) - start);
    const out = allocateBatch(last.firstEvent + last.count - entries[from]!.firstEvent);
    for (let k = from; k < to; k++) {
      const e = entries[k]!;
      const stored = bytes.subarray(e.byteOffset - start, e.byteOffset - start + chunkByteLength(e.count));
      decodeChunkInto(stored, k, e, header, fileName, out, e.firstEvent - entries[from]!.firstEvent, true);
    }
    return out;
  }

  function checkChunk(chunk: number): void {
    if (!Number.isInteger(chunk) || chunk < 0 || chunk >= entries.length) {
      throw new RangeError(`chunk must be an integer in 0..${entries.length - 1}, got ${chunk}`);
    }
  }

  return {
    sensor: header.sensor,
    resolution,
    eventCount: header.eventCount,
    chunkCount: header.chunkCount,
    tStartUs: chunks.length ? chunks[0]!.tFirstUs : NaN,
    tEndUs: chunks.length ? chunks[chunks.length - 1]!.tLastUs : NaN,
    chunks,

    async readChunk(chunk) {
      checkChunk(chunk);
      return decodeChunks(chunk, chunk + 1);
    },

    async readRange(fromUs, toUs) {
      checkTime('fromUs', fromUs);
      checkTime('toUs', toUs);
      const from = lowerBound(lastUs, fromUs); // first chunk ending at or after fromUs
      const to = lowerBound(firstUs, toUs); // first chunk starting at or after toUs
      if (from >= to) return emptyBatch();
      const batch = await decodeChunks(from, to);
      return sliceBatch(batch, lowerBound(batch.t, fromUs), lowerBound(batch.t, toUs));
    },

    async seek(tUs) {
      checkTime('tUs', tUs);
      const chunk = lowerBound(lastUs, tUs);
      if (chunk === entries.length) return { chunk, index: 0, event: header.eventCount };
      const { firstEvent } = entries[chunk]!;
      if (firstUs[chunk]! >= tUs) return { chunk, index: 0, event: firstEvent };
      const index = lowerBound((await decodeChunks(chunk, chunk + 1)).t, tUs);
      return { chunk, index, event: firstEvent + index };
    },

    async verify() {
      const corruptChunks: number[] = [];
      const problems: EventFormatError[] = [];
      for (let k = 0; k < entries.length; k++) {
        try {
          await decodeChunks(k, k + 1);
        } catch (error) {
          if (!(error instanceof EventFormatError)) throw error;
          corruptChunks.push(k);
          problems.push(error);
        }
      }
      return { corruptChunks, problems };
    },
  };
}
