import type { WebCryptoKey, WebCryptoKeyUsage } from './web-crypto-types';
import { GCM_TAG_BYTES, randomIv } from './aes-gcm';
import { base64ToBytes, bytesToBase64 } from './base64';
import { KeyringDamagedError } from './keyring-damaged-error';

/** The lab's AES-GCM-256 key for personal fields, with the id that fields record. */
export interface DataKey {
  readonly keyId: string;
  readonly key: WebCryptoKey;
}

/** A data key encrypted by a key-encryption key (AES-GCM key wrap). */
export interface WrappedKey {
  iv: string;
  ct: string;
}

const AES_256 = { name: 'AES-GCM', length: 256 } as const;
const USES: WebCryptoKeyUsage[] = ['encrypt', 'decrypt'];

/**
 * A wrap is bound to its data key's id and to what wrapped it, so a wrap copied from another
 * keyring or from the other slot does not open.
 */
function wrapContext(keyId: string, slot: 'passphrase' | 'recovery'): Uint8Array<ArrayBuffer> {
  return new TextEncoder().encode(`gazeloom keyring v1|${slot}|${keyId}`);
}

/**
 * A new random data key: `dataKey` cannot be exported, `wrap` seals the same key under a
 * key-encryption key (only wrapping needs an extractable copy, which the caller drops).
 */
export async function newDataKey(): Promise<{ dataKey: DataKey; wrap: (kek: WebCryptoKey, slot: 'passphrase' | 'recovery') => Promise<WrappedKey> }> {
  const subtle = globalThis.crypto.subtle;
  const keyId = `dk-${globalThis.crypto.randomUUID()}`;
  const extractable = await subtle.generateKey(AES_256, true, USES);
  const raw = new Uint8Array(await subtle.exportKey('raw', extractable));
  const key = await subtle.importKey('raw', raw, AES_256, false, USES);
  raw.fill(0);
  const wrap = async (kek: WebCryptoKey, slot: 'passphrase' | 'recovery'): Promise<WrappedKey> => {
    const iv = randomIv();
    const ct = await subtle.wrapKey('raw', extractable, kek, { name: 'AES-GCM', iv, additionalData: wrapContext(keyId, slot) });
    return { iv: bytesToBase64(iv), ct: bytesToBase64(new Uint8Array(ct)) };
  };
  return { dataKey: { keyId, key }, wrap };
}

/** The data key, non-extractable, or null when this key-encryption key does not open the wrap. */
export async function unwrapDataKey(keyId: string, wrapped: WrappedKey, kek: WebCryptoKey, slot: 'passphrase' | 'recovery'): Promise<DataKey | null> {
  const iv = base64ToBytes(wrapped.iv);
  const ct = base64ToBytes(wrapped.ct);
  if (iv === null || ct === null || ct.length < GCM_TAG_BYTES) throw new KeyringDamagedError(`keyring: the key wrapped by the ${slot} (iv, ct) is not valid base64 of the expected length`);
  try {
    const params = { name: 'AES-GCM', iv, additionalData: wrapContext(keyId, slot) };
    const key = await globalThis.crypto.subtle.unwrapKey('raw', ct, kek, params, AES_256, false, USES);
    return { keyId, key };
  } catch (error) {
    // A failed tag check (wrong passphrase or recovery key) is an OperationError.
    if (error instanceof Error && error.name === 'OperationError') return null;
    throw error;
  }
}
