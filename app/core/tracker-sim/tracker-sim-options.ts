import { checkDisplayGeometry, type DisplayGeometry } from '../geometry/display-geometry';
import type { RecordedEyes } from '../gaze/gaze-sample';
import { resolveEyeMotion, type EyeMotionParams } from './eye-motion-params';

export interface TrackerSimOptions {
  /** Samples per second of the tracker's own clock. */
  readonly rateHz: number;
  readonly seed: number;
  /** The screen the participant looks at; samples are in its pixels. */
  readonly display: DisplayGeometry;
  /** Host time (s) at which the first sample is taken: h0 of the tracker clock. */
  readonly startHostS: number;
  /** Tracker clock offset (s) and skew (ppm): timestamp = h0 + offset + (h − h0)(1 + skew). */
  readonly offsetS?: number;
  readonly skewPpm?: number;
  /** Percentage of samples never delivered (blinks excepted). */
  readonly lossPct?: number;
  /** Measurement noise: RMS angular distance of the reported from the true gaze, both axes together. */
  readonly noiseDeg?: number;
  readonly driftDegPerMin?: number;
  readonly accuracyOffsetDeg?: number;
  /** How long after it is taken a sample reaches the host. */
  readonly latencyMs?: number;
  readonly eyes?: RecordedEyes;
  /** Overrides of the eye model's parameters (DEFAULT_EYE_MOTION). */
  readonly eyeMotion?: Partial<EyeMotionParams>;
}

export type ResolvedTrackerSimOptions = Required<Omit<TrackerSimOptions, 'eyeMotion'>> & { readonly eyeMotion: EyeMotionParams };

/** The defaults the issue specifies, and binocular recording. */
export const TRACKER_SIM_DEFAULTS = {
  offsetS: 0,
  skewPpm: 0,
  lossPct: 0,
  noiseDeg: 0.02,
  driftDegPerMin: 0,
  accuracyOffsetDeg: 0,
  latencyMs: 0,
  eyes: 'both',
} as const satisfies Partial<TrackerSimOptions>;

/** The options with defaults filled in, checked; a bad value throws a RangeError naming it. */
export function resolveTrackerSimOptions(o: TrackerSimOptions): ResolvedTrackerSimOptions {
  const r = { ...TRACKER_SIM_DEFAULTS, ...withoutUndefined(o), eyeMotion: resolveEyeMotion(o.eyeMotion) };
  const check = (name: keyof TrackerSimOptions, ok: boolean, expected: string) => {
    if (!ok) throw new RangeError(`${name} must be ${expected}, got ${String(r[name as keyof typeof r])}`);
  };
  check('rateHz', Number.isFinite(r.rateHz) && r.rateHz > 0 && r.rateHz <= 10000, 'a number in (0, 10000]');
  check('seed', Number.isInteger(r.seed), 'an integer');
  checkDisplayGeometry(r.display);
  check('startHostS', Number.isFinite(r.startHostS), 'a finite number');
  check('offsetS', Number.isFinite(r.offsetS), 'a finite number');
  check('skewPpm', Number.isFinite(r.skewPpm) && Math.abs(r.skewPpm) <= 10000, 'a number in [-10000, 10000]');
  check('lossPct', Number.isFinite(r.lossPct) && r.lossPct >= 0 && r.lossPct <= 100, 'a number in [0, 100]');
  for (const name of ['noiseDeg', 'driftDegPerMin', 'accuracyOffsetDeg', 'latencyMs'] as const) check(name, Number.isFinite(r[name]) && r[name] >= 0, 'a finite number >= 0');
  check('eyes', r.eyes === 'left' || r.eyes === 'right' || r.eyes === 'both', "'left', 'right' or 'both'");
  return r;
}

function withoutUndefined<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
}
