/**
 * Base64 (RFC 4648 §4, with padding) for ciphertexts stored in records, and base64url
 * (RFC 4648 §5, no padding) for JSON Web Keys. Decoding is strict: anything that is not
 * canonical base64 returns null rather than being guessed at.
 */
const STANDARD = /^(?:[A-Za-z0-9+/]{4})*(?:[A-Za-z0-9+/]{2}==|[A-Za-z0-9+/]{3}=)?$/;
const URL_SAFE = /^[A-Za-z0-9_-]*$/;

export function bytesToBase64(bytes: Uint8Array): string {
  let binary = '';
  // In slices, so that String.fromCharCode never gets more arguments than the engine allows.
  for (let i = 0; i < bytes.length; i += 0x8000) binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(binary);
}

export function base64ToBytes(text: string): Uint8Array<ArrayBuffer> | null {
  if (!STANDARD.test(text)) return null;
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

export function bytesToBase64Url(bytes: Uint8Array): string {
  return bytesToBase64(bytes).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

export function base64UrlToBytes(text: string): Uint8Array<ArrayBuffer> | null {
  if (!URL_SAFE.test(text) || text.length % 4 === 1) return null;
  const padded = text.replace(/-/g, '+').replace(/_/g, '/') + '='.repeat((4 - (text.length % 4)) % 4);
  return base64ToBytes(padded);
}
