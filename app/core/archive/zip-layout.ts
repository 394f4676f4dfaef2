/**
 * The records of a .zip file, as PKWARE's APPNOTE.TXT (the .ZIP File Format Specification,
 * section 4.3) lays them out: a local header before each entry's data, a central directory
 * after the last entry, and the end-of-central-directory record. Only what the lab archive
 * needs: stored or deflated entries, UTF-8 names, no Zip64, no encryption, one disk.
 * Numbers are little-endian.
 */
export const LOCAL_HEADER_BYTES = 30;
export const CENTRAL_HEADER_BYTES = 46;
export const END_RECORD_BYTES = 22;
const LOCAL_SIG = 0x04034b50;
const CENTRAL_SIG = 0x02014b50;
const END_SIG = 0x06054b50;
const UTF8_NAMES = 0x0800;
const VERSION_NEEDED = 20; // 2.0: deflate
const MADE_BY_UNIX = (3 << 8) | VERSION_NEEDED;
const REGULAR_FILE_644 = (0o100644 << 16) >>> 0;
export const ZIP_LIMIT = 0xffffffff;

export const ZIP_STORED = 0;
export const ZIP_DEFLATED = 8;
export type ZipMethod = typeof ZIP_STORED | typeof ZIP_DEFLATED;

export interface ZipEntry {
  readonly name: string;
  readonly method: ZipMethod;
  readonly crc32: number;
  readonly compressedSize: number;
  readonly size: number;
  readonly localHeaderOffset: number;
}

/** The MS-DOS date and time fields zip stores (two-second resolution), from the UTC fields of `at`. */
export function dosDateTime(at: Date): { time: number; date: number } {
  const year = Math.min(2107, Math.max(1980, at.getUTCFullYear()));
  return {
    time: (at.getUTCHours() << 11) | (at.getUTCMinutes() << 5) | (at.getUTCSeconds() >> 1),
    date: ((year - 1980) << 9) | ((at.getUTCMonth() + 1) << 5) | at.getUTCDate(),
  };
}

function checkFits(entry: ZipEntry): void {
  if (entry.size >= ZIP_LIMIT || entry.compressedSize >= ZIP_LIMIT || entry.localHeaderOffset >= ZIP_LIMIT) {
    throw new RangeError(`${entry.name}: too large for a zip archive (4 GiB limit); write a folder archive instead`);
  }
}

export function encodeLocalHeader(entry: ZipEntry, at: Date): Uint8Array {
  checkFits(entry);
  const name = new TextEncoder().encode(entry.name);
  const out = new Uint8Array(LOCAL_HEADER_BYTES + name.length);
  const v = new DataView(out.buffer);
  const { time, date } = dosDateTime(at);
  v.setUint32(0, LOCAL_SIG, true);
  v.setUint16(4, VERSION_NEEDED, true);
  v.setUint16(6, UTF8_NAMES, true);
  v.setUint16(8, entry.method, true);
  v.setUint16(10, time, true);
  v.setUint16(12, date, true);
  v.setUint32(14, entry.crc32, true);
  v.setUint32(18, entry.compressedSize, true);
  v.setUint32(22, entry.size, true);
  v.setUint16(26, name.length, true);
  v.setUint16(28, 0, true);
  out.set(name, LOCAL_HEADER_BYTES);
  return out;
}

/** The central directory and end record for `entries`, which start at byte `offset` of the file. */
export function encodeCentralDirectory(entries: readonly ZipEntry[], offset: number, at: Date): Uint8Array {
  if (entries.length > 0xffff) throw new RangeError(`${entries.length} files are too many for a zip archive (65535); write a folder archive instead`);
  const names = entries.map((e) => new TextEncoder().encode(e.name));
  const size = names.reduce((n, name) => n + CENTRAL_HEADER_BYTES + name.length, 0);
  if (offset + size >= ZIP_LIMIT) throw new RangeError('too large for a zip archive (4 GiB limit); write a folder archive instead');
  const out = new Uint8Array(size + END_RECORD_BYTES);
  const v = new DataView(out.buffer);
  const { time, date } = dosDateTime(at);
  let p = 0;
  entries.forEach((e, i) => {
    checkFits(e);
    v.setUint32(p, CENTRAL_SIG, true);
    v.setUint16(p + 4, MADE_BY_UNIX, true);
    v.setUint16(p + 6, VERSION_NEEDED, true);
    v.setUint16(p + 8, UTF8_NAMES, true);
    v.setUint16(p + 10, e.method, true);
    v.setUint16(p + 12, time, true);
    v.setUint16(p + 14, date, true);
    v.setUint32(p + 16, e.crc32, true);
    v.setUint32(p + 20, e.compressedSize, true);
    v.setUint32(p + 24, e.size, true);
    v.setUint16(p + 28, names[i]!.length, true);
    // extra length, comment length, disk number, internal attributes: all 0
    v.setUint32(p + 38, REGULAR_FILE_644, true);
    v.setUint32(p + 42, e.localHeaderOffset, true);
    out.set(names[i]!, p + CENTRAL_HEADER_BYTES);
    p += CENTRAL_HEADER_BYTES + names[i]!.length;
  });
  v.setUint32(p, END_SIG, true);
  v.setUint16(p + 8, entries.length, true);
  v.setUint16(p + 10, entries.length, true);
  v.setUint32(p + 12, size, true);
  v.setUint32(p + 16, offset, true);
  return out;
}

