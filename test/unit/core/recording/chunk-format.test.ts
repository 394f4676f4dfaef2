import { crc32 as zlibCrc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { CHUNK_HEADER_BYTES, parseChunkHeader, payloadIntact, sealChunk } from '../../../../app/core/recording/chunk-format';

function chunkWith(payload: Uint8Array): Uint8Array {
  const chunk = new Uint8Array(CHUNK_HEADER_BYTES + payload.length);
  chunk.set(payload, CHUNK_HEADER_BYTES);
  return sealChunk(chunk, { stream: 'frames', seq: 0x01020304, count: 7, minHostNs: 1.5e9, maxHostNs: 2.25e9 });
}

describe('chunk header', () => {
  it('lays out every field where the documented table says, little-endian', () => {
    const payload = new TextEncoder().encode('forklift crossing aisle 3');
    const chunk = chunkWith(payload);
    const view = new DataView(chunk.buffer);
    expect(Array.from(chunk.subarray(0, 4))).toEqual([0x47, 0x4c, 0x52, 0x43]); // "GLRC"
    expect(chunk[4]).toBe(1); // version
    expect(chunk[5]).toBe(2); // frames
    expect(view.getUint16(6, true)).toBe(48);
    expect(Array.from(chunk.subarray(8, 12))).toEqual([0x04, 0x03, 0x02, 0x01]); // seq, little-endian
    expect(view.getUint32(12, true)).toBe(7);
    expect(view.getUint32(16, true)).toBe(payload.length);
    // Checksums against zlib's CRC-32 (Node's zlib.crc32), an implementation outside the project.
    expect(view.getUint32(20, true)).toBe(zlibCrc32(payload));
    expect(view.getFloat64(24, true)).toBe(1.5e9);
    expect(view.getFloat64(32, true)).toBe(2.25e9);
    expect(view.getUint32(40, true)).toBe(0);
    expect(view.getUint32(44, true)).toBe(zlibCrc32(chunk.subarray(0, 44)));
    expect(chunk.subarray(48)).toEqual(payload);
  });

  it('parses back what it sealed, and checks the payload', () => {
    const payload = Uint8Array.from({ length: 100 }, (_, i) => i);
    const chunk = chunkWith(payload);
    const header = parseChunkHeader(chunk);
    expect(header).toEqual({ version: 1, headerBytes: 48, stream: 'frames', seq: 0x01020304, count: 7, payloadBytes: 100, payloadCrc: zlibCrc32(payload), minHostNs: 1.5e9, maxHostNs: 2.25e9 });
    if (typeof header === 'string') throw new Error(header);
    expect(payloadIntact(header, chunk.subarray(48))).toBe(true);
    const bent = chunk.slice(48);
    bent[50] ^= 0x10;
    expect(payloadIntact(header, bent)).toBe(false);
  });

  it('says why bytes are not a header: too short, no magic, any flipped header bit', () => {
    const chunk = chunkWith(new Uint8Array(8));
    expect(parseChunkHeader(chunk.subarray(0, 47))).toMatch(/only 47 of the 48 header bytes/);
    const noMagic = chunk.slice();
    noMagic[1] = 0;
    expect(parseChunkHeader(noMagic)).toMatch(/magic "GLRC" missing/);
    for (let bit = 32; bit < 48 * 8; bit++) {
      const flipped = chunk.slice();
      flipped[bit >> 3] ^= 1 << (bit & 7);
      expect(parseChunkHeader(flipped), `bit ${bit}`).toMatch(/header checksum does not match/);
    }
  });

  it('refuses a sequence number that does not fit 32 bits', () => {
    expect(() => sealChunk(new Uint8Array(48), { stream: 'gaze', seq: 2 ** 32, count: 0, minHostNs: 0, maxHostNs: 0 })).toThrow(RangeError);
  });
});
