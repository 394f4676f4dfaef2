import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createKeyring, decryptText, unlockWithPassphrase, unlockWithRecoveryKey, type DataKey } from '../../../../app/core/crypto';
import type { KeyringRecord } from '../../../../app/core/study/records';
import { LabDatabase } from '../../../../renderer/db/lab-database';
import { LabImportError, LabStore } from '../../../../renderer/db/lab-store';
import { consent, participant, study } from './lab-records';

const audit = { operatorId: 'op-1', action: 'test', summary: 'fields: name' };
let ring: { keyring: KeyringRecord; dataKey: DataKey; recoveryKey: string };
const open: LabDatabase[] = [];

function freshStore(): LabStore {
  const db = new LabDatabase('lab-test', { indexedDB: new IDBFactory(), IDBKeyRange });
  open.push(db);
  let n = 0;
  return new LabStore(db, { newId: () => `audit-${++n}`, now: () => new Date('2026-03-10T08:00:00.000Z') });
}

beforeAll(async () => {
  ring = await createKeyring('correct horse battery staple', { demo: false, now: '2026-03-01T09:00:00.000Z' });
});
afterEach(() => {
  for (const db of open.splice(0)) db.close();
});

describe('LabStore', () => {
  it('validates every record and writes its audit record in the same transaction', async () => {
    const store = freshStore();
    await store.put('studies', study, audit);
    expect(await store.get('studies', study.id)).toEqual(study);
    expect(await store.list('audit')).toEqual([{ id: 'audit-1', at: '2026-03-10T08:00:00.000Z', operatorId: 'op-1', action: 'test', table: 'studies', recordId: study.id, summary: 'fields: name' }]);

    const bad = { ...study, id: 'study-2', name: '' };
    await expect(store.put('studies', bad, audit)).rejects.toThrow('studies.name');
    expect(await store.get('studies', 'study-2')).toBeUndefined();
    expect(await store.list('audit')).toHaveLength(1);
  });

  it('writes several records in one transaction, or none of them', async () => {
    const store = freshStore();
    const p1 = await participant(ring.dataKey, 'p-1', 1, 'Ada Marsh');
    const broken = { ...(await participant(ring.dataKey, 'p-2', 2, 'Ben Ode')), enrolment: 0 };
    await expect(store.putMany([{ table: 'studies', record: study }, { table: 'participants', record: p1 }, { table: 'participants', record: broken }], audit)).rejects.toThrow('participants.enrolment');
    expect(await store.isEmpty()).toBe(true);

    await store.putMany([{ table: 'studies', record: study }, { table: 'participants', record: p1 }], audit);
    expect((await store.list('audit')).map((a) => a.table)).toEqual(['studies', 'participants']);
  });

  it('lists by any field, through an index or not', async () => {
    const store = freshStore();
    for (const [i, name] of ['Ada Marsh', 'Ben Ode', 'Cy Lund'].entries()) await store.put('participants', await participant(ring.dataKey, `p-${i + 1}`, i + 1, name), audit);
    expect((await store.list('participants', { studyId: study.id })).map((p) => p.id)).toEqual(['p-1', 'p-2', 'p-3']);
    expect((await store.list('participants', { enrolment: 2 })).map((p) => p.id)).toEqual(['p-2']);
    expect(await store.list('participants', { studyId: 'another' })).toEqual([]);
  });

  it('exports every table as NDJSON and restores it into an empty database only', async () => {
    const source = freshStore();
    await source.put('settings', ring.keyring, audit);
    await source.put('studies', study, audit);
    await source.put('participants', await participant(ring.dataKey, 'p-1', 1, 'Ada Marsh'), audit);
    await source.put('consents', await consent(ring.dataKey, 'c-1', 'p-1', true), audit);
    const tables = await source.exportTables();
    expect(tables.participants.split('\n')).toHaveLength(2); // one line and the final newline
    expect(tables.participants).not.toContain('Ada');

    const target = freshStore();
    await target.importTables(tables);
    expect(await target.exportTables()).toEqual(tables);
    const name = (await target.get('participants', 'p-1'))!.name!;
    expect(await decryptText(ring.dataKey, name)).toBe('Ada Marsh');

    await expect(target.importTables(tables)).rejects.toThrow(LabImportError);
    await expect(target.importTables(tables)).rejects.toThrow('only restored into an empty profile');
  });

  it('refuses a damaged table before writing anything, naming the file and line', async () => {
    const source = freshStore();
    await source.put('studies', study, audit);
    await source.put('participants', await participant(ring.dataKey, 'p-1', 1, 'Ada Marsh'), audit);
    const tables = await source.exportTables();
    const damaged = { ...tables, participants: `${tables.participants}{"id":"p-2"}\n` };
    const target = freshStore();
    await expect(target.importTables(damaged)).rejects.toThrow('tables/participants.ndjson:2');
    await expect(target.importTables({ ...tables, visitors: '' })).rejects.toThrow('unknown table visitors');
    expect(await target.isEmpty()).toBe(true);
  });
});

