import type { GazeHello, GazeSample } from '../gaze-sample';

/** One row of the gaze TSV that `gazeloom recording export` writes, as replay needs it. */
export interface RecordedGazeRow {
  readonly trackerTimeS: number;
  /** Screen pixels; null for an invalid sample ("n/a"). */
  readonly x: number | null;
  readonly y: number | null;
  readonly pupil: number | null;
}

/** A line of a recorded gaze file that does not read, located for a person to fix. */
export class RecordedGazeFormatError extends Error {
  override name = 'RecordedGazeFormatError';

  constructor(
    readonly file: string,
    readonly line: number,
    readonly problem: string,
  ) {
    super(`${file}${line > 0 ? ` line ${line}` : ''}: ${problem}`);
  }
}

const REQUIRED = ['timestamp', 'x_coordinate', 'y_coordinate', 'pupil_size', 'tracker_timestamp'] as const;
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Reads the exported gaze TSV: a header row naming at least timestamp, x_coordinate,
 * y_coordinate, pupil_size and tracker_timestamp (other columns, such as those of
 * --stimulus, are ignored), then one row per sample with "n/a" for what an invalid sample
 * lacks. Replay keeps the tracker's timestamps and their spacing.
 */
export function parseRecordedGazeTsv(text: string, file: string): RecordedGazeRow[] {
  const lines = text.split('\n');
  const header = lines[0]!.replace(/\r$/, '').split('\t');
  const column = Object.fromEntries(REQUIRED.map((name) => [name, header.indexOf(name)])) as Record<(typeof REQUIRED)[number], number>;
  const missing = REQUIRED.filter((name) => column[name] < 0);
  if (missing.length > 0) throw new RecordedGazeFormatError(file, 1, `the header row lacks ${missing.join(', ')} (expected the gaze TSV of gazeloom recording export)`);
  const rows: RecordedGazeRow[] = [];
  for (let i = 1; i < lines.length; i++) {
    const line = lines[i]!.replace(/\r$/, '');
    if (line === '') continue;
    const fields = line.split('\t');
    if (fields.length !== header.length) throw new RecordedGazeFormatError(file, i + 1, `expected ${header.length} tab-separated fields as in the header, got ${fields.length}`);
    const value = (name: (typeof REQUIRED)[number], optional: boolean): number | null => {
      const f = fields[column[name]]!;
      if (optional && f === 'n/a') return null;
      const v = DECIMAL.test(f) ? Number(f) : Number.NaN;
      if (!Number.isFinite(v)) throw new RecordedGazeFormatError(file, i + 1, `${name} must be a number${optional ? ' or n/a' : ''}, got "${f}"`);
      return v;
    };
    const x = value('x_coordinate', true);
    const y = value('y_coordinate', true);
    if ((x === null) !== (y === null)) throw new RecordedGazeFormatError(file, i + 1, 'x_coordinate and y_coordinate must both be numbers or both n/a');
    rows.push({ trackerTimeS: value('tracker_timestamp', false)!, x, y, pupil: value('pupil_size', true) });
  }
  if (rows.length === 0) throw new RecordedGazeFormatError(file, 0, 'no samples after the header row');
  return rows;
}

/** The median interval between consecutive tracker timestamps (positive ones only), seconds; null if there is none. */
export function medianIntervalS(rows: readonly RecordedGazeRow[]): number | null {
  const intervals = new Float64Array(rows.length);
  let n = 0;
  for (let i = 1; i < rows.length; i++) {
    const d = rows[i]!.trackerTimeS - rows[i - 1]!.trackerTimeS;
    if (d > 0) intervals[n++] = d;
  }
  if (n === 0) return null;
  const sorted = intervals.subarray(0, n).sort();
  return n % 2 === 1 ? sorted[(n - 1) / 2]! : (sorted[n / 2 - 1]! + sorted[n / 2]!) / 2;
}

/**
 * The hello a replay sends: screen pixels, the rate from the median interval, and the one
 * recorded gaze point as the left eye (the export holds the combined gaze, not each eye).
 * Pupil is declared, in arbitrary units, when any row has one.
 */
export function replayHello(rows: readonly RecordedGazeRow[], source: string): GazeHello {
  const intervalS = medianIntervalS(rows);
  if (intervalS === null) throw new RangeError('rows must hold at least two samples with increasing tracker_timestamp to derive a rate');
  return {
    protocol: 'gazeloom-feed',
    version: 1,
    units: 'screen_px',
    rateHz: 1 / intervalS,
    eyes: 'left',
    screen: null,
    pupilUnit: rows.some((r) => r.pupil !== null) ? 'arbitrary' : null,
    source,
  };
}

/** A recorded row as the sample replay sends, numbered in file order. */
export function replaySample(row: RecordedGazeRow, seq: number, hello: GazeHello): GazeSample {
  const valid = row.x !== null && row.y !== null;
  const pupil = hello.pupilUnit === null ? null : row.pupil;
  return { seq, trackerTimeS: row.trackerTimeS, left: { x: row.x ?? Number.NaN, y: row.y ?? Number.NaN, valid, pupil }, right: null };
}
