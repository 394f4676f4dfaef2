import type { Xoshiro128 } from '../random/xoshiro128';
import type { EyeMotionParams } from './eye-motion-params';

type BlinkParams = Pick<EyeMotionParams, 'blinkIntervalMinS' | 'blinkIntervalMaxS' | 'blinkDurationMinS' | 'blinkDurationMaxS'>;

/**
 * When the lids are closed. Blink onsets follow each other by an interval drawn uniformly
 * from [blinkIntervalMinS, blinkIntervalMaxS] (the first one that long after the start),
 * each lasting a duration drawn from [blinkDurationMinS, blinkDurationMaxS]. Asked in
 * time order, as samples are taken.
 */
export class BlinkSchedule {
  private onsetS: number;
  private endS: number;

  constructor(
    private readonly p: BlinkParams,
    private readonly rng: Xoshiro128,
    startS: number,
  ) {
    this.onsetS = startS + this.interval();
    this.endS = this.onsetS + this.duration();
  }

  isClosed(hostS: number): boolean {
    while (hostS >= this.endS) {
      this.onsetS += this.interval();
      this.endS = this.onsetS + this.duration();
    }
    return hostS >= this.onsetS;
  }

  private interval(): number {
    return this.p.blinkIntervalMinS + (this.p.blinkIntervalMaxS - this.p.blinkIntervalMinS) * this.rng.next();
  }

  private duration(): number {
    return this.p.blinkDurationMinS + (this.p.blinkDurationMaxS - this.p.blinkDurationMinS) * this.rng.next();
  }
}
