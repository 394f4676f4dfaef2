/**
 * A personal field that this data key cannot open: it names another key, or it fails
 * AES-GCM authentication (another key with the same id, or a damaged field).
 */
export class WrongKeyError extends Error {
  override readonly name = 'WrongKeyError';

  constructor(
    readonly reason: 'other_key' | 'not_authentic',
    message: string,
  ) {
    super(message);
  }
}
