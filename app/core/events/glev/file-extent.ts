import { EventFormatError } from '../event-format-error';
import type { GlevHeader } from './header';
import { CHUNK_HEAD_BYTES, chunkByteLength, HEADER, HEADER_BYTES, indexByteLength, MAX_CHUNK_EVENTS } from './layout';
import { chunkAt, headerAt, indexAt } from './messages';

/** The size the header implies: the index, then its CRC, end the file. */
export const glevFileSize = (header: GlevHeader): number => header.indexOffset + indexByteLength(header.chunkCount);

/**
 * True when the file is shorter than its header says (explainShortFile then says where it
 * was cut). Throws when it is longer: bytes after the index mean the file was assembled or
 * transferred wrongly, and Gazeloom does not guess which part is right.
 */
export function fileIsShort(fileName: string, header: GlevHeader, size: number): boolean {
  const expected = glevFileSize(header);
  if (size > expected) {
    throw new EventFormatError(fileName, `byte ${expected}`, `${size - expected} unexpected bytes after the index; a .glev file of ${header.chunkCount} chunks ends at byte ${expected}`);
  }
  return size < expected;
}

/**
 * Locates the cut in a file shorter than its header says. With the index gone, the walk
 * follows the chunks from the header's end (each chunk's size follows from its count field)
 * to the first one the file cuts short. A generator, so that in-memory and file-backed
 * readers share the walk: it yields the file offset of each count field (4 bytes) it needs
 * and expects that field's value back; it returns the error to throw.
 */
export function* explainShortFile(fileName: string, header: GlevHeader, size: number): Generator<number, EventFormatError, number> {
  let offset = HEADER_BYTES;
  for (let k = 0; k < header.chunkCount; k++) {
    if (offset + CHUNK_HEAD_BYTES > size) {
      return new EventFormatError(fileName, chunkAt(k, offset), `truncated: the file ends at byte ${size}, inside the chunk's ${CHUNK_HEAD_BYTES}-byte head (chunk ${k} of ${header.chunkCount})`);
    }
    const count = yield offset + 8;
    if (count < 1 || count > MAX_CHUNK_EVENTS) {
      return new EventFormatError(fileName, chunkAt(k, offset + 8), `event count ${count} is outside 1..${MAX_CHUNK_EVENTS}; the chunk head is damaged`);
    }
    const end = offset + chunkByteLength(count);
    if (end > size) {
      return new EventFormatError(fileName, chunkAt(k, offset), `truncated: the chunk of ${count} events needs bytes ${offset}..${end - 1}, but the file ends at byte ${size} (chunk ${k} of ${header.chunkCount})`);
    }
    offset = end;
  }
  if (offset !== header.indexOffset) {
    const where = header.indexOffset >= size ? `lies outside the file of ${size} bytes` : 'does not follow the last chunk';
    return new EventFormatError(fileName, headerAt(HEADER.indexOffset), `index offset ${header.indexOffset} ${where}; the ${header.chunkCount} chunks end at byte ${offset}`);
  }
  return new EventFormatError(fileName, indexAt(offset), `truncated: the index needs bytes ${offset}..${glevFileSize(header) - 1}, but the file ends at byte ${size}`);
}
