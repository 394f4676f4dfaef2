import type { ByteSource } from '../events/glev';
import { CHUNK_FORMAT_VERSION, CHUNK_HEADER_BYTES, hasMagicAt, MAX_CHUNK_PAYLOAD_BYTES, parseChunkHeader, payloadIntact, type ChunkHeader, type RecordStream } from './chunk-format';
import { RecordingFormatError } from './recording-format-error';

/**
 * What a walk over a stream file finds, in file order:
 *   chunk    an intact chunk (header and payload checksums match); its payload is valid
 *            until the walk moves on;
 *   corrupt  damaged bytes with an intact chunk after them: kept, counted. `chunks` is how
 *            many chunks they held, from the sequence numbers on either side;
 *   torn     damaged or incomplete bytes at the end with no intact chunk after them: what a
 *            crash or power cut leaves mid-append, and what recovery cuts.
 */
export type ScannedItem =
  | { readonly kind: 'chunk'; readonly offset: number; readonly header: ChunkHeader; readonly payload: Uint8Array }
  | { readonly kind: 'corrupt'; readonly offset: number; readonly bytes: number; readonly chunks: number; readonly reason: string }
  | { readonly kind: 'torn'; readonly offset: number; readonly bytes: number; readonly reason: string };

/** Where to begin: the start of the file, or a chunk boundary taken from the index. */
export interface ScanStart {
  readonly offset: number;
  /** The sequence number of the intact chunk just before `offset`, or null at the start. */
  readonly previousSeq: number | null;
}

const SEARCH_WINDOW = 1 << 16;

/** Why a header cannot be followed (a reason), or null when it can. */
const unusable = (h: ChunkHeader | string): string | null =>
  typeof h === 'string' ? h : h.payloadBytes > MAX_CHUNK_PAYLOAD_BYTES ? `chunk header claims a ${h.payloadBytes}-byte payload` : null;

/** The next offset at or after `from` where a header with a valid checksum starts, or null. */
async function findNextHeader(source: ByteSource, from: number): Promise<number | null> {
  for (let at = from; at + CHUNK_HEADER_BYTES <= source.size; ) {
    const bytes = await source.read(at, Math.min(source.size - at, SEARCH_WINDOW + CHUNK_HEADER_BYTES));
    for (let i = 0; i + CHUNK_HEADER_BYTES <= bytes.length; i++) {
      if (hasMagicAt(bytes, i) && unusable(parseChunkHeader(bytes.subarray(i, i + CHUNK_HEADER_BYTES))) === null) return at + i;
    }
    at += bytes.length - CHUNK_HEADER_BYTES + 1;
  }
  return null;
}

/** A header that checks out but is not this stream's, or from a newer format: never damage, so never cut. */
function checkKnown(header: ChunkHeader, file: string, offset: number, stream: RecordStream): void {
  const where = `chunk at byte ${offset}`;
  if (header.version !== CHUNK_FORMAT_VERSION || header.headerBytes !== CHUNK_HEADER_BYTES) {
    throw new RecordingFormatError(file, where, `chunk format version ${header.version} (header ${header.headerBytes} bytes); this Gazeloom reads version ${CHUNK_FORMAT_VERSION}: update Gazeloom`);
  }
  if (header.stream !== stream) throw new RecordingFormatError(file, where, `holds a ${header.stream ?? 'unknown'} chunk, expected ${stream}: was the file renamed?`);
}

export async function* scanChunks(source: ByteSource, file: string, stream: RecordStream, start: ScanStart = { offset: 0, previousSeq: null }): AsyncGenerator<ScannedItem> {
  let offset = start.offset;
  let previousSeq = start.previousSeq ?? -1;
  // A damaged stretch is held back until an intact chunk follows it; if none does, it is the torn tail.
  const damage = { offset: -1, parts: 0, reason: '' };
  const markBad = (at: number, reason: string) => {
    if (damage.parts === 0) Object.assign(damage, { offset: at, reason });
    damage.parts++;
  };

  while (offset < source.size) {
    if (source.size - offset < CHUNK_HEADER_BYTES) {
      markBad(offset, `the file ends ${source.size - offset} bytes into a chunk header`);
      break;
    }
    const header = parseChunkHeader(await source.read(offset, CHUNK_HEADER_BYTES));
    const refusal = unusable(header);
    if (refusal !== null || typeof header === 'string') {
      const next = await findNextHeader(source, offset + 1);
      markBad(offset, refusal ?? '');
      if (next === null) break;
      offset = next;
      continue;
    }
    checkKnown(header, file, offset, stream);
    const end = offset + CHUNK_HEADER_BYTES + header.payloadBytes;
    if (end > source.size) {
      markBad(offset, `chunk ${header.seq} is incomplete: ${source.size - offset - CHUNK_HEADER_BYTES} of its ${header.payloadBytes} payload bytes`);
      break;
    }
    const payload = await source.read(offset + CHUNK_HEADER_BYTES, header.payloadBytes);
    if (!payloadIntact(header, payload)) {
      markBad(offset, `chunk ${header.seq} payload checksum does not match`);
      offset = end;
      continue;
    }
    if (damage.parts > 0) {
      const between = header.seq - previousSeq - 1;
      yield { kind: 'corrupt', offset: damage.offset, bytes: offset - damage.offset, chunks: between > 0 ? between : damage.parts, reason: damage.reason };
      damage.parts = 0;
    }
    yield { kind: 'chunk', offset, header, payload };
    previousSeq = header.seq;
    offset = end;
  }
  if (damage.parts > 0) yield { kind: 'torn', offset: damage.offset, bytes: source.size - damage.offset, reason: damage.reason };
}
