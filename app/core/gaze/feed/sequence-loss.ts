/**
 * Loss from sequence numbers, as RTP receivers count it (Schulzrinne et al. 2003, RFC 3550,
 * appendix A.3): lost = expected - received, expected = highest - lowest + 1, so a sample
 * that arrives late is no longer counted lost. Clamped at 0 (duplicates can push it below).
 * A sample whose number is not above every one seen before is out of order (late or
 * repeated): common practice, no source.
 */
export class SequenceLoss {
  private lowest = Number.POSITIVE_INFINITY;
  private highest = Number.NEGATIVE_INFINITY;
  private received = 0;
  private late = 0;

  /** Returns whether this sample arrived out of order. */
  add(seq: number): boolean {
    const outOfOrder = this.received > 0 && seq <= this.highest;
    if (outOfOrder) this.late++;
    this.received++;
    this.lowest = Math.min(this.lowest, seq);
    this.highest = Math.max(this.highest, seq);
    return outOfOrder;
  }

  get lost(): number {
    return this.received === 0 ? 0 : Math.max(0, this.highest - this.lowest + 1 - this.received);
  }

  get outOfOrder(): number {
    return this.late;
  }
}
