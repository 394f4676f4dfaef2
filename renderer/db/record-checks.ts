import { tables, type RecordOf, type TableName } from '../../app/core/study/records';

/** A record about to be stored, checked against its schema; a failure is a bug in the caller, so it throws. */
export function checkRecord<T extends TableName>(table: T, record: unknown): RecordOf<T> {
  const parsed = tables[table].safeParse(record);
  if (parsed.success) return parsed.data as RecordOf<T>;
  const issue = parsed.error.issues[0]!;
  const path = issue.path.map((part) => (typeof part === 'number' ? `[${part}]` : `.${String(part)}`)).join('');
  throw new RangeError(`${table}${path}: ${issue.message}`);
}

/** True when every [field, value] pair equals the record's field (values compared as JSON, so nested objects work). */
export function matches(record: object, where: readonly [string, unknown][]): boolean {
  const fields = record as Record<string, unknown>;
  return where.every(([key, value]) => JSON.stringify(fields[key]) === JSON.stringify(value));
}
