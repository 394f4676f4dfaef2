import { randomBytes as nodeRandomBytes } from 'node:crypto';
import type { DataKey } from '../../../../app/core/crypto/data-key';

/** Hex to bytes, for test vectors. */
export const hex = (text: string): Uint8Array<ArrayBuffer> => Uint8Array.from(Buffer.from(text.replace(/\s+/g, ''), 'hex'));

/** A data key from known bytes, so Node's own AES-GCM can check what was written (no PBKDF2 needed). */
export async function dataKeyFromBytes(keyId: string, raw: Uint8Array<ArrayBuffer>): Promise<DataKey> {
  const key = await globalThis.crypto.subtle.importKey('raw', raw, { name: 'AES-GCM' }, false, ['encrypt', 'decrypt']);
  return { keyId, key };
}

export const randomBytes = (n: number): Uint8Array<ArrayBuffer> => Uint8Array.from(nodeRandomBytes(n));
