import type { GazeUnits, PupilUnit, RecordedEyes } from '../gaze-sample';
import { FEED_PROTOCOL_VERSION, type FeedHeader } from './feed-header';

const UNITS: readonly GazeUnits[] = ['screen_px', 'screen_norm', 'raw'];
const EYES: readonly RecordedEyes[] = ['left', 'right', 'both'];
const PUPIL_UNITS: readonly PupilUnit[] = ['mm', 'px', 'arbitrary'];
const MAX_RATE_HZ = 100_000;
const MAX_SCREEN_PX = 65_536;
const MAX_SOURCE_CHARS = 200;

const isScreenSide = (v: unknown): v is number => typeof v === 'number' && Number.isInteger(v) && v >= 1 && v <= MAX_SCREEN_PX;
const choice = <T extends string>(value: unknown, allowed: readonly T[]): value is T => typeof value === 'string' && (allowed as readonly string[]).includes(value);

/**
 * Reads a hello object (a JSON line with a "gazeloom_feed" field). Returns the header or,
 * for a bad hello, the reason naming the field and what was expected. Unknown fields are
 * ignored so that later minor additions do not break this receiver.
 */
export function parseHello(o: Record<string, unknown>): FeedHeader | string {
  if (o.gazeloom_feed !== FEED_PROTOCOL_VERSION) return `hello: unsupported protocol version ${JSON.stringify(o.gazeloom_feed)} (this host speaks "gazeloom_feed": ${FEED_PROTOCOL_VERSION})`;
  if (!choice(o.units, UNITS)) return `hello: "units" must be one of ${UNITS.join(', ')}, got ${JSON.stringify(o.units)}`;
  const rateHz = o.rate_hz;
  if (typeof rateHz !== 'number' || !(rateHz > 0 && rateHz <= MAX_RATE_HZ)) return `hello: "rate_hz" must be a number above 0 and at most ${MAX_RATE_HZ}, got ${JSON.stringify(rateHz)}`;
  if (!choice(o.eyes, EYES)) return `hello: "eyes" must be one of ${EYES.join(', ')}, got ${JSON.stringify(o.eyes)}`;
  let screen: FeedHeader['hello']['screen'] = null;
  if (o.screen !== undefined && o.screen !== null) {
    const s = o.screen;
    if (!Array.isArray(s) || s.length !== 2 || !isScreenSide(s[0]) || !isScreenSide(s[1])) return `hello: "screen" must be [width_px, height_px], integers from 1 to ${MAX_SCREEN_PX}, got ${JSON.stringify(s)}`;
    screen = { widthPx: s[0], heightPx: s[1] };
  }
  if (o.units === 'screen_norm' && screen === null) return 'hello: "screen" [width_px, height_px] is required when "units" is "screen_norm"';
  const pupil = o.pupil ?? null;
  if (pupil !== null && !choice(pupil, PUPIL_UNITS)) return `hello: "pupil" must be one of ${PUPIL_UNITS.join(', ')} or absent, got ${JSON.stringify(pupil)}`;
  const source = o.source ?? null;
  if (source !== null && (typeof source !== 'string' || source.length > MAX_SOURCE_CHARS)) return `hello: "source" must be a string of at most ${MAX_SOURCE_CHARS} characters`;
  const tsvSeq = o.tsv_seq ?? false;
  if (typeof tsvSeq !== 'boolean') return `hello: "tsv_seq" must be true or false, got ${JSON.stringify(tsvSeq)}`;
  return {
    hello: { protocol: 'gazeloom-feed', version: FEED_PROTOCOL_VERSION, units: o.units, rateHz, eyes: o.eyes, screen, pupilUnit: pupil, source },
    tsvSeq,
  };
}
