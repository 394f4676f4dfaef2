/**
 * Web Crypto's types, taken from `crypto.subtle` itself: the same names exist in browsers
 * and in Node 20, but only the DOM and WebWorker libraries declare them globally, and the
 * Node-side type check (tsconfig.node.json) has neither.
 */
type Subtle = typeof globalThis.crypto.subtle;

export type WebCryptoKey = Awaited<ReturnType<Subtle['importKey']>>;
/** The KeyUsage enumeration of the Web Cryptography API (W3C Recommendation, 2017). */
export type WebCryptoKeyUsage = 'encrypt' | 'decrypt' | 'sign' | 'verify' | 'deriveKey' | 'deriveBits' | 'wrapKey' | 'unwrapKey';
