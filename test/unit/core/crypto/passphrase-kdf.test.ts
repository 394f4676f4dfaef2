import { pbkdf2Sync } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { KDF_ITERATIONS, passphraseBytes, pbkdf2Sha256 } from '../../../../app/core/crypto/passphrase-kdf';
import { hex, randomBytes } from './test-keys';

const utf8 = (s: string) => new TextEncoder().encode(s);

describe('pbkdf2Sha256', () => {
  // Percival & Josefsson (2016), RFC 7914 "The scrypt Password-Based Key Derivation
  // Function", §11 "Test Vectors for PBKDF2 with HMAC-SHA-256".
  it('gives the RFC 7914 §11 vector for P="passwd", S="salt", c=1, dkLen=64', async () => {
    const dk = await pbkdf2Sha256(utf8('passwd'), utf8('salt'), 1, 64);
    expect(dk).toEqual(
      hex(`55 ac 04 6e 56 e3 08 9f ec 16 91 c2 25 44 b6 05 f9 41 85 21 6d de 04 65 e6 8b 9d 57 c2 0d ac bc
           49 ca 9c cc f1 79 b6 45 99 16 64 b3 9d 77 ef 31 7c 71 b8 45 b1 e3 0b d5 09 11 20 41 d3 a1 97 83`),
    );
  });

  it('gives the RFC 7914 §11 vector for P="Password", S="NaCl", c=80000, dkLen=64', async () => {
    const dk = await pbkdf2Sha256(utf8('Password'), utf8('NaCl'), 80000, 64);
    expect(dk).toEqual(
      hex(`4d dc d8 f6 0b 98 be 21 83 0c ee 5e f2 27 01 f9 64 1a 44 18 d0 4c 04 14 ae ff 08 87 6b 34 ab 56
           a1 d4 25 a1 22 58 33 54 9a db 84 1b 51 c9 b3 17 6a 27 2b de bb a1 d0 78 47 8f 62 b3 97 f3 3c 8d`),
    );
  });

  it("agrees with Node's pbkdf2Sync (OpenSSL, an independent implementation) on random inputs", async () => {
    for (const [length, iterations, bytes] of [[0, 1, 32], [5, 2, 20], [64, 1000, 32], [65, 3, 33], [200, 10, 96]] as const) {
      const password = randomBytes(length);
      const salt = randomBytes(16);
      const ours = await pbkdf2Sha256(password, salt, iterations, bytes);
      expect(ours, `password ${length} bytes, c=${iterations}`).toEqual(Uint8Array.from(pbkdf2Sync(password, salt, iterations, bytes, 'sha256')));
    }
  });

  it('agrees with pbkdf2Sync at the iteration count the keyring uses', async () => {
    const salt = randomBytes(16);
    const password = passphraseBytes('forklift crossing aisle 7');
    const ours = await pbkdf2Sha256(password, salt, KDF_ITERATIONS, 32);
    expect(ours).toEqual(Uint8Array.from(pbkdf2Sync(password, salt, KDF_ITERATIONS, 32, 'sha256')));
  });

  it('refuses iteration counts and lengths that are not positive integers, naming the parameter', async () => {
    await expect(pbkdf2Sha256(utf8('a'), utf8('b'), 0, 32)).rejects.toThrow(/iterations/);
    await expect(pbkdf2Sha256(utf8('a'), utf8('b'), 1.5, 32)).rejects.toThrow(RangeError);
    await expect(pbkdf2Sha256(utf8('a'), utf8('b'), 1, 0)).rejects.toThrow(/bytes/);
  });
});

describe('KDF_ITERATIONS and passphraseBytes', () => {
  it('uses at least the 600,000 iterations that OWASP recommends for PBKDF2-HMAC-SHA256', () => {
    // OWASP Password Storage Cheat Sheet (2023 revision and later).
    expect(KDF_ITERATIONS).toBeGreaterThanOrEqual(600_000);
  });

  it('encodes composed and decomposed accents alike (Unicode NFC), as UTF-8', () => {
    const composed = 'caf\u00e9 b\u00e9acon';
    const decomposed = 'cafe\u0301 be\u0301acon';
    expect(composed).not.toBe(decomposed);
    expect(passphraseBytes(decomposed)).toEqual(passphraseBytes(composed));
    expect(passphraseBytes(composed)).toEqual(Uint8Array.from(Buffer.from(composed, 'utf8')));
  });
});
