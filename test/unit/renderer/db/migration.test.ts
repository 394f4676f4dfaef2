import { readFileSync } from 'node:fs';
import Dexie from 'dexie';
import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import { decryptText, unlockWithPassphrase } from '../../../../app/core/crypto';
import { tables, type TableName } from '../../../../app/core/study/records';
import { LabDatabase } from '../../../../renderer/db/lab-database';
import { checkRecord } from '../../../../renderer/db/record-checks';
import { LATEST_VERSION, storesV1 } from '../../../../renderer/db/schema-versions';
import { numberEnrolments } from '../../../../renderer/db/upgrades';
import { dumpDatabase, loadDatabase, type DatabaseDump } from '../../../fixtures/db/idb-dump';

// A database written by schema version 1, frozen (made by test/fixtures/db/make-lab-v1.ts).
const fixture = JSON.parse(readFileSync('test/fixtures/db/lab-v1.json', 'utf8')) as { passphrase: string; database: DatabaseDump };
const v1 = fixture.database;
const recordsOf = (dump: DatabaseDump, table: string) => dump.stores.find((s) => s.name === table)!.records as Record<string, unknown>[];

async function migrated(): Promise<{ db: LabDatabase; dump: DatabaseDump }> {
  const factory = new IDBFactory();
  await loadDatabase(factory, v1);
  const db = new LabDatabase(v1.name, { indexedDB: factory, IDBKeyRange });
  await db.open();
  return { db, dump: await dumpDatabase(db.backendDB()) };
}

describe('the lab database migrates a version 1 database without loss', () => {
  it('the fixture has the layout version 1 declares (so version 1 was never edited)', async () => {
    const factory = new IDBFactory();
    const db = new Dexie('layout', { indexedDB: factory, IDBKeyRange });
    db.version(1).stores(storesV1);
    await db.open();
    const declared = await dumpDatabase(db.backendDB());
    db.close();
    expect(v1.version).toBe(10); // Dexie stores version N as IndexedDB version 10 N
    expect(v1.stores.map(({ name, keyPath, autoIncrement, indexes }) => ({ name, keyPath, autoIncrement, indexes }))).toEqual(
      declared.stores.map(({ name, keyPath, autoIncrement, indexes }) => ({ name, keyPath, autoIncrement, indexes })),
    );
    expect(recordsOf(v1, 'participants').every((p) => !('enrolment' in p))).toBe(true);
  });

  it('keeps every record of every table and numbers the participants in enrolment order', async () => {
    const { db, dump } = await migrated();
    expect(db.verno).toBe(LATEST_VERSION);
    for (const table of Object.keys(tables) as TableName[]) {
      // Tables added after version 1 (corrections in version 3) start empty.
      const before = v1.stores.some((s) => s.name === table) ? recordsOf(v1, table) : [];
      const after = recordsOf(dump, table);
      expect(after.length, table).toBe(before.length);
      // Every migrated record is valid under today's schemas.
      for (const record of after) expect(() => checkRecord(table, record), `${table} ${String(record.id)}`).not.toThrow();
      if (table !== 'participants') expect(after, table).toEqual(before);
    }
    const enrolments = Object.fromEntries(recordsOf(dump, 'participants').map((p) => [p.id, p.enrolment]));
    // st-aisle: p-a (Feb 3), then p-b and p-c (both Feb 5, by id); st-belt: p-d alone.
    expect(enrolments).toEqual({ 'p-a': 1, 'p-b': 2, 'p-c': 3, 'p-d': 1 });
    for (const p of recordsOf(dump, 'participants')) {
      const { enrolment, ...rest } = p;
      expect(enrolment).toBeTypeOf('number');
      expect(rest).toEqual(recordsOf(v1, 'participants').find((q) => q.id === p.id));
    }
    const participants = dump.stores.find((s) => s.name === 'participants')!;
    expect(participants.indexes.map((i) => i.name)).toContain('[studyId+enrolment]');
    expect(await db.table('participants').where('[studyId+enrolment]').equals(['st-aisle', 2]).primaryKeys()).toEqual(['p-b']);
    db.close();
  });

  it('the personal fields still open with the lab passphrase after the upgrade', async () => {
    const { db } = await migrated();
    const keyring = checkRecord('settings', await db.table('settings').get('keyring'));
    const key = (await unlockWithPassphrase(keyring, fixture.passphrase))!;
    expect(key).not.toBeNull();
    const names = await Promise.all((await db.table('participants').orderBy('[studyId+enrolment]').toArray()).map((p) => decryptText(key, p.name)));
    expect(names).toEqual(['Ola Berg', 'Ivo Sand', 'Mia Kron', 'Una Vik']);
    const withdrawn = checkRecord('consents', await db.table('consents').get('c-b'));
    expect(await decryptText(key, withdrawn.withdrawal!.note!)).toBe('changed their mind');
    db.close();
  });

  it('numbers enrolments per study, ties broken by id, whatever the input order', () => {
    const ps = [
      { id: 'b', studyId: 's1', createdAt: '2026-01-02' },
      { id: 'x', studyId: 's2', createdAt: '2026-01-01' },
      { id: 'a', studyId: 's1', createdAt: '2026-01-02' },
      { id: 'z', studyId: 's1', createdAt: '2026-01-01' },
    ];
    const numbered = Object.fromEntries(numberEnrolments(ps).map((p) => [p.id, p.enrolment]));
    expect(numbered).toEqual({ z: 1, a: 2, b: 3, x: 1 });
    expect(Object.fromEntries(numberEnrolments([...ps].reverse()).map((p) => [p.id, p.enrolment]))).toEqual(numbered);
  });
});
