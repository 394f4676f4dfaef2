import type { EncryptedField } from '../study/encrypted-field';
import type { RecordOf, TableName } from '../study/records';
import type { DataKey } from './data-key';
import { decryptText, encryptText } from './field-cipher';

/**
 * Where personal data lives: the encrypted fields of each table, as dotted paths. Everything
 * else (codes, demographics kept for release, gaze, quality) is pseudonymous and stays
 * readable without the passphrase. A test walks the schemas to keep this list complete.
 */
export const personalFieldPaths: Partial<Record<TableName, readonly string[]>> = {
  operators: ['name'],
  participants: ['name', 'contact', 'birthDate', 'notes'],
  consents: ['signatureRef', 'note', 'withdrawal.note'],
  notes: ['text'],
};

/**
 * A copy of `record` with every personal field moved from key `from` to key `to`. Fields
 * already under `to` are left as they are, so an interrupted change can be run again.
 * Throws WrongKeyError for a field under neither key.
 */
export async function reencryptRecord<T extends TableName>(table: T, record: RecordOf<T>, from: DataKey, to: DataKey): Promise<RecordOf<T>> {
  const copy = structuredClone(record);
  for (const path of personalFieldPaths[table] ?? []) {
    const parts = path.split('.');
    const leaf = parts.pop()!;
    let holder: unknown = copy;
    for (const part of parts) holder = (holder as Record<string, unknown> | null | undefined)?.[part];
    if (holder === null || holder === undefined) continue;
    const fields = holder as Record<string, EncryptedField | null>;
    const field = fields[leaf];
    if (field === null || field === undefined || field.keyId === to.keyId) continue;
    fields[leaf] = await encryptText(to, await decryptText(from, field));
  }
  return copy;
}
