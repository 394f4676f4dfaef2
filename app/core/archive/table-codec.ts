import { tables, type RecordOf, type TableName } from '../study/records';
import { ArchiveFormatError } from './archive-error';
import { firstIssue } from './issue-path';

/**
 * One table as NDJSON: each record checked against its schema in records.ts, written as one
 * JSON object per line with "\n" after each (an empty table is the empty string).
 * A record that fails throws a RangeError naming its position and field.
 */
export function encodeTable<T extends TableName>(table: T, records: readonly unknown[]): string {
  const schema = tables[table];
  let out = '';
  records.forEach((record, i) => {
    const parsed = schema.safeParse(record);
    if (!parsed.success) throw new RangeError(`${table}[${i}]: ${firstIssue(parsed.error)}`);
    out += `${JSON.stringify(parsed.data)}\n`;
  });
  return out;
}

/**
 * Reads a table back. Every line must be one valid record; ids must be unique. Errors are
 * ArchiveFormatErrors naming `file:line` and the field path. A missing final newline is
 * accepted (a hand-edited file), blank lines are not.
 */
export function decodeTable<T extends TableName>(table: T, text: string, file: string): RecordOf<T>[] {
  const schema = tables[table];
  const lines = text.endsWith('\n') ? text.slice(0, -1).split('\n') : text.split('\n');
  if (text === '') return [];
  const seen = new Map<string, number>();
  return lines.map((line, i) => {
    const lineNo = i + 1;
    let raw: unknown;
    try {
      raw = JSON.parse(line);
    } catch (error) {
      throw new ArchiveFormatError(file, line.trim() === '' ? 'blank line (expected one JSON record per line)' : `not valid JSON (${(error as Error).message})`, lineNo);
    }
    const parsed = schema.safeParse(raw);
    if (!parsed.success) throw new ArchiveFormatError(file, firstIssue(parsed.error), lineNo);
    const id = (parsed.data as { id: string }).id;
    const earlier = seen.get(id);
    if (earlier !== undefined) throw new ArchiveFormatError(file, `id "${id}" appears again (first on line ${earlier})`, lineNo);
    seen.set(id, lineNo);
    return parsed.data as RecordOf<T>;
  });
}

/** How many records a table's NDJSON holds (its lines). */
export const countRecords = (text: string): number => (text === '' ? 0 : text.split('\n').length - (text.endsWith('\n') ? 1 : 0));
