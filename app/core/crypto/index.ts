export { type DataKey } from './data-key';
export { decryptText, encryptText, openText, sealText } from './field-cipher';
export { KeyringDamagedError } from './keyring-damaged-error';
export { createKeyring, rekey, unlockWithPassphrase, unlockWithRecoveryKey } from './lab-keyring';
export { KDF_ITERATIONS } from './passphrase-kdf';
export { personalFieldPaths, reencryptRecord } from './personal-fields';
export { readRecoveryKey, type RecoveryKeyReading } from './recovery-key-text';
export { WrongKeyError } from './wrong-key-error';
