import { createDecipheriv } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { decryptText, encryptText, openText, sealText } from '../../../../app/core/crypto/field-cipher';
import { WrongKeyError } from '../../../../app/core/crypto/wrong-key-error';
import { encryptedField } from '../../../../app/core/study/encrypted-field';
import { dataKeyFromBytes, randomBytes } from './test-keys';

const texts = ['', 'Ada Forklift', 'ada@example.org', '1990-04-01', 'Zoë Ñúñez — 名前 🚚', 'x'.repeat(20_000)];

async function wrongKeyReason(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof WrongKeyError) return error.reason;
    throw error;
  }
  throw new Error('expected a WrongKeyError');
}

describe('encryptText and decryptText', () => {
  it('round-trip any text, and write fields that match the record schema', async () => {
    const key = await dataKeyFromBytes('dk-a', randomBytes(32));
    for (const text of texts) {
      const field = await encryptText(key, text);
      expect(encryptedField.parse(field)).toEqual(field);
      expect(field).toMatchObject({ alg: 'AES-GCM-256', keyId: 'dk-a' });
      expect(await decryptText(key, field)).toBe(text);
    }
  });

  it("write AES-256-GCM that Node's own decipher (OpenSSL) opens: ciphertext then 16-byte tag, base64", async () => {
    const raw = randomBytes(32);
    const field = await encryptText(await dataKeyFromBytes('dk-a', raw), 'Parcel on conveyor 3, seen by Ada');
    const iv = Buffer.from(field.iv, 'base64');
    const sealed = Buffer.from(field.ct, 'base64');
    expect(iv.length).toBe(12);
    const decipher = createDecipheriv('aes-256-gcm', raw, iv).setAuthTag(sealed.subarray(-16));
    const plain = Buffer.concat([decipher.update(sealed.subarray(0, -16)), decipher.final()]).toString('utf8');
    expect(plain).toBe('Parcel on conveyor 3, seen by Ada');
  });

  it('use a fresh IV each time, so the same text never gives the same ciphertext', async () => {
    const key = await dataKeyFromBytes('dk-a', randomBytes(32));
    const a = await encryptText(key, 'same name');
    const b = await encryptText(key, 'same name');
    expect(a.iv).not.toBe(b.iv);
    expect(a.ct).not.toBe(b.ct);
  });

  it('throw WrongKeyError for a field under another key id, another key with the same id, or a damaged field', async () => {
    const raw = randomBytes(32);
    const key = await dataKeyFromBytes('dk-a', raw);
    const field = await encryptText(key, 'Ada');
    expect(await wrongKeyReason(decryptText(await dataKeyFromBytes('dk-b', raw), field))).toBe('other_key');
    expect(await wrongKeyReason(decryptText(await dataKeyFromBytes('dk-a', randomBytes(32)), field))).toBe('not_authentic');
    const ct = Buffer.from(field.ct, 'base64');
    ct[0]! ^= 0x80;
    expect(await wrongKeyReason(decryptText(key, { ...field, ct: ct.toString('base64') }))).toBe('not_authentic');
    expect(await wrongKeyReason(decryptText(key, { ...field, iv: 'not base64!' }))).toBe('not_authentic');
    expect(await wrongKeyReason(decryptText(key, { ...field, iv: field.ct }))).toBe('not_authentic');
  });
});

describe('sealText and openText', () => {
  it('pass null through and otherwise encrypt and decrypt', async () => {
    const key = await dataKeyFromBytes('dk-a', randomBytes(32));
    expect(await sealText(key, null)).toBeNull();
    expect(await openText(key, null)).toBeNull();
    const field = await sealText(key, 'glasses since 2010');
    expect(field).not.toBeNull();
    expect(await openText(key, field)).toBe('glasses since 2010');
  });
});
