/**
 * The simulated tracker's sampling grid. The tracker samples at exactly rateHz on its own
 * clock, whose reading at host time h (seconds) is
 *   h0 + offset + (h − h0)·(1 + skew),  skew = skewPpm / 1e6,
 * with h0 the host time of the first sample. So sample k carries the timestamp
 * h0 + offset + k / rateHz and is taken at host time h0 + k / (rateHz·(1 + skew)).
 * With offset and skew 0 the timestamps are the host clock itself.
 */
export class TrackerClock {
  private readonly hostRateHz: number;

  constructor(
    readonly startHostS: number,
    readonly rateHz: number,
    readonly offsetS: number,
    skewPpm: number,
  ) {
    this.hostRateHz = rateHz * (1 + skewPpm / 1e6);
  }

  /** Host time (s) at which sample k is taken. */
  hostTimeOfSample(k: number): number {
    return this.startHostS + k / this.hostRateHz;
  }

  /** The tracker's timestamp (s) of sample k. */
  timestampOfSample(k: number): number {
    return this.startHostS + this.offsetS + k / this.rateHz;
  }
}
