import { createDecipheriv, createPrivateKey, createPublicKey, diffieHellman, hkdfSync, pbkdf2Sync } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import type { DataKey } from '../../../../app/core/crypto/data-key';
import { decryptText, encryptText } from '../../../../app/core/crypto/field-cipher';
import { KeyringDamagedError } from '../../../../app/core/crypto/keyring-damaged-error';
import { createKeyring, rekey, unlockWithPassphrase, unlockWithRecoveryKey } from '../../../../app/core/crypto/lab-keyring';
import { readRecoveryKey } from '../../../../app/core/crypto/recovery-key-text';
import { type KeyringRecord, keyringRecord } from '../../../../app/core/study/records';

const PASSPHRASE = 'beacon turns twice per second';
const NOW = '2026-03-02T08:00:00.000Z';
let lab: { keyring: KeyringRecord; dataKey: DataKey; recoveryKey: string };
let other: { keyring: KeyringRecord; dataKey: DataKey; recoveryKey: string };

beforeAll(async () => {
  lab = await createKeyring(PASSPHRASE, { demo: false, now: NOW });
  other = await createKeyring('gazeloom-demo', { demo: true });
});

/** AES-256-GCM with Node's OpenSSL binding: base64 iv and ciphertext+tag, UTF-8 additional data. */
function nodeOpen(key: Buffer, wrapped: { iv: string; ct: string }, aad = ''): Buffer {
  const sealed = Buffer.from(wrapped.ct, 'base64');
  const decipher = createDecipheriv('aes-256-gcm', key, Buffer.from(wrapped.iv, 'base64')).setAAD(Buffer.from(aad, 'utf8')).setAuthTag(sealed.subarray(-16));
  return Buffer.concat([decipher.update(sealed.subarray(0, -16)), decipher.final()]);
}

describe('createKeyring', () => {
  it('writes a keyring record that validates, with the iteration count, salt, times and demo flag', () => {
    expect(keyringRecord.parse(lab.keyring)).toEqual(lab.keyring);
    expect(lab.keyring.kdf).toMatchObject({ alg: 'PBKDF2-SHA256', iterations: 600_000 });
    expect(Buffer.from(lab.keyring.kdf.salt, 'base64').length).toBe(16);
    expect(lab.keyring).toMatchObject({ keyId: lab.dataKey.keyId, demo: false, createdAt: NOW, updatedAt: NOW });
    expect(other.keyring.demo).toBe(true);
    expect(other.keyring.kdf.salt).not.toBe(lab.keyring.kdf.salt);
    expect(lab.dataKey.key.extractable).toBe(false);
  });

  it('stores only the public half of the recovery key and shows the private half once as 13 groups', () => {
    expect(Object.keys(lab.keyring.wrappedByRecovery.recoveryPublicJwk).sort()).toEqual(['crv', 'kty', 'x', 'y']);
    expect(Object.keys(lab.keyring.wrappedByRecovery.ephemeralPublicJwk).sort()).toEqual(['crv', 'kty', 'x', 'y']);
    expect(lab.recoveryKey.split('-')).toHaveLength(13);
    const secret = readRecoveryKey(lab.recoveryKey);
    expect(secret.ok).toBe(true);
    if (secret.ok) expect(JSON.stringify(lab.keyring)).not.toContain(Buffer.from(secret.secret).toString('base64url'));
  });

  it('refuses an empty passphrase', async () => {
    await expect(createKeyring('', { demo: false })).rejects.toThrow(RangeError);
  });

  it("follows the documented format: Node's pbkdf2Sync and AES-256-GCM open the passphrase slot and the check", () => {
    const kek = pbkdf2Sync(PASSPHRASE, Buffer.from(lab.keyring.kdf.salt, 'base64'), lab.keyring.kdf.iterations, 32, 'sha256');
    const dataKey = nodeOpen(kek, lab.keyring.wrappedByPassphrase, `gazeloom keyring v1|passphrase|${lab.keyring.keyId}`);
    expect(dataKey.length).toBe(32);
    expect(nodeOpen(dataKey, lab.keyring.check).toString('utf8')).toBe('gazeloom keyring check');
  });

  it("follows the documented format: Node's ECDH P-256 and HKDF-SHA256 open the recovery slot", () => {
    const reading = readRecoveryKey(lab.recoveryKey);
    if (!reading.ok) throw new Error(reading.message);
    const slot = lab.keyring.wrappedByRecovery;
    const privateKey = createPrivateKey({ key: { ...slot.recoveryPublicJwk, d: Buffer.from(reading.secret).toString('base64url') }, format: 'jwk' });
    const publicKey = createPublicKey({ key: slot.ephemeralPublicJwk, format: 'jwk' });
    const shared = diffieHellman({ privateKey, publicKey });
    const kek = Buffer.from(hkdfSync('sha256', shared, Buffer.alloc(0), 'gazeloom recovery wrap v1', 32));
    const dataKey = nodeOpen(kek, slot, `gazeloom keyring v1|recovery|${lab.keyring.keyId}`);
    expect(nodeOpen(dataKey, lab.keyring.check).toString('utf8')).toBe('gazeloom keyring check');
  });
});

