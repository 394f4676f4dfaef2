import type { WebCryptoKey } from './web-crypto-types';
import { base64UrlToBytes, bytesToBase64Url } from './base64';
import { KeyringDamagedError } from './keyring-damaged-error';
import { RECOVERY_SECRET_BYTES } from './recovery-key-text';

/**
 * The recovery slot: ECDH on P-256 (NIST SP 800-56A) between a fresh ephemeral key and the
 * lab's recovery key pair, HKDF-SHA256 (RFC 5869) from the shared secret to an AES-GCM-256
 * key-encryption key. Only the recovery *public* key is stored, so a new data key (after a
 * passphrase change) can be wrapped for recovery without the paper recovery key; only the
 * private key, written on paper, can unwrap it.
 */
const P256 = { name: 'ECDH', namedCurve: 'P-256' } as const;
const HKDF_INFO = new TextEncoder().encode('gazeloom recovery wrap v1');

export type EcPublicJwk = { kty: 'EC'; crv: 'P-256'; x: string; y: string };

export async function newRecoveryKeyPair(): Promise<{ publicJwk: EcPublicJwk; secret: Uint8Array<ArrayBuffer> }> {
  const pair = await globalThis.crypto.subtle.generateKey(P256, true, ['deriveBits']);
  const jwk = await globalThis.crypto.subtle.exportKey('jwk', pair.privateKey);
  const secret = base64UrlToBytes(jwk.d ?? '');
  if (secret === null || secret.length !== RECOVERY_SECRET_BYTES) throw new Error('Web Crypto exported a P-256 private key that is not 32 bytes');
  return { publicJwk: publicPart(jwk, 'generated key'), secret };
}

/** A key-encryption key for `recoveryPublicJwk`, with the ephemeral public key to store beside the wrap. */
export async function recoveryWrapKek(recoveryPublicJwk: Record<string, unknown>): Promise<{ kek: WebCryptoKey; ephemeralPublicJwk: EcPublicJwk }> {
  const subtle = globalThis.crypto.subtle;
  const ephemeral = await subtle.generateKey(P256, true, ['deriveBits']);
  const recoveryPublic = await importPublic(recoveryPublicJwk, 'recoveryPublicJwk');
  const kek = await sharedKek(ephemeral.privateKey, recoveryPublic);
  return { kek, ephemeralPublicJwk: publicPart(await subtle.exportKey('jwk', ephemeral.publicKey), 'ephemeral key') };
}

/** The key-encryption key for unwrapping, or null when `secret` is not the private half of `recoveryPublicJwk`. */
export async function recoveryUnwrapKek(secret: Uint8Array, recoveryPublicJwk: Record<string, unknown>, ephemeralPublicJwk: Record<string, unknown>): Promise<WebCryptoKey | null> {
  // Both public keys are checked first, so that a damaged keyring is not taken for a wrong recovery key.
  await importPublic(recoveryPublicJwk, 'recoveryPublicJwk');
  const ephemeralPublic = await importPublic(ephemeralPublicJwk, 'ephemeralPublicJwk');
  let recoveryPrivate: WebCryptoKey;
  try {
    const jwk = { ...publicPart(recoveryPublicJwk, 'recoveryPublicJwk'), d: bytesToBase64Url(secret) };
    recoveryPrivate = await globalThis.crypto.subtle.importKey('jwk', jwk, P256, false, ['deriveBits']);
  } catch (error) {
    // Node refuses a private scalar that does not match the public point (DataError); browsers may accept it and fail at unwrap.
    if (error instanceof Error && error.name === 'DataError') return null;
    throw error;
  }
  return sharedKek(recoveryPrivate, ephemeralPublic);
}

async function sharedKek(privateKey: WebCryptoKey, publicKey: WebCryptoKey): Promise<WebCryptoKey> {
  const subtle = globalThis.crypto.subtle;
  const shared = await subtle.deriveBits({ name: 'ECDH', public: publicKey }, privateKey, 256);
  const base = await subtle.importKey('raw', shared, 'HKDF', false, ['deriveKey']);
  const params = { name: 'HKDF', hash: 'SHA-256', salt: new Uint8Array(0), info: HKDF_INFO };
  return subtle.deriveKey(params, base, { name: 'AES-GCM', length: 256 }, false, ['wrapKey', 'unwrapKey']);
}

async function importPublic(jwk: Record<string, unknown>, field: string): Promise<WebCryptoKey> {
  try {
    return await globalThis.crypto.subtle.importKey('jwk', publicPart(jwk, field), P256, false, []);
  } catch (error) {
    if (error instanceof Error && error.name === 'DataError') throw new KeyringDamagedError(`keyring: ${field} is not a point on P-256`);
    throw error;
  }
}

/** Only the public coordinates, checked: a stored key that is not a P-256 public key means a damaged keyring. */
function publicPart(jwk: object, field: string): EcPublicJwk {
  const { kty, crv, x, y } = jwk as Record<string, unknown>;
  if (kty !== 'EC' || crv !== 'P-256' || typeof x !== 'string' || typeof y !== 'string') {
    throw new KeyringDamagedError(`keyring: ${field} is not a P-256 public key (expected kty "EC", crv "P-256", x and y)`);
  }
  return { kty, crv, x, y };
}
