import { EventFormatError } from '../events/event-format-error';
import { TRACKS_TSV_HEADER, type ObjectKind, type TrackRow } from '../sim/track-rows';
import { TrackTable } from './track-table';

const COLUMNS = TRACKS_TSV_HEADER.split('\t');
const KINDS: ReadonlySet<string> = new Set<ObjectKind>(['forklift', 'parcel', 'beacon', 'person', 'flickering-light']);

/**
 * Reads a clip's TRACKS.tsv (README, "TRACKS.tsv: ground truth of simulated clips"): a
 * header row `t_s object_id kind cx cy x0 y0 x1 y1`, then one tab-separated row per object
 * per instant, in sensor pixels. Blank lines are skipped; CRLF line ends are accepted.
 * A malformed row throws an EventFormatError naming the file and its 1-based line (the
 * header is line 1) and what was expected.
 */
export function parseTracksTsv(text: string, fileName: string): TrackTable {
  const lines = text.replace(/^\uFEFF/, '').split('\n');
  const fail = (line: number, problem: string): never => {
    throw new EventFormatError(fileName, `line ${line}`, problem);
  };
  const header = lines[0]!.replace(/\r$/, '');
  if (header !== TRACKS_TSV_HEADER) fail(1, `expected the header "${COLUMNS.join(' ')}" (tab-separated), got "${header.replaceAll('\t', ' ')}"`);
  const rows: TrackRow[] = [];
  const lineOfRow: number[] = [];
  for (let i = 1; i < lines.length; i++) {
    const text = lines[i]!.replace(/\r$/, '');
    if (text.trim() === '') continue;
    rows.push(parseRow(text, (problem) => fail(i + 1, problem)));
    lineOfRow.push(i + 1);
  }
  return TrackTable.fromRows(rows, (index, problem) => fail(lineOfRow[index]!, problem));
}

function parseRow(text: string, fail: (problem: string) => never): TrackRow {
  const fields = text.split('\t');
  if (fields.length !== COLUMNS.length) fail(`expected ${COLUMNS.length} tab-separated fields (${COLUMNS.join(' ')}), got ${fields.length}`);
  const number = (k: number): number => {
    const raw = fields[k]!.trim();
    const v = Number(raw);
    if (raw === '' || !Number.isFinite(v)) fail(`${COLUMNS[k]} must be a number, got "${fields[k]}"`);
    return v;
  };
  const tS = number(0);
  if (tS < 0) fail(`t_s must be >= 0, got ${fields[0]}`);
  const objectId = number(1);
  if (!Number.isInteger(objectId) || objectId < 0) fail(`object_id must be a whole number >= 0, got "${fields[1]}"`);
  const kind = fields[2]!.trim();
  if (!KINDS.has(kind)) fail(`kind must be one of ${[...KINDS].join(', ')}, got "${fields[2]}"`);
  const [cx, cy, x0, y0, x1, y1] = [3, 4, 5, 6, 7, 8].map(number) as [number, number, number, number, number, number];
  if (x1 < x0) fail(`x1 (${x1}) must be >= x0 (${x0})`);
  if (y1 < y0) fail(`y1 (${y1}) must be >= y0 (${y0})`);
  return { tS, objectId, kind: kind as ObjectKind, cx, cy, x0, y0, x1, y1 };
}
