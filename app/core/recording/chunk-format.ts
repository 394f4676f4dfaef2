import { crc32 } from '../checksum/crc32';

/**
 * The chunk every recording stream is made of (all integers little-endian):
 *
 *   offset size field
 *        0    4 magic "GLRC"
 *        4    1 format version (1)
 *        5    1 stream: 1 gaze, 2 frames, 3 messages
 *        6    2 header length in bytes (48)
 *        8    4 chunk sequence number, per stream, from 0, continuing across reopenings
 *       12    4 record count
 *       16    4 payload length in bytes
 *       20    4 CRC-32 of the payload
 *       24    8 smallest host time of its records (float64 ns)
 *       32    8 largest host time of its records (float64 ns)
 *       40    4 reserved, zero
 *       44    4 CRC-32 of header bytes 0..43
 *       48      payload
 *
 * The header has its own checksum so that a damaged length can never send a reader to a
 * wrong offset: a chunk whose header checks out is skipped by its length even when its
 * payload fails, and a damaged header is skipped by searching for the next valid one.
 */
export type RecordStream = 'gaze' | 'frames' | 'messages';

export const RECORD_STREAMS: readonly RecordStream[] = ['gaze', 'frames', 'messages'];
export const CHUNK_FORMAT_VERSION = 1;
export const CHUNK_HEADER_BYTES = 48;
export const CHUNK_MAGIC = Uint8Array.of(0x47, 0x4c, 0x52, 0x43); // "GLRC"
/** Larger payloads are refused when writing, so a reader never has to hold more. */
export const MAX_CHUNK_PAYLOAD_BYTES = 64 * 1024 * 1024;

const STREAM_CODES: Readonly<Record<RecordStream, number>> = { gaze: 1, frames: 2, messages: 3 };
const HEADER_CRC_AT = 44;

export interface ChunkHeader {
  readonly version: number;
  readonly headerBytes: number;
  /** The stream named by the header; null when its code is not one this version knows. */
  readonly stream: RecordStream | null;
  readonly seq: number;
  readonly count: number;
  readonly payloadBytes: number;
  readonly payloadCrc: number;
  readonly minHostNs: number;
  readonly maxHostNs: number;
}

export interface ChunkFields {
  readonly stream: RecordStream;
  readonly seq: number;
  readonly count: number;
  readonly minHostNs: number;
  readonly maxHostNs: number;
}

/**
 * Fills in the header of `chunk`, whose payload already sits after CHUNK_HEADER_BYTES of
 * room: builders encode records straight into the chunk, so sealing copies nothing.
 */
export function sealChunk(chunk: Uint8Array, fields: ChunkFields): Uint8Array {
  const payloadBytes = chunk.length - CHUNK_HEADER_BYTES;
  if (payloadBytes < 0 || payloadBytes > MAX_CHUNK_PAYLOAD_BYTES) throw new RangeError(`chunk payload must be 0..${MAX_CHUNK_PAYLOAD_BYTES} bytes, got ${payloadBytes}`);
  if (!(Number.isInteger(fields.seq) && fields.seq >= 0 && fields.seq <= 0xffffffff)) throw new RangeError(`seq must be an integer from 0 to 2^32-1, got ${fields.seq}`);
  const view = new DataView(chunk.buffer, chunk.byteOffset, CHUNK_HEADER_BYTES);
  chunk.set(CHUNK_MAGIC, 0);
  view.setUint8(4, CHUNK_FORMAT_VERSION);
  view.setUint8(5, STREAM_CODES[fields.stream]);
  view.setUint16(6, CHUNK_HEADER_BYTES, true);
  view.setUint32(8, fields.seq, true);
  view.setUint32(12, fields.count, true);
  view.setUint32(16, payloadBytes, true);
  view.setUint32(20, crc32(chunk.subarray(CHUNK_HEADER_BYTES)), true);
  view.setFloat64(24, fields.minHostNs, true);
  view.setFloat64(32, fields.maxHostNs, true);
  view.setUint32(40, 0, true);
  view.setUint32(HEADER_CRC_AT, crc32(chunk.subarray(0, HEADER_CRC_AT)), true);
  return chunk;
}

/** True when `bytes` starts with the chunk magic at `offset`. */
export function hasMagicAt(bytes: Uint8Array, offset: number): boolean {
  return bytes[offset] === 0x47 && bytes[offset + 1] === 0x4c && bytes[offset + 2] === 0x52 && bytes[offset + 3] === 0x43;
}

/**
 * Reads a header from the first CHUNK_HEADER_BYTES of `bytes`; returns why it is not one
 * (no magic, or a header checksum that does not match) instead of throwing.
 */
export function parseChunkHeader(bytes: Uint8Array): ChunkHeader | string {
  if (bytes.length < CHUNK_HEADER_BYTES) return `only ${bytes.length} of the ${CHUNK_HEADER_BYTES} header bytes`;
  if (!hasMagicAt(bytes, 0)) return 'no chunk header (magic "GLRC" missing)';
  const view = new DataView(bytes.buffer, bytes.byteOffset, CHUNK_HEADER_BYTES);
  if (view.getUint32(HEADER_CRC_AT, true) !== crc32(bytes.subarray(0, HEADER_CRC_AT))) return 'chunk header checksum does not match';
  const code = view.getUint8(5);
  const stream = (Object.keys(STREAM_CODES) as RecordStream[]).find((s) => STREAM_CODES[s] === code) ?? null;
  return {
    version: view.getUint8(4),
    headerBytes: view.getUint16(6, true),
    stream,
    seq: view.getUint32(8, true),
    count: view.getUint32(12, true),
    payloadBytes: view.getUint32(16, true),
    payloadCrc: view.getUint32(20, true),
    minHostNs: view.getFloat64(24, true),
    maxHostNs: view.getFloat64(32, true),
  };
}

export const payloadIntact = (header: ChunkHeader, payload: Uint8Array): boolean => payload.length === header.payloadBytes && crc32(payload) === header.payloadCrc;

/** One value per stream. */
export const perStream = <T>(f: (stream: RecordStream) => T): Record<RecordStream, T> => ({ gaze: f('gaze'), frames: f('frames'), messages: f('messages') });
