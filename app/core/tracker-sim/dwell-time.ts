import type { Xoshiro128 } from '../random/xoshiro128';
import type { EyeMotionParams } from './eye-motion-params';

/**
 * How long the viewer stays with one object or idle spot: dwellMinS plus a gamma deviate
 * of whole-number shape k (the sum of k exponential deviates of mean scale), drawn again
 * while the total exceeds dwellMaxS. With the defaults: 0.3 s + Gamma(2, 0.25 s), mean
 * 0.8 s, at most 2 s (no source; the range is what the brief asks for).
 */
export function drawDwellS(p: Pick<EyeMotionParams, 'dwellMinS' | 'dwellGammaShape' | 'dwellGammaScaleS' | 'dwellMaxS'>, rng: Xoshiro128): number {
  for (;;) {
    let gamma = 0;
    for (let i = 0; i < p.dwellGammaShape; i++) gamma += rng.nextExponential(1 / p.dwellGammaScaleS);
    const dwell = p.dwellMinS + gamma;
    if (dwell <= p.dwellMaxS) return dwell;
  }
}
