import type { EyeSample, GazeSample } from '../gaze-sample';
import { coordinateScale, eyeFrom } from './eye-values';
import { eyesOf, type FeedHeader } from './feed-header';

const EYE_NAMES = { l: 'left', r: 'right' } as const;

const numberOrNull = (v: unknown): number | null | undefined => (v === null ? null : typeof v === 'number' ? v : undefined);

function readEye(key: 'l' | 'r', value: unknown, header: FeedHeader, scale: { x: number; y: number }): EyeSample | string {
  const pupilSent = header.hello.pupilUnit !== null;
  const expected = pupilSent ? `[x, y, valid, pupil]` : `[x, y, valid] (the hello declared no pupil unit)`;
  if (!Array.isArray(value) || value.length < 3 || value.length > (pupilSent ? 4 : 3)) return `sample: "${key}" must be ${expected}, got ${JSON.stringify(value)}`;
  const [x, y, v, p = null] = value as unknown[];
  const xn = numberOrNull(x);
  const yn = numberOrNull(y);
  const pn = numberOrNull(p);
  if (xn === undefined || yn === undefined) return `sample: "${key}" x and y must be numbers (or null for an invalid eye)`;
  if (v !== 0 && v !== 1 && v !== true && v !== false) return `sample: "${key}" validity must be 0 or 1, got ${JSON.stringify(v)}`;
  if (pn === undefined) return `sample: "${key}" pupil must be a number or null`;
  return eyeFrom(key, xn, yn, v === 1 || v === true, pn, scale);
}

/** Reads an NDJSON sample object: {"t": seconds, "seq"?: n, "l"?: [x, y, valid, pupil?], "r"?: [...]}. */
export function parseSampleObject(o: Record<string, unknown>, header: FeedHeader): GazeSample | string {
  const t = o.t;
  if (typeof t !== 'number' || !Number.isFinite(t)) return `sample: "t" must be a finite number of seconds, got ${JSON.stringify(t)}`;
  const seq = o.seq ?? null;
  if (seq !== null && !(typeof seq === 'number' && Number.isSafeInteger(seq) && seq >= 0)) return `sample: "seq" must be an integer of at least 0, got ${JSON.stringify(seq)}`;
  const declared = eyesOf(header.hello);
  const scale = coordinateScale(header);
  const eyes: { l: EyeSample | null; r: EyeSample | null } = { l: null, r: null };
  for (const key of ['l', 'r'] as const) {
    const value = o[key];
    if (!declared.includes(key)) {
      if (value !== undefined && value !== null) return `sample: "${key}" sent but the hello declared eyes ${header.hello.eyes}`;
      continue;
    }
    if (value === undefined) return `sample: missing "${key}" (${EYE_NAMES[key]} eye; the hello declared eyes ${header.hello.eyes})`;
    const eye = readEye(key, value, header, scale);
    if (typeof eye === 'string') return eye;
    eyes[key] = eye;
  }
  return { seq, trackerTimeS: t, left: eyes.l, right: eyes.r };
}
