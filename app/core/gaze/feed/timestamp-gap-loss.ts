/**
 * Loss without sequence numbers, from gaps in the tracker's timestamps against the nominal
 * rate: a step of dt past the latest timestamp stands for round(dt * rate) - 1 missing
 * samples. Counting per gap, rather than over the whole span, keeps a small error in the
 * nominal rate from adding up. A sample at or before the latest timestamp is out of order;
 * one strictly before it fills a gap already counted, so it is no longer lost (a repeat of
 * the latest timestamp is not). Common practice, no source.
 */
export class TimestampGapLoss {
  private latestS = Number.NEGATIVE_INFINITY;
  private missing = 0;
  private late = 0;

  constructor(private readonly rateHz: number) {
    if (!(rateHz > 0)) throw new RangeError(`rateHz must be above 0, got ${rateHz}`);
  }

  /** Returns whether this sample arrived out of order. */
  add(trackerTimeS: number): boolean {
    if (this.latestS === Number.NEGATIVE_INFINITY) {
      this.latestS = trackerTimeS;
      return false;
    }
    if (trackerTimeS > this.latestS) {
      this.missing += Math.max(0, Math.round((trackerTimeS - this.latestS) * this.rateHz) - 1);
      this.latestS = trackerTimeS;
      return false;
    }
    this.late++;
    if (trackerTimeS < this.latestS && this.missing > 0) this.missing--;
    return true;
  }

  get lost(): number {
    return this.missing;
  }

  get outOfOrder(): number {
    return this.late;
  }
}
