/**
 * How the simulated participant's eyes move and where they choose to look. Each value
 * names its source; "value from memory" marks a textbook figure recalled rather than
 * looked up, and "no source" a choice of ours that only has to be plausible.
 * Angles are degrees of visual angle, times seconds unless the name says otherwise.
 */
export interface EyeMotionParams {
  /**
   * Main sequence: saccade duration D = slope·A + intercept for amplitude A
   * (Carpenter 1988, "Movements of the Eyes", 2nd ed., Pion: D ≈ 2.2·A + 21 ms).
   */
  readonly saccadeDurationSlopeMsPerDeg: number;
  readonly saccadeDurationInterceptMs: number;
  /** Primary saccades undershoot: they cover this fraction of the distance (about 0.9-0.95; Becker 1989, value from memory). */
  readonly saccadeGain: number;
  /** Landing scatter, SD per axis as a fraction of the amplitude (a few percent; value from memory). */
  readonly saccadeScatter: number;
  /** Latency of the saccade to a new target, mean and SD (about 200 ms; Carpenter 1988, value from memory). Never below half the mean. */
  readonly onsetLatencyMeanS: number;
  readonly onsetLatencySdS: number;
  /** Latency of corrective and catch-up saccades once the error is noticed (100-150 ms; Becker 1989, value from memory). */
  readonly correctiveLatencyMeanS: number;
  readonly correctiveLatencySdS: number;
  /** A still target further than this from the eye draws a corrective saccade (no source). */
  readonly refixationThresholdDeg: number;
  /** A moving target further than this from the eye draws a catch-up saccade (1-2°; de Brouwer et al. 2002, value from memory). */
  readonly catchUpThresholdDeg: number;
  /** Smooth-pursuit eye velocity over target velocity, a little below 1 (about 0.9; Lisberger et al. 1987, value from memory). */
  readonly pursuitGain: number;
  /** Time constant with which pursuit velocity follows the target's (about 100 ms; value from memory). */
  readonly pursuitTimeConstantS: number;
  /** Below this speed a target counts as still: no pursuit threshold, microsaccades allowed (no source). */
  readonly pursuitMinSpeedDegPerS: number;
  /**
   * Fixational drift as an Ornstein-Uhlenbeck wander around the fixated point: its RMS
   * distance (both axes together) and time constant (a few arcmin; Martinez-Conde,
   * Macknik & Hubel 2004, Nat. Rev. Neurosci. 5:229-240, value from memory).
   */
  readonly fixationalSdDeg: number;
  readonly fixationalTimeConstantS: number;
  /** Microsaccades during steady fixation, per second (1-2/s; Martinez-Conde et al. 2004, value from memory). */
  readonly microsaccadeRateHz: number;
  /** Where a microsaccade lands around the target: RMS distance (no source). */
  readonly microsaccadeScatterDeg: number;
  /**
   * Blinks: onset-to-onset interval and duration, uniform in [min, max] (2-6 s and
   * 100-300 ms: 10-30 blinks a minute, around the resting rate of about 17 a minute of
   * Bentivoglio et al. 1997, Mov. Disord. 12(6):1028-1034, value from memory).
   */
  readonly blinkIntervalMinS: number;
  readonly blinkIntervalMaxS: number;
  readonly blinkDurationMinS: number;
  readonly blinkDurationMaxS: number;
  /** Dwell on one object (or one idle spot): min + Gamma(shape, scale), redrawn above max (0.3-2 s, mean 0.8 s; no source). */
  readonly dwellMinS: number;
  readonly dwellGammaShape: number;
  readonly dwellGammaScaleS: number;
  readonly dwellMaxS: number;
  /** Idle gaze wanders around the screen centre with this SD per axis (no source). */
  readonly idleSpreadDeg: number;
  /** An object's pull is its size (√(width·height), degrees) × (1 + speed / this): moving objects draw the eye (no source). */
  readonly movingPreferenceDegPerS: number;
  /** Pupil diameter: mean, SD and time constant of its slow wander (about 3-4 mm in a lit room; value from memory). */
  readonly pupilMeanMm: number;
  readonly pupilSdMm: number;
  readonly pupilTimeConstantS: number;
}

