import Dexie from 'dexie';
import { decodeTable, encodeTable } from '../../app/core/archive';
import { personalFieldPaths, reencryptRecord, rekey, type DataKey } from '../../app/core/crypto';
import { tables, type KeyringRecord, type RecordOf, type TableName } from '../../app/core/study/records';
import type { LabDatabase } from './lab-database';
import { checkRecord, matches } from './record-checks';

export interface AuditNote {
  readonly operatorId: string | null;
  /** What was done, e.g. 'register', 'record_consent', 'withdraw'. */
  readonly action: string;
  /** What changed, by field name only: never a personal value. */
  readonly summary: string;
}

export interface Write<T extends TableName = TableName> {
  readonly table: T;
  readonly record: RecordOf<T>;
}

export type RekeyProgress = { phase: 'deriving' } | { phase: 'encrypting'; done: number; total: number } | { phase: 'writing' };

export interface LabStoreDeps {
  readonly now?: () => Date;
  readonly newId?: () => string;
}

const tableNames = Object.keys(tables) as TableName[];
const personalTables = Object.keys(personalFieldPaths) as TableName[];

/** A restore refused before anything was written: the database is as it was. */
export class LabImportError extends Error {
  override readonly name = 'LabImportError';
}

/** The records were changed by someone else while the passphrase change was prepared. */
class ChangedMeanwhile extends Error {}

/**
 * Every read and write of the lab's records. Each write is validated against
 * app/core/study/records.ts and carries its audit record in the same transaction, so the
 * log can never miss a change that was made.
 */
export class LabStore {
  private readonly now: () => Date;
  private readonly newId: () => string;
  private readonly listeners = new Set<(changed: readonly TableName[]) => void>();

  constructor(
    readonly db: LabDatabase,
    deps: LabStoreDeps = {},
  ) {
    this.now = deps.now ?? (() => new Date());
    this.newId = deps.newId ?? (() => globalThis.crypto.randomUUID());
  }

