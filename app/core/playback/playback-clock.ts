/**
 * Stimulus time of a clip being played: t_ev = t_start + (h − h_start − paused)·speed, where
 * h is host time and `paused` the host time spent paused so far (DESIGN.md, clocks). Host
 * times are ns; stimulus times µs.
 */
export class PlaybackClock {
  private pausedNs = 0;
  private pausedAt: number | null = null;

  constructor(
    readonly startAtHostNs: number,
    readonly tStartUs: number,
    readonly speed: number,
  ) {
    if (!(speed > 0)) throw new RangeError(`speed must be > 0, got ${speed}`);
  }

  get paused(): boolean {
    return this.pausedAt !== null;
  }

  /** The stimulus time shown at host time h; before the start it is the start. */
  stimulusUsAt(hostNs: number): number {
    const effective = (this.pausedAt ?? hostNs) - this.startAtHostNs - this.pausedNs;
    return this.tStartUs + (Math.max(0, effective) / 1000) * this.speed;
  }

  pause(hostNs: number): void {
    if (this.pausedAt === null) this.pausedAt = Math.max(hostNs, this.startAtHostNs);
  }

  resume(hostNs: number): void {
    if (this.pausedAt === null) return;
    this.pausedNs += Math.max(0, hostNs - this.pausedAt);
    this.pausedAt = null;
  }
}
