import type { TimeResolution } from '../events/event-batch';

/**
 * Parameters of the simulated event-camera pixel array. The pixel model is the standard one
 * (Lichtsteiner, Posch and Delbruck 2008; Gallego et al. 2020, "Event-based Vision: A
 * Survey", eq. 1): a pixel fires when its log intensity has moved by its contrast threshold
 * from the level it last fired at.
 */
export interface DvsParams {
  /** Mean ON threshold in natural-log units (0.2: inside the survey's typical 0.1 to 0.5). */
  readonly contrastThresholdOn: number;
  /** Mean OFF threshold in natural-log units. */
  readonly contrastThresholdOff: number;
  /** Standard deviation of the per-pixel Gaussian threshold mismatch, drawn once per pixel and polarity (0.02). */
  readonly thresholdMismatchSigma: number;
  /** Crossings within this time of the pixel's last emitted event are dropped; the reference still moves (µs). */
  readonly refractoryUs: number;
  /** Background activity: a Poisson process per pixel, either polarity with equal odds (events per pixel per second). */
  readonly noiseRateHz: number;
  /** Pixels chosen at random that fire ON events as their own Poisson process. */
  readonly hotPixelCount: number;
  /** Rate of each hot pixel (events per second). */
  readonly hotPixelRateHz: number;
  /** Timestamps are truncated to this clock tick, as a sensor's counter latch does; null keeps exact times. */
  readonly timeResolution: TimeResolution | null;
}

export const DEFAULT_DVS_PARAMS: DvsParams = {
  contrastThresholdOn: 0.2,
  contrastThresholdOff: 0.2,
  thresholdMismatchSigma: 0.02,
  refractoryUs: 100,
  noiseRateHz: 0.1,
  hotPixelCount: 6,
  hotPixelRateHz: 200,
  timeResolution: 'us',
};

/** A drawn threshold never goes below this (a mismatch draw far in the tail would otherwise fire on every frame). */
export const MIN_CONTRAST_THRESHOLD = 0.01;

/** Fills in the defaults and checks every value; a bad one throws a RangeError naming it. */
export function resolveDvsParams(partial: Partial<DvsParams> = {}, pixelCount: number): DvsParams {
  const params: DvsParams = { ...DEFAULT_DVS_PARAMS, ...stripUndefined(partial) };
  const positive = ['contrastThresholdOn', 'contrastThresholdOff'] as const;
  const nonNegative = ['thresholdMismatchSigma', 'refractoryUs', 'noiseRateHz', 'hotPixelRateHz'] as const;
  for (const name of positive) {
    if (!(Number.isFinite(params[name]) && params[name] > 0)) throw new RangeError(`${name} must be a finite number > 0, got ${params[name]}`);
  }
  for (const name of nonNegative) {
    if (!(Number.isFinite(params[name]) && params[name] >= 0)) throw new RangeError(`${name} must be a finite number >= 0, got ${params[name]}`);
  }
  if (!Number.isInteger(params.hotPixelCount) || params.hotPixelCount < 0 || params.hotPixelCount > pixelCount) {
    throw new RangeError(`hotPixelCount must be an integer in 0..${pixelCount}, got ${params.hotPixelCount}`);
  }
  if (params.timeResolution !== null && params.timeResolution !== 'us' && params.timeResolution !== 'ns') {
    throw new RangeError(`timeResolution must be 'us', 'ns' or null, got ${String(params.timeResolution)}`);
  }
  return params;
}

function stripUndefined<T extends object>(partial: Partial<T>): Partial<T> {
  return Object.fromEntries(Object.entries(partial).filter(([, v]) => v !== undefined)) as Partial<T>;
}
