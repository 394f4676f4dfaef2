import type { EncryptedField } from '../study/encrypted-field';
import { gcmOpen, gcmSeal, randomIv } from './aes-gcm';
import { base64ToBytes, bytesToBase64 } from './base64';
import type { DataKey } from './data-key';
import { WrongKeyError } from './wrong-key-error';

/** One personal text field: AES-GCM-256 under the lab's data key, a fresh random 96-bit IV each time. */
export async function encryptText(key: DataKey, text: string): Promise<EncryptedField> {
  const iv = randomIv();
  const ct = await gcmSeal(key.key, iv, new TextEncoder().encode(text));
  return { alg: 'AES-GCM-256', keyId: key.keyId, iv: bytesToBase64(iv), ct: bytesToBase64(ct) };
}

/** The text, or WrongKeyError when the field names another key or does not authenticate. */
export async function decryptText(key: DataKey, field: EncryptedField): Promise<string> {
  if (field.keyId !== key.keyId) throw new WrongKeyError('other_key', `the field was encrypted with data key ${field.keyId}, not ${key.keyId}`);
  const iv = base64ToBytes(field.iv);
  const ct = base64ToBytes(field.ct);
  const plain = iv === null || ct === null ? null : await gcmOpen(key.key, iv, ct);
  if (plain === null) throw new WrongKeyError('not_authentic', `the field does not authenticate under data key ${key.keyId} (damaged, or another key with the same id)`);
  return new TextDecoder('utf-8', { fatal: true }).decode(plain);
}

/** encryptText for an optional field: null stays null. */
export function sealText(key: DataKey, text: string | null): Promise<EncryptedField | null> {
  return text === null ? Promise.resolve(null) : encryptText(key, text);
}

/** decryptText for an optional field: null stays null. */
export function openText(key: DataKey, field: EncryptedField | null): Promise<string | null> {
  return field === null ? Promise.resolve(null) : decryptText(key, field);
}
