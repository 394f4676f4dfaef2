import type { WebCryptoKey } from './web-crypto-types';
/**
 * AES-GCM (NIST SP 800-38D) through Web Crypto with a 96-bit IV and a 128-bit tag, the
 * only parameters used here. The output is the ciphertext followed by the tag, as Web
 * Crypto returns it.
 */
export const GCM_IV_BYTES = 12;
export const GCM_TAG_BYTES = 16;

const NO_DATA = new Uint8Array(0);

export function randomIv(): Uint8Array<ArrayBuffer> {
  return globalThis.crypto.getRandomValues(new Uint8Array(GCM_IV_BYTES));
}

export async function gcmSeal(key: WebCryptoKey, iv: Uint8Array<ArrayBuffer>, plaintext: Uint8Array<ArrayBuffer>, additionalData = NO_DATA): Promise<Uint8Array<ArrayBuffer>> {
  const params = { name: 'AES-GCM', iv, additionalData, tagLength: GCM_TAG_BYTES * 8 };
  return new Uint8Array(await globalThis.crypto.subtle.encrypt(params, key, plaintext));
}

/** The plaintext, or null when authentication fails (wrong key, wrong IV or data, damage). */
export async function gcmOpen(key: WebCryptoKey, iv: Uint8Array<ArrayBuffer>, sealed: Uint8Array<ArrayBuffer>, additionalData = NO_DATA): Promise<Uint8Array<ArrayBuffer> | null> {
  if (iv.length !== GCM_IV_BYTES || sealed.length < GCM_TAG_BYTES) return null;
  const params = { name: 'AES-GCM', iv, additionalData, tagLength: GCM_TAG_BYTES * 8 };
  try {
    return new Uint8Array(await globalThis.crypto.subtle.decrypt(params, key, sealed));
  } catch (error) {
    // Web Crypto reports a failed tag check as an OperationError; anything else is a bug.
    if (error instanceof Error && error.name === 'OperationError') return null;
    throw error;
  }
}
