import type { EyeSample, GazeSample } from '../gaze-sample';
import { coordinateScale, eyeFrom } from './eye-values';
import { eyesOf, tsvFieldCount, type FeedHeader } from './feed-header';

// Plain decimal numbers only: Number() alone would also take "", " ", "0x1f" and "Infinity".
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
function number(field: string): number | undefined {
  if (!DECIMAL.test(field)) return undefined;
  const value = Number(field);
  return Number.isFinite(value) ? value : undefined; // "1e999" overflows to Infinity
}
/** "nan" or an empty field: a coordinate or pupil the sender did not have. */
const isMissing = (field: string): boolean => field === '' || field.toLowerCase() === 'nan';

/** A field that may be missing (null); a string is the reason it could not be read. */
function optionalField(fields: readonly string[], index: number, name: string): number | null | string {
  const text = fields[index]!;
  if (isMissing(text)) return null;
  return number(text) ?? `sample: TSV field ${index + 1} (${name}) must be a number, "nan" or empty, got "${text}"`;
}

/**
 * Reads a TSV sample line: [seq] t, then per declared eye (left before right) x, y,
 * validity (0 or 1) and, when the hello declared a pupil unit, pupil. The hello's
 * "tsv_seq" says whether the seq column is there, so the field count is exact.
 */
export function parseSampleTsv(line: string, header: FeedHeader): GazeSample | string {
  const fields = line.split('\t');
  const expected = tsvFieldCount(header);
  if (fields.length !== expected) return `sample: expected ${expected} tab-separated fields for this hello, got ${fields.length}`;
  let i = 0;
  let seq: number | null = null;
  if (header.tsvSeq) {
    const value = number(fields[0]!);
    if (value === undefined || !Number.isSafeInteger(value) || value < 0) return `sample: TSV field 1 (seq) must be an integer of at least 0, got "${fields[0]}"`;
    seq = value;
    i = 1;
  }
  const t = number(fields[i]!);
  if (t === undefined) return `sample: TSV field ${i + 1} (t) must be a number of seconds, got "${fields[i]}"`;
  i++;
  const scale = coordinateScale(header);
  const pupilSent = header.hello.pupilUnit !== null;
  const eyes: { l: EyeSample | null; r: EyeSample | null } = { l: null, r: null };
  for (const key of eyesOf(header.hello)) {
    const x = optionalField(fields, i, `${key} x`);
    const y = optionalField(fields, i + 1, `${key} y`);
    const v = fields[i + 2];
    const p = pupilSent ? optionalField(fields, i + 3, `${key} pupil`) : null;
    for (const value of [x, y, p]) if (typeof value === 'string') return value;
    if (v !== '0' && v !== '1') return `sample: TSV field ${i + 3} (${key} validity) must be 0 or 1, got "${v}"`;
    const eye = eyeFrom(key, x as number | null, y as number | null, v === '1', p as number | null, scale);
    if (typeof eye === 'string') return eye;
    eyes[key] = eye;
    i += pupilSent ? 4 : 3;
  }
  return { seq, trackerTimeS: t, left: eyes.l, right: eyes.r };
}
