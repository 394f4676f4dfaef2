/**
 * CRC-32 as in IEEE 802.3, zlib and PNG: reflected polynomial 0xEDB88320, initial value and
 * final XOR 0xFFFFFFFF (check value CRC32("123456789") = 0xCBF43926).
 *
 * Slicing-by-16, the 16-byte member of the family in Kounavis and Berry (2005), "A
 * systematic approach to building high performance software-based CRC generators" (IEEE
 * ISCC): sixteen 256-entry tables let one step fold 16 bytes with independent lookups
 * instead of 16 dependent ones (in Node 20 it measured faster than slicing-by-8 or 32 bytes
 * per step). The bulk is read as 32-bit words in host byte order; every platform Node,
 * Electron and Chromium ship for is little-endian, which is the order the tables expect.
 */
const TABLES = buildTables();
const NO_WORDS = new Int32Array(0);

function buildTables(): Int32Array {
  const t = new Int32Array(16 * 256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
    t[n] = c;
  }
  // Table s gives the CRC of byte n followed by s zero bytes.
  for (let n = 0; n < 256; n++) {
    let c = t[n]!;
    for (let s = 1; s < 16; s++) {
      c = t[c & 255]! ^ (c >>> 8);
      t[s * 256 + n] = c;
    }
  }
  return t;
}

/**
 * The CRC-32 of `bytes`. Pass an earlier result as `seed` to continue it:
 * crc32(b, crc32(a)) equals the CRC of a followed by b (as zlib's crc32(crc, buf)).
 */
export function crc32(bytes: Uint8Array, seed = 0): number {
  const T = TABLES;
  const n = bytes.length;
  let c = ~seed;
  let i = 0;
  // Single bytes up to a 4-byte boundary, so that the bulk can be viewed as words.
  const lead = Math.min(n, (4 - (bytes.byteOffset & 3)) & 3);
  for (; i < lead; i++) c = T[(c ^ bytes[i]!) & 255]! ^ (c >>> 8);
  const wordCount = ((n - i) >>> 4) << 2;
  const words = wordCount > 0 ? new Int32Array(bytes.buffer, bytes.byteOffset + i, wordCount) : NO_WORDS;
  for (let j = 0; j < words.length; j += 4) {
    const a = c ^ words[j]!;
    const b = words[j + 1]!;
    const d = words[j + 2]!;
    const e = words[j + 3]!;
    c =
      T[3840 + (a & 255)]! ^ T[3584 + ((a >>> 8) & 255)]! ^ T[3328 + ((a >>> 16) & 255)]! ^ T[3072 + (a >>> 24)]! ^
      T[2816 + (b & 255)]! ^ T[2560 + ((b >>> 8) & 255)]! ^ T[2304 + ((b >>> 16) & 255)]! ^ T[2048 + (b >>> 24)]! ^
      T[1792 + (d & 255)]! ^ T[1536 + ((d >>> 8) & 255)]! ^ T[1280 + ((d >>> 16) & 255)]! ^ T[1024 + (d >>> 24)]! ^
      T[768 + (e & 255)]! ^ T[512 + ((e >>> 8) & 255)]! ^ T[256 + ((e >>> 16) & 255)]! ^ T[e >>> 24]!;
  }
  for (i += words.length * 4; i < n; i++) c = T[(c ^ bytes[i]!) & 255]! ^ (c >>> 8);
  return ~c >>> 0;
}