export const DEFAULT_EYE_MOTION: EyeMotionParams = {
  saccadeDurationSlopeMsPerDeg: 2.2,
  saccadeDurationInterceptMs: 21,
  saccadeGain: 0.95,
  saccadeScatter: 0.04,
  onsetLatencyMeanS: 0.2,
  onsetLatencySdS: 0.03,
  correctiveLatencyMeanS: 0.13,
  correctiveLatencySdS: 0.02,
  refixationThresholdDeg: 0.4,
  catchUpThresholdDeg: 1.5,
  pursuitGain: 0.9,
  pursuitTimeConstantS: 0.1,
  pursuitMinSpeedDegPerS: 1,
  fixationalSdDeg: 0.05,
  fixationalTimeConstantS: 0.25,
  microsaccadeRateHz: 1,
  microsaccadeScatterDeg: 0.1,
  blinkIntervalMinS: 2,
  blinkIntervalMaxS: 6,
  blinkDurationMinS: 0.1,
  blinkDurationMaxS: 0.3,
  dwellMinS: 0.3,
  dwellGammaShape: 2,
  dwellGammaScaleS: 0.25,
  dwellMaxS: 2,
  idleSpreadDeg: 2,
  movingPreferenceDegPerS: 5,
  pupilMeanMm: 3.5,
  pupilSdMm: 0.2,
  pupilTimeConstantS: 2,
};

/** Parameters that must be strictly positive; every other one must be >= 0. */
const POSITIVE: ReadonlySet<keyof EyeMotionParams> = new Set([
  'saccadeGain',
  'onsetLatencyMeanS',
  'correctiveLatencyMeanS',
  'pursuitTimeConstantS',
  'fixationalTimeConstantS',
  'blinkIntervalMinS',
  'blinkDurationMinS',
  'dwellGammaScaleS',
  'dwellMaxS',
  'pupilMeanMm',
  'pupilTimeConstantS',
]);

/** The defaults with the given overrides, checked; a bad value throws a RangeError naming `eyeMotion.<name>`. */
export function resolveEyeMotion(overrides: Partial<EyeMotionParams> = {}): EyeMotionParams {
  const p: EyeMotionParams = { ...DEFAULT_EYE_MOTION, ...overrides };
  for (const key of Object.keys(DEFAULT_EYE_MOTION) as (keyof EyeMotionParams)[]) {
    const v = p[key];
    const ok = Number.isFinite(v) && (POSITIVE.has(key) ? v > 0 : v >= 0);
    if (!ok) throw new RangeError(`eyeMotion.${key} must be a finite number ${POSITIVE.has(key) ? '> 0' : '>= 0'}, got ${v}`);
  }
  for (const key of Object.keys(overrides)) if (!(key in DEFAULT_EYE_MOTION)) throw new RangeError(`eyeMotion.${key} is not a parameter of the eye model`);
  if (!Number.isInteger(p.dwellGammaShape) || p.dwellGammaShape < 1) throw new RangeError(`eyeMotion.dwellGammaShape must be a whole number >= 1, got ${p.dwellGammaShape}`);
  if (p.blinkIntervalMaxS < p.blinkIntervalMinS) throw new RangeError(`eyeMotion.blinkIntervalMaxS must be >= blinkIntervalMinS (${p.blinkIntervalMinS}), got ${p.blinkIntervalMaxS}`);
  if (p.blinkDurationMaxS < p.blinkDurationMinS) throw new RangeError(`eyeMotion.blinkDurationMaxS must be >= blinkDurationMinS (${p.blinkDurationMinS}), got ${p.blinkDurationMaxS}`);
  if (p.blinkDurationMaxS >= p.blinkIntervalMinS) throw new RangeError(`eyeMotion.blinkDurationMaxS must be shorter than blinkIntervalMinS (${p.blinkIntervalMinS}) so blinks never overlap, got ${p.blinkDurationMaxS}`);
  if (p.dwellMaxS <= p.dwellMinS) throw new RangeError(`eyeMotion.dwellMaxS must be > dwellMinS (${p.dwellMinS}), got ${p.dwellMaxS}`);
  return p;
}
