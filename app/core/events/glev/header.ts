import { crc32 } from '../../checksum/crc32';
import type { SensorSize, TimeResolution } from '../event-batch';
import { EventFormatError } from '../event-format-error';
import { FORMAT_VERSION, HEADER, HEADER_BYTES, MAGIC, MAX_HEIGHT, MAX_WIDTH, readU64, TICKS_PER_SECOND, writeU64 } from './layout';
import { headerAt, hex32 } from './messages';

export interface GlevHeader {
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
  readonly eventCount: number;
  readonly chunkCount: number;
  /** Where the chunk index starts; the chunks fill the bytes from HEADER_BYTES up to here. */
  readonly indexOffset: number;
}

export function encodeHeader(header: GlevHeader): Uint8Array {
  const bytes = new Uint8Array(HEADER_BYTES);
  const view = new DataView(bytes.buffer);
  bytes.set(MAGIC, 0);
  view.setUint16(HEADER.version, FORMAT_VERSION, true);
  view.setUint16(HEADER.headerBytes, HEADER_BYTES, true);
  view.setUint32(HEADER.width, header.sensor.width, true);
  view.setUint32(HEADER.height, header.sensor.height, true);
  view.setUint32(HEADER.ticksPerSecond, TICKS_PER_SECOND[header.resolution], true);
  writeU64(view, HEADER.eventCount, header.eventCount);
  writeU64(view, HEADER.indexOffset, header.indexOffset);
  view.setUint32(HEADER.chunkCount, header.chunkCount, true);
  view.setUint32(HEADER.crc, crc32(bytes.subarray(0, HEADER.crc)), true);
  return bytes;
}

const hexBytes = (bytes: Uint8Array): string => Array.from(bytes, (b) => b.toString(16).padStart(2, '0').toUpperCase()).join(' ');

function checkMagic(head: Uint8Array, fileName: string): void {
  const n = Math.min(head.length, MAGIC.length);
  if (n > 0 && MAGIC.subarray(0, n).every((b, i) => head[i] === b)) return; // a prefix of the signature is a cut header
  const found = hexBytes(head.subarray(0, n));
  const expected = `expected the .glev signature ${hexBytes(MAGIC)}, found ${found || 'an empty file'}`;
  let hint = '';
  if (head.subarray(0, n).every((b) => b === 0)) hint = ' (a blank header: the file was not finished, perhaps an interrupted conversion)';
  else if (String.fromCharCode(...head.subarray(0, 16)).includes('GLEV')) {
    hint = ' (the signature is damaged the way text-mode transfers damage it: line endings or non-ASCII bytes were converted; copy the file again in binary mode)';
  }
  throw new EventFormatError(fileName, headerAt(0), `${expected}${hint}`);
}

/**
 * Reads and checks the header from the file's first bytes (all of them if the file is
 * shorter than the header). The signature and version come first, so that a file of
 * another kind or version is named as such rather than reported as damaged.
 */
export function parseHeader(head: Uint8Array, fileSize: number, fileName: string): GlevHeader {
  checkMagic(head, fileName);
  const view = new DataView(head.buffer, head.byteOffset, head.byteLength);
  if (head.length >= HEADER.version + 2) {
    const version = view.getUint16(HEADER.version, true);
    if (version !== FORMAT_VERSION) {
      throw new EventFormatError(fileName, headerAt(HEADER.version), `format version ${version} is not supported (this reader knows version ${FORMAT_VERSION}); a newer Gazeloom may read it`);
    }
  }
  if (fileSize < HEADER_BYTES) {
    throw new EventFormatError(fileName, headerAt(fileSize), `truncated: the file ends at byte ${fileSize}, inside the ${HEADER_BYTES}-byte header`);
  }
  const storedCrc = view.getUint32(HEADER.crc, true);
  const computedCrc = crc32(head.subarray(0, HEADER.crc));
  if (storedCrc !== computedCrc) {
    throw new EventFormatError(fileName, headerAt(HEADER.crc), `header CRC32 mismatch: stored ${hex32(storedCrc)}, computed ${hex32(computedCrc)} over bytes 0..${HEADER.crc - 1}; the header is damaged`);
  }
  function field(offset: number, problem: string): never {
    throw new EventFormatError(fileName, headerAt(offset), problem);
  }
  const headerBytes = view.getUint16(HEADER.headerBytes, true);
  if (headerBytes !== HEADER_BYTES) field(HEADER.headerBytes, `header length ${headerBytes}, expected ${HEADER_BYTES} for version ${FORMAT_VERSION}`);
  const width = view.getUint32(HEADER.width, true);
  if (width < 1 || width > MAX_WIDTH) field(HEADER.width, `sensor width ${width} is outside 1..${MAX_WIDTH}`);
  const height = view.getUint32(HEADER.height, true);
  if (height < 1 || height > MAX_HEIGHT) field(HEADER.height, `sensor height ${height} is outside 1..${MAX_HEIGHT}`);
  const ticksPerSecond = view.getUint32(HEADER.ticksPerSecond, true);
  const resolution = (Object.keys(TICKS_PER_SECOND) as TimeResolution[]).find((r) => TICKS_PER_SECOND[r] === ticksPerSecond);
  if (!resolution) field(HEADER.ticksPerSecond, `${ticksPerSecond} ticks per second, expected ${TICKS_PER_SECOND.us} (µs) or ${TICKS_PER_SECOND.ns} (ns)`);
  const eventCount = readU64(view, HEADER.eventCount);
  if (!Number.isSafeInteger(eventCount)) field(HEADER.eventCount, `event count ${eventCount} is beyond 2^53 - 1`);
  const indexOffset = readU64(view, HEADER.indexOffset);
  if (!Number.isSafeInteger(indexOffset) || indexOffset < HEADER_BYTES || indexOffset % 8 !== 0) {
    field(HEADER.indexOffset, `index offset ${indexOffset}, expected a multiple of 8 from ${HEADER_BYTES} on`);
  }
  const chunkCount = view.getUint32(HEADER.chunkCount, true);
  return { sensor: { width, height }, resolution, eventCount, chunkCount, indexOffset };
}
