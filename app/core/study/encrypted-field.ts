import { z } from 'zod';

/**
 * A personal field at rest: AES-GCM ciphertext under the lab's data key (app/core/crypto).
 * Only these fields are encrypted; pseudonymous research data (codes, gaze, quality) is
 * not, so analysis works without the passphrase.
 */
export const encryptedField = z.object({
  alg: z.literal('AES-GCM-256'),
  /** Which data key encrypted it (changes when the passphrase changes and fields are re-encrypted). */
  keyId: z.string(),
  iv: z.string(),
  ct: z.string(),
});

export type EncryptedField = z.infer<typeof encryptedField>;
