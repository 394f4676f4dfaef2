import Dexie, { type Table } from 'dexie';
import type { RecordOf, TableName } from '../../app/core/study/records';
import { storesV1, storesV2, storesV3 } from './schema-versions';
import { numberEnrolments } from './upgrades';

export type LabTables = { [T in TableName]: Table<RecordOf<T>, string> };

export interface IndexedDbDeps {
  readonly indexedDB: IDBFactory;
  readonly IDBKeyRange: typeof IDBKeyRange;
}

/**
 * The console's lab database (IndexedDB through Dexie), one table per record type of
 * app/core/study/records.ts. Every transaction is committed with strict durability:
 * consents, withdrawals and sessions must survive a power cut, and Chromium otherwise
 * reports a commit before it reaches the disk.
 */
export class LabDatabase extends Dexie {
  constructor(name = 'gazeloom-lab', deps?: IndexedDbDeps) {
    super(name, { chromeTransactionDurability: 'strict', ...(deps ? { indexedDB: deps.indexedDB, IDBKeyRange: deps.IDBKeyRange } : {}) });
    this.version(1).stores(storesV1);
    this.version(2)
      .stores(storesV2)
      .upgrade(async (tx) => {
        const participants = tx.table('participants');
        await participants.bulkPut(numberEnrolments(await participants.toArray()));
      });
    this.version(3).stores(storesV3);
  }

  /** The typed table for a record type. */
  tableOf<T extends TableName>(name: T): LabTables[T] {
    return this.table(name) as LabTables[T];
  }
}
