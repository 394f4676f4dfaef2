import { packBlend, packRgb } from './packed-rgba';
import type { Rgb } from './render-defaults';

/**
 * exp(-dt/tau) is cut off, and the background shown, once dt >= tau * ln(256): past that
 * point the weight is below 1/256, so blending it moves no channel by as much as one 8-bit
 * step (|colour - background| <= 255). This is the decay look's historyUs.
 */
export const DECAY_CUTOFF_TAUS = Math.log(256);

/** Table entries over [0, cut-off]; 4097 colours per polarity, 32 KiB for both. */
export const DECAY_TABLE_STEPS = 4096;

/**
 * Largest error of a table weight against exp(-dt/tau): a pixel's dt is rounded to the
 * nearest table step of tau * ln(256) / 4096, and exp(-x) moves by at most half a step
 * over half a step, so |error| <= ln(256) / (2 * 4096) = 6.8e-4. On a colour channel
 * that is at most 255 * 6.8e-4 = 0.17 of an 8-bit step (0.09 for the default colours,
 * whose channels lie within 128 of the background) before rounding to an integer.
 */
export const DECAY_WEIGHT_MAX_ERROR = DECAY_CUTOFF_TAUS / (2 * DECAY_TABLE_STEPS);

/**
 * The decay look's exp() lookup: for each table step k, the weight exp(-k * step / tau)
 * and the colours it gives between the background and the OFF and ON colours.
 * colours[0] is the background, OFF step k is at [1 + k] and ON step k at [1 + STRIDE + k].
 */
export class DecayTable {
  readonly historyUs: number;
  /** Table steps per microsecond of age. */
  readonly stepsPerUs: number;
  readonly weights = new Float64Array(DECAY_TABLE_STEPS + 1);
  readonly colours = new Uint32Array(1 + 2 * (DECAY_TABLE_STEPS + 1));
  static readonly STRIDE = DECAY_TABLE_STEPS + 1;

  constructor(tauUs: number, background: Rgb, off: Rgb, on: Rgb) {
    this.historyUs = tauUs * DECAY_CUTOFF_TAUS;
    this.stepsPerUs = DECAY_TABLE_STEPS / this.historyUs;
    this.colours[0] = packRgb(...background);
    for (let k = 0; k <= DECAY_TABLE_STEPS; k++) {
      const weight = Math.exp(-(k / DECAY_TABLE_STEPS) * DECAY_CUTOFF_TAUS);
      this.weights[k] = weight;
      this.colours[1 + k] = packBlend(background, off, weight);
      this.colours[1 + DecayTable.STRIDE + k] = packBlend(background, on, weight);
    }
  }

}
