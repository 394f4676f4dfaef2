import type { KeyringRecord } from '../study/records';
import { base64ToBytes, bytesToBase64 } from './base64';
import { type DataKey, newDataKey, unwrapDataKey } from './data-key';
import { decryptText, encryptText } from './field-cipher';
import { KeyringDamagedError } from './keyring-damaged-error';
import { derivePassphraseKek, KDF_ITERATIONS, KDF_SALT_BYTES } from './passphrase-kdf';
import { formatRecoveryKey, readRecoveryKey } from './recovery-key-text';
import { newRecoveryKeyPair, recoveryUnwrapKek, recoveryWrapKek } from './recovery-wrap';
import { WrongKeyError } from './wrong-key-error';

/**
 * The lab's keyring: one data key for every personal field, wrapped twice, by the
 * passphrase (PBKDF2) and by the recovery key written on paper (ECDH). Wrong secrets give
 * null; a keyring that is itself broken throws KeyringDamagedError.
 */
const CHECK_TEXT = 'gazeloom keyring check';

export async function createKeyring(passphrase: string, opts: { demo: boolean; now?: string }): Promise<{ keyring: KeyringRecord; dataKey: DataKey; recoveryKey: string }> {
  const recovery = await newRecoveryKeyPair();
  const now = opts.now ?? new Date().toISOString();
  const { keyring, dataKey } = await sealNewDataKey(passphrase, recovery.publicJwk, { demo: opts.demo, createdAt: now, updatedAt: now });
  return { keyring, dataKey, recoveryKey: formatRecoveryKey(recovery.secret) };
}

export async function unlockWithPassphrase(keyring: KeyringRecord, passphrase: string): Promise<DataKey | null> {
  const salt = base64ToBytes(keyring.kdf.salt);
  if (salt === null) throw new KeyringDamagedError('keyring: kdf.salt is not valid base64');
  const kek = await derivePassphraseKek(passphrase, salt, keyring.kdf.iterations);
  return checked(keyring, await unwrapDataKey(keyring.keyId, keyring.wrappedByPassphrase, kek, 'passphrase'));
}

/** Null for a key that does not open this keyring; readRecoveryKey tells a typing error first. */
export async function unlockWithRecoveryKey(keyring: KeyringRecord, recoveryKey: string): Promise<DataKey | null> {
  const reading = readRecoveryKey(recoveryKey);
  if (!reading.ok) return null;
  const slot = keyring.wrappedByRecovery;
  const kek = await recoveryUnwrapKek(reading.secret, slot.recoveryPublicJwk, slot.ephemeralPublicJwk);
  return kek === null ? null : checked(keyring, await unwrapDataKey(keyring.keyId, slot, kek, 'recovery'));
}

/**
 * A new data key under a new passphrase, wrapped for the same recovery key. Every personal
 * field must then be re-encrypted (reencryptRecord) in the same transaction that stores it.
 */
export async function rekey(keyring: KeyringRecord, newPassphrase: string, opts: { now?: string } = {}): Promise<{ keyring: KeyringRecord; dataKey: DataKey }> {
  const times = { demo: keyring.demo, createdAt: keyring.createdAt, updatedAt: opts.now ?? new Date().toISOString() };
  return sealNewDataKey(newPassphrase, keyring.wrappedByRecovery.recoveryPublicJwk, times);
}

async function sealNewDataKey(passphrase: string, recoveryPublicJwk: Record<string, unknown>, rest: Pick<KeyringRecord, 'demo' | 'createdAt' | 'updatedAt'>): Promise<{ keyring: KeyringRecord; dataKey: DataKey }> {
  if (passphrase.length === 0) throw new RangeError('passphrase: must not be empty');
  const salt = globalThis.crypto.getRandomValues(new Uint8Array(KDF_SALT_BYTES));
  const { dataKey, wrap } = await newDataKey();
  const passphraseKek = await derivePassphraseKek(passphrase, salt, KDF_ITERATIONS);
  const recovery = await recoveryWrapKek(recoveryPublicJwk);
  const keyring: KeyringRecord = {
    id: 'keyring',
    version: 1,
    keyId: dataKey.keyId,
    kdf: { alg: 'PBKDF2-SHA256', iterations: KDF_ITERATIONS, salt: bytesToBase64(salt) },
    wrappedByPassphrase: await wrap(passphraseKek, 'passphrase'),
    wrappedByRecovery: { recoveryPublicJwk: { ...recoveryPublicJwk }, ephemeralPublicJwk: { ...recovery.ephemeralPublicJwk }, ...(await wrap(recovery.kek, 'recovery')) },
    check: await encryptText(dataKey, CHECK_TEXT),
    ...rest,
  };
  return { keyring, dataKey };
}

/** An unwrapped key must also open the keyring's check field; if it does not, the record is inconsistent. */
async function checked(keyring: KeyringRecord, dataKey: DataKey | null): Promise<DataKey | null> {
  if (dataKey === null) return null;
  try {
    if ((await decryptText(dataKey, keyring.check)) === CHECK_TEXT) return dataKey;
  } catch (error) {
    if (!(error instanceof WrongKeyError)) throw error;
  }
  throw new KeyringDamagedError('keyring: the data key opens but does not match the check field');
}
