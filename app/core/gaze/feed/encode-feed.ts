import type { EyeSample, GazeHello, GazeSample } from '../gaze-sample';
import { eyesOf, FEED_PROTOCOL_VERSION, type FeedHeader } from './feed-header';

/**
 * Writers for the sending side of the feed (bridges, the simulated tracker, replay, tests).
 * Each returns one line without its newline. Numbers are written in JavaScript's shortest
 * round-trip form, so a parsed line gives back exactly the numbers that were encoded.
 */

export function encodeHello(hello: GazeHello, options: { tsvSeq?: boolean } = {}): string {
  const o: Record<string, unknown> = { gazeloom_feed: FEED_PROTOCOL_VERSION, units: hello.units, rate_hz: hello.rateHz, eyes: hello.eyes };
  if (hello.screen) o.screen = [hello.screen.widthPx, hello.screen.heightPx];
  if (hello.pupilUnit) o.pupil = hello.pupilUnit;
  if (hello.source !== null) o.source = hello.source;
  if (options.tsvSeq) o.tsv_seq = true;
  return JSON.stringify(o);
}

const coordinate = (v: number): number | null => (Number.isFinite(v) ? v : null);

function eyeArray(eye: EyeSample): (number | null)[] {
  const a = [coordinate(eye.x), coordinate(eye.y), eye.valid ? 1 : 0];
  return eye.pupil === null ? a : [...a, eye.pupil];
}

/** {"t":…,"seq":…,"l":[x,y,valid,pupil?],"r":[…]}: seq and absent eyes left out, missing coordinates as null. */
export function encodeSampleNdjson(sample: GazeSample): string {
  const o: Record<string, unknown> = { t: sample.trackerTimeS };
  if (sample.seq !== null) o.seq = sample.seq;
  if (sample.left) o.l = eyeArray(sample.left);
  if (sample.right) o.r = eyeArray(sample.right);
  return JSON.stringify(o);
}

const tsvNumber = (v: number | null): string => (v !== null && Number.isFinite(v) ? String(v) : 'nan');

/** The TSV layout the header declares: [seq] t, then per eye x, y, validity [, pupil]. */
export function encodeSampleTsv(sample: GazeSample, header: FeedHeader): string {
  const fields: string[] = [];
  if (header.tsvSeq) {
    if (sample.seq === null) throw new RangeError('sample.seq is required: the header declares a TSV seq column');
    fields.push(String(sample.seq));
  }
  fields.push(String(sample.trackerTimeS));
  const pupil = header.hello.pupilUnit !== null;
  for (const key of eyesOf(header.hello)) {
    const eye = key === 'l' ? sample.left : sample.right;
    if (!eye) throw new RangeError(`sample.${key === 'l' ? 'left' : 'right'} is required: the header declares eyes ${header.hello.eyes}`);
    fields.push(tsvNumber(eye.x), tsvNumber(eye.y), eye.valid ? '1' : '0');
    if (pupil) fields.push(tsvNumber(eye.pupil));
  }
  return fields.join('\t');
}
