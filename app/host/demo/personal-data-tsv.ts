/** One demo participant's personal details and consent answers, from --personal-data. */
export interface DemoPersonalData {
  readonly name: string;
  readonly email: string;
  /** YYYY-MM-DD. */
  readonly birthDate: string;
  readonly consentNote: string;
  /** May be shared: in an anonymized public release and with named collaborators. */
  readonly share: boolean;
  readonly withdrawn: boolean;
}

export const PERSONAL_DATA_COLUMNS = ['name', 'email', 'birth_date', 'consent_note', 'share', 'withdrawn'] as const;

/** Bad --personal-data input: the message names the file, line and column. */
export class PersonalDataError extends Error {
  override name = 'PersonalDataError';
}

function yesNo(value: string, where: string): boolean {
  const v = value.trim().toLowerCase();
  if (v === 'yes') return true;
  if (v === 'no') return false;
  throw new PersonalDataError(`${where}: expected yes or no, got "${value}"`);
}

function birthDate(value: string, where: string): string {
  const v = value.trim();
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(v);
  const date = match ? new Date(Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]))) : null;
  if (!date || date.toISOString().slice(0, 10) !== v) throw new PersonalDataError(`${where}: expected a date as YYYY-MM-DD, got "${value}"`);
  return v;
}

/**
 * Reads the tab-separated file: a header line naming the six columns (any order), then one
 * line per participant. Blank lines at the end are ignored.
 */
export function parsePersonalDataTsv(text: string, file: string): DemoPersonalData[] {
  const lines = text.replace(/\r\n/g, '\n').split('\n');
  while (lines.length > 0 && lines.at(-1)!.trim() === '') lines.pop();
  if (lines.length === 0) throw new PersonalDataError(`${file}: empty; expected a header line (${PERSONAL_DATA_COLUMNS.join(', ')}) and one line per participant`);
  const header = lines[0]!.split('\t').map((h) => h.trim().toLowerCase());
  for (const column of PERSONAL_DATA_COLUMNS) {
    if (!header.includes(column)) throw new PersonalDataError(`${file}:1: no "${column}" column (expected tab-separated columns ${PERSONAL_DATA_COLUMNS.join(', ')})`);
  }
  return lines.slice(1).map((line, i) => {
    const lineNo = i + 2;
    const cells = line.split('\t');
    if (cells.length !== header.length) throw new PersonalDataError(`${file}:${lineNo}: ${cells.length} columns, the header has ${header.length}`);
    const cell = (column: (typeof PERSONAL_DATA_COLUMNS)[number]) => ({ value: cells[header.indexOf(column)]!, where: `${file}:${lineNo}: column "${column}"` });
    const required = (column: 'name' | 'email') => {
      const { value, where } = cell(column);
      if (value.trim() === '') throw new PersonalDataError(`${where}: empty`);
      if (column === 'email' && !/^[^@\s]+@[^@\s]+$/.test(value.trim())) throw new PersonalDataError(`${where}: expected an e-mail address, got "${value}"`);
      return value.trim();
    };
    return {
      name: required('name'),
      email: required('email'),
      birthDate: birthDate(cell('birth_date').value, cell('birth_date').where),
      consentNote: cell('consent_note').value.trim(),
      share: yesNo(cell('share').value, cell('share').where),
      withdrawn: yesNo(cell('withdrawn').value, cell('withdrawn').where),
    };
  });
}

/** The passphrase file's text with one trailing newline (\n or \r\n) removed. */
export function passphraseFromFile(text: string, file: string): string {
  const passphrase = text.endsWith('\r\n') ? text.slice(0, -2) : text.endsWith('\n') ? text.slice(0, -1) : text;
  if (passphrase === '') throw new PersonalDataError(`${file}: the passphrase is empty`);
  return passphrase;
}