/** Where the central directory is, from the last bytes of the file (`tail` ends at the end of the file). */
export function findCentralDirectory(tail: Uint8Array, fileSize: number): { count: number; size: number; offset: number } | string {
  const v = new DataView(tail.buffer, tail.byteOffset, tail.byteLength);
  for (let p = tail.length - END_RECORD_BYTES; p >= 0; p--) {
    if (v.getUint32(p, true) !== END_SIG) continue;
    if (p + END_RECORD_BYTES + v.getUint16(p + 20, true) !== tail.length) continue; // the comment must run to the end
    if (v.getUint16(p + 4, true) !== 0 || v.getUint16(p + 6, true) !== 0) return 'a multi-disk zip archive is not supported';
    const count = v.getUint16(p + 10, true);
    const size = v.getUint32(p + 12, true);
    const offset = v.getUint32(p + 16, true);
    if (count === 0xffff || size === ZIP_LIMIT || offset === ZIP_LIMIT) return 'a Zip64 archive is not supported';
    if (offset + size > fileSize) return 'the central directory lies beyond the end of the file (truncated?)';
    return { count, size, offset };
  }
  return 'no end-of-central-directory record: not a zip file, or truncated';
}

export function parseCentralDirectory(bytes: Uint8Array, count: number): ZipEntry[] | string {
  const v = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const entries: ZipEntry[] = [];
  let p = 0;
  for (let i = 0; i < count; i++) {
    if (p + CENTRAL_HEADER_BYTES > bytes.length || v.getUint32(p, true) !== CENTRAL_SIG) return `central directory entry ${i + 1} is damaged`;
    const flags = v.getUint16(p + 8, true);
    const method = v.getUint16(p + 10, true);
    const nameLength = v.getUint16(p + 28, true);
    const skip = nameLength + v.getUint16(p + 30, true) + v.getUint16(p + 32, true);
    if (p + CENTRAL_HEADER_BYTES + skip > bytes.length) return `central directory entry ${i + 1} is damaged`;
    let name: string;
    try {
      name = decoder.decode(bytes.subarray(p + CENTRAL_HEADER_BYTES, p + CENTRAL_HEADER_BYTES + nameLength));
    } catch {
      return `central directory entry ${i + 1} has a name that is not UTF-8`;
    }
    if (flags & 1) return `${name}: encrypted zip entries are not supported`;
    if (method !== ZIP_STORED && method !== ZIP_DEFLATED) return `${name}: compression method ${method} is not supported (only stored and deflated)`;
    const entry: ZipEntry = { name, method: method as ZipMethod, crc32: v.getUint32(p + 16, true), compressedSize: v.getUint32(p + 20, true), size: v.getUint32(p + 24, true), localHeaderOffset: v.getUint32(p + 42, true) };
    if (entry.compressedSize === ZIP_LIMIT || entry.size === ZIP_LIMIT || entry.localHeaderOffset === ZIP_LIMIT) return `${name}: Zip64 entries are not supported`;
    entries.push(entry);
    p += CENTRAL_HEADER_BYTES + skip;
  }
  return entries;
}

/** Where an entry's data starts, from the fixed part of its local header. */
export function localDataOffset(header: Uint8Array, entry: ZipEntry): number | string {
  const v = new DataView(header.buffer, header.byteOffset, header.byteLength);
  if (header.length < LOCAL_HEADER_BYTES || v.getUint32(0, true) !== LOCAL_SIG) return `${entry.name}: local header is damaged`;
  return entry.localHeaderOffset + LOCAL_HEADER_BYTES + v.getUint16(26, true) + v.getUint16(28, true);
}
