import { allocateBatch, sliceBatch, type EventBatch } from '../event-batch';
import { decodeChunkInto } from './chunk-decoder';
import { parseIndex } from './chunk-index';
import { explainShortFile, fileIsShort } from './file-extent';
import { parseHeader } from './header';
import { chunkByteLength, HEADER_BYTES, indexByteLength } from './layout';

export interface GlevDecodeOptions {
  /**
   * Check every chunk's CRC32 (default true). Skipping it is for bytes already verified,
   * for example a stimulus checked when it was imported: the structure, time order and
   * sensor bounds are checked either way.
   */
  readonly verifyChecksums?: boolean;
}

/** Decodes a whole .glev file held in memory into one batch, as fast as the checks allow. */
export function decodeGlev(bytes: Uint8Array, fileName: string, options: GlevDecodeOptions = {}): EventBatch {
  return decodeGlevInto(bytes, fileName, null, options);
}

/**
 * The same, into columns the caller owns (a player's reused buffers), which must hold at
 * least the file's events; returns the filled views. With `out` null, fresh columns are made.
 */
export function decodeGlevInto(bytes: Uint8Array, fileName: string, out: EventBatch | null, options: GlevDecodeOptions = {}): EventBatch {
  const { verifyChecksums = true } = options;
  const header = parseHeader(bytes.subarray(0, HEADER_BYTES), bytes.length, fileName);
  if (fileIsShort(fileName, header, bytes.length)) {
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const walk = explainShortFile(fileName, header, bytes.length);
    let step = walk.next();
    while (!step.done) step = walk.next(view.getUint32(step.value, true));
    throw step.value;
  }
  const chunks = parseIndex(bytes.subarray(header.indexOffset, header.indexOffset + indexByteLength(header.chunkCount)), header, fileName);
  if (out && out.t.length < header.eventCount) throw new RangeError(`out holds ${out.t.length} events; ${fileName} has ${header.eventCount}`);
  const target = out ? sliceBatch(out, 0, header.eventCount) : allocateBatch(header.eventCount);
  chunks.forEach((entry, k) => {
    const stored = bytes.subarray(entry.byteOffset, entry.byteOffset + chunkByteLength(entry.count));
    decodeChunkInto(stored, k, entry, header, fileName, target, entry.firstEvent, verifyChecksums);
  });
  return target;
}
