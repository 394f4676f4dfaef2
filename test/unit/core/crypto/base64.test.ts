import { describe, expect, it } from 'vitest';
import { base64ToBytes, base64UrlToBytes, bytesToBase64, bytesToBase64Url } from '../../../../app/core/crypto/base64';
import { randomBytes } from './test-keys';

const utf8 = (s: string) => new TextEncoder().encode(s);

describe('base64', () => {
  it('gives the RFC 4648 §10 test vectors', () => {
    // Josefsson (2006), RFC 4648 "The Base16, Base32, and Base64 Data Encodings", §10.
    const vectors: [string, string][] = [['', ''], ['f', 'Zg=='], ['fo', 'Zm8='], ['foo', 'Zm9v'], ['foob', 'Zm9vYg=='], ['fooba', 'Zm9vYmE='], ['foobar', 'Zm9vYmFy']];
    for (const [plain, encoded] of vectors) {
      expect(bytesToBase64(utf8(plain))).toBe(encoded);
      expect(base64ToBytes(encoded)).toEqual(utf8(plain));
    }
  });

  it("agrees with Node's Buffer for both alphabets at every length up to 300 bytes and for 200 kB", () => {
    for (const length of [...Array.from({ length: 301 }, (_, n) => n), 200_000]) {
      const bytes = randomBytes(length);
      expect(bytesToBase64(bytes)).toBe(Buffer.from(bytes).toString('base64'));
      expect(bytesToBase64Url(bytes)).toBe(Buffer.from(bytes).toString('base64url'));
      expect(base64ToBytes(bytesToBase64(bytes))).toEqual(bytes);
      expect(base64UrlToBytes(bytesToBase64Url(bytes))).toEqual(bytes);
    }
  });

  it('refuses text that is not canonical base64 instead of guessing', () => {
    for (const bad of ['Zg', 'Zg=', 'Z===', 'Zm9v\n', 'Zm 9v', 'Zm9v-_', '====', 'Zg==Zg==']) expect(base64ToBytes(bad), bad).toBeNull();
    for (const bad of ['Z', 'Zm9v+', 'Zg==', 'Zm9v/']) expect(base64UrlToBytes(bad), bad).toBeNull();
  });
});