  /** Called after every committed write with the tables it changed; returns the unsubscribe. */
  subscribe(listener: (changed: readonly TableName[]) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private changed(names: readonly TableName[]): void {
    for (const listener of this.listeners) listener(names);
  }

  put<T extends TableName>(table: T, record: RecordOf<T>, audit: AuditNote): Promise<void> {
    return this.putMany([{ table, record }], audit);
  }

  /** Several records and one audit record per record, in one transaction. */
  async putMany(writes: readonly Write[], audit: AuditNote): Promise<void> {
    const checked = writes.map((w) => ({ table: w.table, record: checkRecord(w.table, w.record) }));
    const at = this.now().toISOString();
    const auditRecords = checked.map((w) => checkRecord('audit', { id: this.newId(), at, operatorId: audit.operatorId, action: audit.action, table: w.table, recordId: w.record.id, summary: audit.summary }));
    const involved = [...new Set([...checked.map((w) => w.table), 'audit' as const])];
    await this.db.transaction('rw', involved, async () => {
      for (const w of checked) await this.db.table(w.table).put(w.record);
      await this.db.tableOf('audit').bulkAdd(auditRecords);
    });
    this.changed(involved);
  }

  /** Deletes one record, with its audit record, in one transaction. */
  async remove(table: TableName, id: string, audit: AuditNote): Promise<void> {
    const record = checkRecord('audit', { id: this.newId(), at: this.now().toISOString(), operatorId: audit.operatorId, action: audit.action, table, recordId: id, summary: audit.summary });
    await this.db.transaction('rw', [table, 'audit'], async () => {
      await this.db.tableOf(table).delete(id);
      await this.db.tableOf('audit').add(record);
    });
    this.changed([table, 'audit']);
  }

  get<T extends TableName>(table: T, id: string): Promise<RecordOf<T> | undefined> {
    return this.db.tableOf(table).get(id) as Promise<RecordOf<T> | undefined>;
  }

  /** The records whose fields equal `where` (all of them without it), through an index where there is one. */
  async list<T extends TableName>(table: T, where: Partial<RecordOf<T>> = {}): Promise<RecordOf<T>[]> {
    const dexieTable = this.db.tableOf(table);
    const entries = Object.entries(where) as [string, unknown][];
    const indexed = entries.find(([key, value]) => dexieTable.schema.idxByName[key] && (typeof value === 'string' || typeof value === 'number'));
    const candidates = indexed ? await dexieTable.where(indexed[0]).equals(indexed[1] as string).toArray() : await dexieTable.toArray();
    return (candidates as RecordOf<T>[]).filter((record) => matches(record, entries));
  }

  async keyring(): Promise<KeyringRecord | undefined> {
    return this.db.tableOf('settings').get('keyring');
  }

  /** True when no table holds a record: the only state a lab archive may be restored into. */
  async isEmpty(): Promise<boolean> {
    for (const name of tableNames) if ((await this.db.tableOf(name).count()) > 0) return false;
    return true;
  }

  /**
   * A new data key wrapped by the new passphrase (and by the unchanged recovery key), and
   * every personal field re-encrypted with it, all written in ONE transaction: a failure
   * anywhere leaves the old key and every field as they were. Crypto runs before the
   * transaction (IndexedDB transactions end when they wait on anything else).
   */
  async changePassphrase(oldKey: DataKey, newPassphrase: string, onProgress: (progress: RekeyProgress) => void = () => {}, operatorId: string | null = null): Promise<DataKey> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await this.rekeyOnce(oldKey, newPassphrase, onProgress, operatorId);
      } catch (error) {
        if (!(error instanceof ChangedMeanwhile) || attempt === 3) throw error;
      }
    }
  }

  private async rekeyOnce(oldKey: DataKey, newPassphrase: string, onProgress: (progress: RekeyProgress) => void, operatorId: string | null): Promise<DataKey> {
    const keyring = await this.keyring();
    if (!keyring) throw new Error('changePassphrase: the lab has no keyring yet');
    if (keyring.keyId !== oldKey.keyId) throw new Error(`changePassphrase: the open key ${oldKey.keyId} is not the lab's key ${keyring.keyId}`);
    onProgress({ phase: 'deriving' });
    const at = this.now().toISOString();
    const next = await rekey(keyring, newPassphrase, { now: at });
    const before = new Map<TableName, unknown[]>();
    const after = new Map<TableName, unknown[]>();
    for (const name of personalTables) before.set(name, await this.db.tableOf(name).toArray());
    const total = [...before.values()].reduce((n, records) => n + records.length, 0);
    let done = 0;
    for (const [name, records] of before) {
      const reencrypted: unknown[] = [];
      for (const record of records) {
        reencrypted.push(checkRecord(name, await reencryptRecord(name, record as never, oldKey, next.dataKey)));
        onProgress({ phase: 'encrypting', done: ++done, total });
      }
      after.set(name, reencrypted);
    }
    onProgress({ phase: 'writing' });
    const newKeyring = checkRecord('settings', next.keyring);
    const audit = checkRecord('audit', { id: this.newId(), at, operatorId, action: 'change_passphrase', table: 'settings', recordId: 'keyring', summary: `new data key; ${total} records re-encrypted` });
    await this.db.transaction('rw', ['settings', 'audit', ...personalTables], async () => {
      const current = await this.db.tableOf('settings').get('keyring');
      if (JSON.stringify(current) !== JSON.stringify(keyring)) throw new ChangedMeanwhile();
      for (const [name, records] of before) {
        if (JSON.stringify(await this.db.tableOf(name).toArray()) !== JSON.stringify(records)) throw new ChangedMeanwhile();
      }
      for (const [name, records] of after) await this.db.table(name).bulkPut(records);
      await this.db.tableOf('settings').put(newKeyring);
      await this.db.tableOf('audit').add(audit);
    });
    this.changed(['settings', 'audit', ...personalTables]);
    return next.dataKey;
  }

  /** Every table as NDJSON (personal fields stay encrypted), in archive order. */
  async exportTables(): Promise<Record<TableName, string>> {
    const out = {} as Record<TableName, string>;
    await this.db.transaction('r', tableNames, async () => {
      for (const name of tableNames) out[name] = encodeTable(name, await this.db.tableOf(name).toArray());
    });
    return out;
  }

  /**
   * Restores exported tables into an EMPTY database. Every table is decoded and checked
   * before anything is written, then all are written in one transaction. Refusals are
   * LabImportErrors that name the file and line.
   */
  async importTables(input: Record<string, string>): Promise<void> {
    const unknown = Object.keys(input).filter((name) => !(name in tables));
    if (unknown.length > 0) throw new LabImportError(`unknown table${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')} (expected ${tableNames.join(', ')})`);
    const decoded = new Map<TableName, unknown[]>();
    for (const name of tableNames) {
      const text = input[name] ?? '';
      try {
        decoded.set(name, decodeTable(name, text, `tables/${name}.ndjson`));
      } catch (error) {
        throw new LabImportError((error as Error).message);
      }
    }
    await this.db.transaction('rw', tableNames, async () => {
      for (const name of tableNames) {
        if ((await this.db.tableOf(name).count()) > 0) throw new LabImportError(`this profile already holds ${name}: a lab archive is only restored into an empty profile`);
      }
      for (const [name, records] of decoded) await this.db.table(name).bulkAdd(records);
    }).catch((error: unknown) => {
      // Dexie wraps errors thrown inside a transaction; keep ours as they were.
      if (error instanceof Dexie.AbortError && error.inner instanceof LabImportError) throw error.inner;
      throw error;
    });
    this.changed(tableNames);
  }
}