describe('changing the passphrase', () => {
  async function filledStore(): Promise<LabStore> {
    const store = freshStore();
    await store.put('settings', ring.keyring, audit);
    await store.put('operators', { id: 'op-1', name: await decryptable('Operator One'), createdAt: '2026-03-01T09:00:00.000Z' }, audit);
    for (const [i, name] of ['Ada Marsh', 'Ben Ode'].entries()) await store.put('participants', await participant(ring.dataKey, `p-${i + 1}`, i + 1, name), audit);
    await store.put('consents', await consent(ring.dataKey, 'c-1', 'p-1', true), audit);
    return store;
  }
  const decryptable = async (text: string) => (await import('../../../../app/core/crypto')).encryptText(ring.dataKey, text);

  it('re-encrypts every personal field under a new key in one go; the recovery key still opens it', async () => {
    const store = await filledStore();
    const phases: string[] = [];
    const newKey = await store.changePassphrase(ring.dataKey, 'a brand new passphrase', (p) => phases.push(p.phase), 'op-1');
    expect(newKey.keyId).not.toBe(ring.dataKey.keyId);
    expect(phases[0]).toBe('deriving');
    expect(phases.filter((p) => p === 'encrypting')).toHaveLength(4); // 1 operator, 2 participants, 1 consent
    expect(phases.at(-1)).toBe('writing');

    const keyring = (await store.keyring())!;
    expect(keyring.keyId).toBe(newKey.keyId);
    expect(await unlockWithPassphrase(keyring, 'correct horse battery staple')).toBeNull();
    const reopened = (await unlockWithPassphrase(keyring, 'a brand new passphrase'))!;
    const byRecovery = (await unlockWithRecoveryKey(keyring, ring.recoveryKey))!;
    expect(byRecovery.keyId).toBe(newKey.keyId);

    const p2 = (await store.get('participants', 'p-2'))!;
    expect(p2.name!.keyId).toBe(newKey.keyId);
    expect(await decryptText(reopened, p2.name!)).toBe('Ben Ode');
    const c1 = (await store.get('consents', 'c-1'))!;
    expect(await decryptText(reopened, c1.withdrawal!.note!)).toBe('moved away');
    expect(await decryptText(byRecovery, (await store.get('operators', 'op-1'))!.name!)).toBe('Operator One');
    const log = await store.list('audit', { action: 'change_passphrase' });
    expect(log).toMatchObject([{ table: 'settings', recordId: 'keyring', operatorId: 'op-1' }]);
    expect(log[0]!.summary).not.toMatch(/Ada|Ben/);
  });

  it('a failure while writing leaves the old key and every field as they were', async () => {
    const store = await filledStore();
    const before = await store.exportTables();
    // The disk fails when the consents table is written (after operators and participants).
    store.db.close();
    store.db.use({
      stack: 'dbcore',
      name: 'failing-disk',
      create: (down) => ({
        ...down,
        table: (name) => {
          const table = down.table(name);
          return name === 'consents' ? { ...table, mutate: (req) => (req.type === 'put' ? Promise.reject(new Error('disk full')) : table.mutate(req)) } : table;
        },
      }),
    });
    await store.db.open();
    await expect(store.changePassphrase(ring.dataKey, 'a brand new passphrase')).rejects.toThrow('disk full');
    expect(await store.exportTables()).toEqual(before);
    const keyring = (await store.keyring())!;
    const oldKey = (await unlockWithPassphrase(keyring, 'correct horse battery staple'))!;
    expect(await decryptText(oldKey, (await store.get('participants', 'p-1'))!.name!)).toBe('Ada Marsh');
  });
});
