import { encryptText, openText, type DataKey } from '../../../app/core/crypto';
import type { RecordOf } from '../../../app/core/study/records';
import type { LabStore } from '../../db/lab-store';

/** Every operator with the name decrypted, in the order they were added. */
export async function operatorNames(store: LabStore, key: DataKey): Promise<{ id: string; name: string }[]> {
  const operators = (await store.list('operators')).sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return Promise.all(operators.map(async (o) => ({ id: o.id, name: (await openText(key, o.name)) ?? '(no name)' })));
}

/** A new operator, the name encrypted; the audit names the operator as the one who made the change. */
export async function addOperator(store: LabStore, key: DataKey, name: string): Promise<RecordOf<'operators'>> {
  const record: RecordOf<'operators'> = { id: `op-${globalThis.crypto.randomUUID()}`, name: await encryptText(key, name.trim()), createdAt: new Date().toISOString() };
  await store.put('operators', record, { operatorId: record.id, action: 'add_operator', summary: 'fields: name' });
  return record;
}