describe('unlockWithPassphrase', () => {
  it('gives back a non-extractable key that opens fields written at set-up', async () => {
    const field = await encryptText(lab.dataKey, 'Ada Forklift');
    const key = await unlockWithPassphrase(lab.keyring, PASSPHRASE);
    expect(key?.keyId).toBe(lab.keyring.keyId);
    expect(key?.key.extractable).toBe(false);
    expect(await decryptText(key!, field)).toBe('Ada Forklift');
  });

  it('returns null for a wrong passphrase, and for a passphrase slot copied from another keyring', async () => {
    expect(await unlockWithPassphrase(lab.keyring, 'beacon turns twice per secon')).toBeNull();
    expect(await unlockWithPassphrase({ ...lab.keyring, wrappedByPassphrase: other.keyring.wrappedByPassphrase, kdf: other.keyring.kdf }, 'gazeloom-demo')).toBeNull();
  });

  it('opens with the same passphrase typed with decomposed accents (Unicode NFC)', async () => {
    const accented = await createKeyring('caf\u00e9 au bout de l\u2019all\u00e9e', { demo: false });
    expect(await unlockWithPassphrase(accented.keyring, 'cafe\u0301 au bout de l\u2019alle\u0301e')).not.toBeNull();
  });

  it('throws KeyringDamagedError, not null, when the record itself is broken', async () => {
    await expect(unlockWithPassphrase({ ...lab.keyring, check: other.keyring.check }, PASSPHRASE)).rejects.toBeInstanceOf(KeyringDamagedError);
    await expect(unlockWithPassphrase({ ...lab.keyring, kdf: { ...lab.keyring.kdf, salt: 'no salt!' } }, PASSPHRASE)).rejects.toBeInstanceOf(KeyringDamagedError);
    await expect(unlockWithPassphrase({ ...lab.keyring, wrappedByPassphrase: { iv: '', ct: '' } }, PASSPHRASE)).rejects.toBeInstanceOf(KeyringDamagedError);
  });
});

describe('unlockWithRecoveryKey', () => {
  it('opens the keyring with the recovery key, typed in lower case without hyphens', async () => {
    const key = await unlockWithRecoveryKey(lab.keyring, lab.recoveryKey.toLowerCase().replace(/-/g, ''));
    expect(key?.keyId).toBe(lab.keyring.keyId);
    expect(await decryptText(key!, await encryptText(lab.dataKey, 'parcel'))).toBe('parcel');
  });

  it("returns null for another keyring's recovery key and for a mistyped one", async () => {
    expect(await unlockWithRecoveryKey(lab.keyring, other.recoveryKey)).toBeNull();
    const typo = lab.recoveryKey[0] === 'A' ? `B${lab.recoveryKey.slice(1)}` : `A${lab.recoveryKey.slice(1)}`;
    expect(await unlockWithRecoveryKey(lab.keyring, typo)).toBeNull();
  });

  it('throws KeyringDamagedError for a stored recovery public key that is not a P-256 key', async () => {
    const slot = { ...lab.keyring.wrappedByRecovery, recoveryPublicJwk: { kty: 'RSA', n: 'AQAB' } };
    await expect(unlockWithRecoveryKey({ ...lab.keyring, wrappedByRecovery: slot }, lab.recoveryKey)).rejects.toBeInstanceOf(KeyringDamagedError);
    for (const name of ['ephemeralPublicJwk', 'recoveryPublicJwk'] as const) {
      const jwk = lab.keyring.wrappedByRecovery[name];
      const offCurve = { ...lab.keyring.wrappedByRecovery, [name]: { ...jwk, y: jwk.x } };
      await expect(unlockWithRecoveryKey({ ...lab.keyring, wrappedByRecovery: offCurve }, lab.recoveryKey), name).rejects.toThrow(`${name} is not a point on P-256`);
    }
  });
});

describe('rekey', () => {
  let changed: { keyring: KeyringRecord; dataKey: DataKey };
  const LATER = '2026-04-01T10:00:00.000Z';
  beforeAll(async () => {
    changed = await rekey(lab.keyring, 'conveyor belt at dawn', { now: LATER });
  });

  it('makes a new data key under the new passphrase; the old passphrase no longer opens it', async () => {
    expect(keyringRecord.parse(changed.keyring)).toEqual(changed.keyring);
    expect(changed.dataKey.keyId).not.toBe(lab.dataKey.keyId);
    expect(changed.keyring).toMatchObject({ keyId: changed.dataKey.keyId, createdAt: NOW, updatedAt: LATER, demo: false });
    expect(changed.keyring.kdf.iterations).toBeGreaterThanOrEqual(600_000);
    expect(changed.keyring.kdf.salt).not.toBe(lab.keyring.kdf.salt);
    expect(await unlockWithPassphrase(changed.keyring, PASSPHRASE)).toBeNull();
    expect((await unlockWithPassphrase(changed.keyring, 'conveyor belt at dawn'))?.keyId).toBe(changed.dataKey.keyId);
  });

  it('keeps the same recovery key working, now opening the new data key', async () => {
    expect(changed.keyring.wrappedByRecovery.recoveryPublicJwk).toEqual(lab.keyring.wrappedByRecovery.recoveryPublicJwk);
    expect(changed.keyring.wrappedByRecovery.ephemeralPublicJwk).not.toEqual(lab.keyring.wrappedByRecovery.ephemeralPublicJwk);
    const key = await unlockWithRecoveryKey(changed.keyring, lab.recoveryKey);
    expect(key?.keyId).toBe(changed.dataKey.keyId);
    expect(await decryptText(key!, await encryptText(changed.dataKey, 'Sam Shift'))).toBe('Sam Shift');
  });
});
