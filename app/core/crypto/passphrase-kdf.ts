import type { WebCryptoKey } from './web-crypto-types';
/**
 * The passphrase's key-encryption key: PBKDF2-HMAC-SHA256 (RFC 8018 §5.2) with a random
 * salt. 600,000 iterations is the OWASP Password Storage Cheat Sheet's recommendation for
 * PBKDF2-HMAC-SHA256; the count is stored with each keyring so it can be raised later.
 */
export const KDF_ITERATIONS = 600_000;
export const KDF_SALT_BYTES = 16;
const KEK_BYTES = 32;

/**
 * The passphrase as UTF-8 after Unicode normalization (NFC), so that the same passphrase
 * typed on systems that compose accents differently gives the same key.
 */
export function passphraseBytes(passphrase: string): Uint8Array<ArrayBuffer> {
  return new TextEncoder().encode(passphrase.normalize('NFC'));
}

export async function pbkdf2Sha256(password: Uint8Array<ArrayBuffer>, salt: Uint8Array<ArrayBuffer>, iterations: number, bytes: number): Promise<Uint8Array<ArrayBuffer>> {
  if (!Number.isInteger(iterations) || iterations < 1) throw new RangeError(`iterations: expected a positive integer, got ${iterations}`);
  if (!Number.isInteger(bytes) || bytes < 1) throw new RangeError(`bytes: expected a positive integer, got ${bytes}`);
  const subtle = globalThis.crypto.subtle;
  const base = await subtle.importKey('raw', password, 'PBKDF2', false, ['deriveBits']);
  return new Uint8Array(await subtle.deriveBits({ name: 'PBKDF2', hash: 'SHA-256', salt, iterations }, base, bytes * 8));
}

/** An AES-GCM-256 key that can only wrap and unwrap keys. */
export async function derivePassphraseKek(passphrase: string, salt: Uint8Array<ArrayBuffer>, iterations: number): Promise<WebCryptoKey> {
  const bits = await pbkdf2Sha256(passphraseBytes(passphrase), salt, iterations, KEK_BYTES);
  return globalThis.crypto.subtle.importKey('raw', bits, { name: 'AES-GCM' }, false, ['wrapKey', 'unwrapKey']);
}
