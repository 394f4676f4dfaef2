import { crc32 as zlibCrc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { crc32 } from '../../../app/core/checksum/crc32';
import { Xoshiro128 } from '../../../app/core/random/xoshiro128';

function randomBytes(seed: number, length: number): Uint8Array {
  const g = new Xoshiro128(seed);
  return Uint8Array.from({ length }, () => g.nextInt(256));
}

describe('crc32', () => {
  it('gives the published check value for "123456789" and 0 for no bytes', () => {
    // The "check" value of CRC-32 (zlib, PNG, IEEE 802.3) as listed in Greg Cook's "Catalogue
    // of parametrised CRC algorithms" under CRC-32/ISO-HDLC (value from memory; zlib agrees below).
    expect(crc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926);
    expect(crc32(new Uint8Array(0))).toBe(0);
  });

  it("matches zlib's crc32 (Node's zlib.crc32) for every length and alignment", () => {
    const carrier = randomBytes(1, 4096 + 64);
    for (let start = 0; start < 8; start++) {
      for (const length of [0, 1, 2, 3, 4, 5, 15, 16, 17, 31, 32, 33, 63, 64, 100, 1000, 4096]) {
        const bytes = carrier.subarray(start, start + length);
        expect(crc32(bytes), `start ${start}, length ${length}`).toBe(zlibCrc32(bytes));
      }
    }
  });

  it('matches zlib on a megabyte of random data, and on all-zero and all-one bytes', () => {
    const big = randomBytes(2, 1 << 20);
    expect(crc32(big)).toBe(zlibCrc32(big));
    expect(crc32(new Uint8Array(1000))).toBe(zlibCrc32(new Uint8Array(1000)));
    expect(crc32(new Uint8Array(1000).fill(255))).toBe(zlibCrc32(new Uint8Array(1000).fill(255)));
  });

  it("continues from a seed as zlib's crc32(buf, value) does", () => {
    const bytes = randomBytes(3, 777);
    for (const cut of [0, 1, 13, 400, 777]) {
      const a = bytes.subarray(0, cut);
      const b = bytes.subarray(cut);
      expect(crc32(b, crc32(a))).toBe(crc32(bytes));
      expect(crc32(b, 0x12345678)).toBe(zlibCrc32(b, 0x12345678));
    }
  });

  it('detects every single-bit error (Peterson and Brown, 1961, "Cyclic codes for error detection", Proc. IRE)', () => {
    const bytes = randomBytes(4, 256);
    const clean = crc32(bytes);
    for (let bit = 0; bit < bytes.length * 8; bit++) {
      bytes[bit >> 3]! ^= 1 << (bit & 7);
      expect(crc32(bytes)).not.toBe(clean);
      bytes[bit >> 3]! ^= 1 << (bit & 7);
    }
  });
});
