import { createCipheriv } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { GCM_IV_BYTES, gcmOpen, gcmSeal, randomIv } from '../../../../app/core/crypto/aes-gcm';
import { hex, randomBytes } from './test-keys';

const importAes = (raw: Uint8Array<ArrayBuffer>) => globalThis.crypto.subtle.importKey('raw', raw, { name: 'AES-GCM' }, false, ['encrypt', 'decrypt']);

// McGrew & Viega (2004), "The Galois/Counter Mode of Operation (GCM)", Appendix B, the
// AES-256 test cases with a 96-bit IV (Test Cases 13 to 16).
const K16 = 'feffe9928665731c6d6a8f9467308308feffe9928665731c6d6a8f9467308308';
const P16 = 'd9313225f88406e5a55909c5aff5269a86a7a9531534f7da2e4c303d8a318a72' + '1c3c0c95956809532fcf0e2449a6b525b16aedf5aa0de657ba637b39';
const C16 = '522dc1f099567d07f47f37a32a84427d643a8cdcbfe5c0c97598a2bd2555d1aa' + '8cb08e48590dbb3da7b08b1056828838c5f61e6393ba7a0abcc9f662';
const cases = [
  { name: 'Test Case 13', k: '00'.repeat(32), iv: '00'.repeat(12), p: '', a: '', c: '', t: '530f8afbc74536b9a963b4f1c4cb738b' },
  { name: 'Test Case 14', k: '00'.repeat(32), iv: '00'.repeat(12), p: '00'.repeat(16), a: '', c: 'cea7403d4d606b6e074ec5d3baf39d18', t: 'd0d1c8a799996bf0265b98b5d48ab919' },
  { name: 'Test Case 15', k: K16, iv: 'cafebabefacedbaddecaf888', p: `${P16}1aafd255`, a: '', c: `${C16}898015ad`, t: 'b094dac5d93471bdec1a502270e3cc6c' },
  { name: 'Test Case 16', k: K16, iv: 'cafebabefacedbaddecaf888', p: P16, a: 'feedfacedeadbeeffeedfacedeadbeefabaddad2', c: C16, t: '76fc6ece0f4e1768cddf8853bb2d551b' },
];

describe('gcmSeal and gcmOpen', () => {
  for (const tc of cases) {
    it(`reproduce GCM spec ${tc.name} (AES-256, 96-bit IV)`, async () => {
      const key = await importAes(hex(tc.k));
      const sealed = await gcmSeal(key, hex(tc.iv), hex(tc.p), hex(tc.a));
      expect(Buffer.from(sealed).toString('hex')).toBe(tc.c + tc.t);
      expect(await gcmOpen(key, hex(tc.iv), sealed, hex(tc.a))).toEqual(hex(tc.p));
    });
  }

  it("agree with Node's AES-256-GCM (OpenSSL) on random keys, data and additional data", async () => {
    for (const length of [0, 1, 15, 16, 17, 1000]) {
      const raw = randomBytes(32);
      const iv = randomIv();
      const plain = randomBytes(length);
      const aad = randomBytes(length % 7);
      const cipher = createCipheriv('aes-256-gcm', raw, iv).setAAD(aad);
      const expected = Buffer.concat([cipher.update(plain), cipher.final(), cipher.getAuthTag()]);
      expect(await gcmSeal(await importAes(raw), iv, plain, aad), `length ${length}`).toEqual(Uint8Array.from(expected));
    }
  });

  it('return null, not a throw, when the tag, ciphertext, IV, additional data or key is wrong', async () => {
    const key = await importAes(hex(K16));
    const iv = hex('cafebabefacedbaddecaf888');
    const aad = hex('feedfacedeadbeef');
    const sealed = await gcmSeal(key, iv, hex(P16), aad);
    const flipped = (bytes: Uint8Array<ArrayBuffer>, at: number) => bytes.map((b, i) => (i === at ? b ^ 1 : b));
    expect(await gcmOpen(key, iv, flipped(sealed, sealed.length - 1), aad)).toBeNull();
    expect(await gcmOpen(key, iv, flipped(sealed, 0), aad)).toBeNull();
    expect(await gcmOpen(key, flipped(iv, 5), sealed, aad)).toBeNull();
    expect(await gcmOpen(key, iv, sealed, flipped(aad, 2))).toBeNull();
    expect(await gcmOpen(key, iv, sealed)).toBeNull();
    expect(await gcmOpen(await importAes(randomBytes(32)), iv, sealed, aad)).toBeNull();
    expect(await gcmOpen(key, iv, sealed.subarray(0, 15), aad)).toBeNull();
    expect(await gcmOpen(key, iv.subarray(0, 8), sealed, aad)).toBeNull();
  });

  it('draws a fresh 96-bit IV each time', () => {
    const ivs = new Set(Array.from({ length: 100 }, () => Buffer.from(randomIv()).toString('hex')));
    expect(ivs.size).toBe(100);
    expect(randomIv().length).toBe(GCM_IV_BYTES);
  });
});
