/**
 * The keyring record itself is broken (a field that cannot be decoded, or a data key that
 * does not open its own check): unlike a wrong passphrase, retrying will not help; restore
 * the keyring from a lab archive backup.
 */
export class KeyringDamagedError extends Error {
  override readonly name = 'KeyringDamagedError';
}
