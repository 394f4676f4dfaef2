import type { EyeMotionParams } from './eye-motion-params';

/**
 * Saccade duration from amplitude along the main sequence, D = slope·A + intercept
 * (Carpenter 1988, "Movements of the Eyes", 2nd ed., Pion: about 2.2 ms/° + 21 ms).
 * With the minimum-jerk profile the peak velocity is 1.875·A/D, so it grows with the
 * amplitude and levels off, as the main sequence does.
 */
export function saccadeDurationS(amplitudeDeg: number, p: Pick<EyeMotionParams, 'saccadeDurationSlopeMsPerDeg' | 'saccadeDurationInterceptMs'>): number {
  return (p.saccadeDurationSlopeMsPerDeg * amplitudeDeg + p.saccadeDurationInterceptMs) / 1000;
}
