/**
 * The two files a validation can be computed from, both tab-separated with a header row
 * (columns found by name, others ignored):
 *   GAZE.tsv     timestamp (s), x_coordinate and y_coordinate (screen px, origin top-left),
 *                optional pupil_size; "n/a" marks an invalid sample (the file `gazeloom
 *                recording export` writes)
 *   TARGETS.tsv  onset (s), duration (s), x and y (screen px), one target per row
 */

/** A line of a gaze or targets file that does not read, located for a person to fix. */
export class QualityFileError extends Error {
  override name = 'QualityFileError';

  constructor(
    readonly file: string,
    readonly line: number,
    readonly problem: string,
  ) {
    super(`${file}${line > 0 ? `:${line}` : ''}: ${problem}`);
  }
}

export interface GazeRow {
  readonly timeS: number;
  /** Screen px; NaN for an invalid sample. */
  readonly x: number;
  readonly y: number;
  readonly valid: boolean;
}

export interface TargetRow {
  readonly onsetS: number;
  readonly durationS: number;
  readonly x: number;
  readonly y: number;
  /** The row's line in the file (the header is line 1). */
  readonly line: number;
}

const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const NA = 'n/a';

/** The data rows of a TSV with the named columns, as cells per column, each with its line number. */
function rows<C extends string>(text: string, file: string, columns: readonly C[]): { line: number; cell: (c: C) => string }[] {
  const lines = text.split('\n');
  const header = lines[0]!.replace(/\r$/, '').split('\t');
  const missing = columns.filter((c) => !header.includes(c));
  if (missing.length > 0) throw new QualityFileError(file, 1, `the header row lacks ${missing.map((c) => `"${c}"`).join(', ')} (it has ${header.map((h) => `"${h}"`).join(', ')})`);
  const index = new Map(columns.map((c) => [c, header.indexOf(c)]));
  const out: { line: number; cell: (c: C) => string }[] = [];
  for (let i = 1; i < lines.length; i++) {
    const line = lines[i]!.replace(/\r$/, '');
    if (line === '') continue;
    const fields = line.split('\t');
    if (fields.length !== header.length) throw new QualityFileError(file, i + 1, `expected ${header.length} tab-separated fields as in the header, got ${fields.length}`);
    out.push({ line: i + 1, cell: (c) => fields[index.get(c)!]!.trim() });
  }
  if (out.length === 0) throw new QualityFileError(file, 0, 'no rows after the header row');
  return out;
}

function number(file: string, line: number, column: string, text: string, allowNa: boolean): number {
  if (allowNa && text === NA) return Number.NaN;
  const v = DECIMAL.test(text) ? Number(text) : Number.NaN;
  if (!Number.isFinite(v)) throw new QualityFileError(file, line, `column "${column}": expected a number${allowNa ? ' or n/a' : ''}, got "${text}"`);
  return v;
}

export function parseGazeTsv(text: string, file: string): GazeRow[] {
  return rows(text, file, ['timestamp', 'x_coordinate', 'y_coordinate'] as const).map(({ line, cell }) => {
    const timeS = number(file, line, 'timestamp', cell('timestamp'), false);
    const x = number(file, line, 'x_coordinate', cell('x_coordinate'), true);
    const y = number(file, line, 'y_coordinate', cell('y_coordinate'), true);
    if (Number.isNaN(x) !== Number.isNaN(y)) throw new QualityFileError(file, line, 'x_coordinate and y_coordinate must both be numbers or both n/a');
    return { timeS, x, y, valid: !Number.isNaN(x) };
  });
}

export function parseTargetsTsv(text: string, file: string): TargetRow[] {
  return rows(text, file, ['onset', 'duration', 'x', 'y'] as const).map(({ line, cell }) => {
    const durationS = number(file, line, 'duration', cell('duration'), false);
    if (!(durationS > 0)) throw new QualityFileError(file, line, `column "duration": expected a number of seconds > 0, got "${cell('duration')}"`);
    return { onsetS: number(file, line, 'onset', cell('onset'), false), durationS, x: number(file, line, 'x', cell('x'), false), y: number(file, line, 'y', cell('y'), false), line };
  });
}
