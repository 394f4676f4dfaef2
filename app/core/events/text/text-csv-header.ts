import { EventFormatError } from '../event-format-error';
import type { TextTimeUnit } from './text-time-unit';

export interface CsvHeader {
  /** The role of each column in file order: 0 t, 1 x, 2 y, 3 p. */
  readonly roles: readonly number[];
  /** The unit the header names for t (t_us, t_ns, t_ms, t_s), or null for plain `t`. */
  readonly unit: TextTimeUnit | null;
}

const COLUMNS: Readonly<Record<string, { role: number; unit: TextTimeUnit | null }>> = {
  t: { role: 0, unit: null },
  t_us: { role: 0, unit: 'us' },
  t_ns: { role: 0, unit: 'ns' },
  t_ms: { role: 0, unit: 'ms' },
  t_s: { role: 0, unit: 's' },
  x: { role: 1, unit: null },
  y: { role: 2, unit: null },
  p: { role: 3, unit: null },
};
const ROLE_NAMES = ['t', 'x', 'y', 'p'];
const EXPECTED = 'expected the columns t, x, y, p in any order (t may be t_us, t_ns, t_ms or t_s)';

/** Reads a CSV header row such as `t_ns,x,y,p` or `x, y, t, p`. */
export function parseCsvHeader(file: string, lineNumber: number, text: string): CsvHeader {
  const where = `line ${lineNumber}`;
  const names = text.split(',').map((name) => name.trim().replace(/^"(.*)"$/, '$1').trim().toLowerCase());
  if (/^[-+.\d]/.test(names[0]!)) throw new EventFormatError(file, where, `a CSV file needs a header row naming its columns, e.g. 't,x,y,p'; ${EXPECTED}`);
  const roles: number[] = [];
  let unit: TextTimeUnit | null = null;
  for (const name of names) {
    const column = Object.hasOwn(COLUMNS, name) ? COLUMNS[name]! : undefined;
    if (!column) throw new EventFormatError(file, where, `unknown column '${name}' in the header; ${EXPECTED}`);
    if (roles.includes(column.role)) throw new EventFormatError(file, where, `the header names column ${ROLE_NAMES[column.role]} more than once`);
    roles.push(column.role);
    if (column.role === 0) unit = column.unit;
  }
  const missing = ROLE_NAMES.filter((_, role) => !roles.includes(role));
  if (missing.length > 0) throw new EventFormatError(file, where, `the header lacks column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}; ${EXPECTED}`);
  return { roles, unit };
}
