import { readFileSync } from 'node:fs';
import Dexie from 'dexie';
import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import type { CorrectionRecord } from '../../../../app/core/study/records';
import { LabDatabase } from '../../../../renderer/db/lab-database';
import { checkRecord } from '../../../../renderer/db/record-checks';
import { storesV1, storesV2, storesV3 } from '../../../../renderer/db/schema-versions';
import { numberEnrolments } from '../../../../renderer/db/upgrades';
import { dumpDatabase, loadDatabase, type DatabaseDump } from '../../../fixtures/db/idb-dump';

// The frozen version 1 database (test/fixtures/db/make-lab-v1.ts), brought to version 2 with
// exactly the declarations version 2 shipped with, then opened by today's LabDatabase.
const fixture = JSON.parse(readFileSync('test/fixtures/db/lab-v1.json', 'utf8')) as { database: DatabaseDump };

async function versionTwo(): Promise<{ factory: IDBFactory; dump: DatabaseDump }> {
  const factory = new IDBFactory();
  await loadDatabase(factory, fixture.database);
  const db = new Dexie(fixture.database.name, { indexedDB: factory, IDBKeyRange });
  db.version(1).stores(storesV1);
  db.version(2)
    .stores(storesV2)
    .upgrade(async (tx) => {
      const participants = tx.table('participants');
      await participants.bulkPut(numberEnrolments(await participants.toArray()));
    });
  await db.open();
  const dump = await dumpDatabase(db.backendDB());
  db.close();
  return { factory, dump };
}

const correction: CorrectionRecord = {
  id: 'corr-1',
  sessionId: 's-1',
  model: 'offset',
  params: { dx: -12.5, dy: 4 },
  fromValidationIds: ['v-1'],
  heldOutValidationIds: ['v-2'],
  fit: { points: 9, rmsResidualPx: 3.1, heldOutErrorBeforeDeg: 1.4, heldOutErrorAfterDeg: 0.4 },
  createdAt: '2026-03-02T10:00:00.000Z',
  createdBy: 'op-1',
  enabled: true,
  removedAt: null,
};

describe('the lab database migrates version 2 to version 3', () => {
  it('keeps every store, index and record of version 2 and adds an empty corrections store', async () => {
    const { factory, dump: before } = await versionTwo();
    expect(before.version).toBe(20);
    expect(before.stores.map((s) => s.name)).not.toContain('corrections');
    const db = new LabDatabase(fixture.database.name, { indexedDB: factory, IDBKeyRange });
    await db.open();
    expect(db.verno).toBe(3);
    const after = await dumpDatabase(db.backendDB());
    expect(after.stores.filter((s) => s.name !== 'corrections')).toEqual(before.stores);
    const corrections = after.stores.find((s) => s.name === 'corrections')!;
    expect(corrections.records).toEqual([]);
    expect(corrections.indexes.map((i) => i.name)).toEqual(['sessionId']);
    db.close();
  });

  it('stores and finds corrections by session once upgraded', async () => {
    const { factory } = await versionTwo();
    const db = new LabDatabase(fixture.database.name, { indexedDB: factory, IDBKeyRange });
    await db.tableOf('corrections').put(checkRecord('corrections', correction));
    expect(await db.tableOf('corrections').where('sessionId').equals('s-1').toArray()).toEqual([correction]);
    db.close();
  });

  it('version 3 declares every table and changes no earlier store', () => {
    const { corrections, ...rest } = storesV3;
    expect(corrections).toBe('id, sessionId');
    expect(rest).toEqual(storesV2);
  });
});
