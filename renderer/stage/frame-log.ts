import type { FrameRecordWire, GazeloomApi } from '../../app/contract';

/**
 * The nominal refresh interval: the 10th percentile of recent frame intervals (60 Hz until
 * known). A low percentile, not the median, so a stage that keeps missing frames cannot
 * talk its own nominal rate down and stop counting them as late.
 */
class RefreshEstimate {
  private readonly intervals: number[] = [];
  nominalMs = 1000 / 60;

  add(intervalMs: number): void {
    if (!(intervalMs > 0 && intervalMs < 1000)) return;
    this.intervals.push(intervalMs);
    if (this.intervals.length > 120) this.intervals.shift();
    if (this.intervals.length >= 10) {
      const sorted = [...this.intervals].sort((a, b) => a - b);
      this.nominalMs = sorted[Math.floor(sorted.length / 10)]!;
    }
  }
}

/**
 * Every presented frame, sent to the host in batches: frame index, its time on the stage's
 * clock and in host time, the clip and stimulus time shown, events drawn, and a late flag
 * when the interval since the previous frame exceeds 1.5 nominal refresh intervals.
 */
export class FrameLog {
  private pending: FrameRecordWire[] = [];
  private frame = 0;
  private previousMs: number | null = null;
  private readonly refresh = new RefreshEstimate();
  private lastSend = 0;

  constructor(
    private readonly api: GazeloomApi,
    private readonly clockEstimate: () => { offsetMs: number; uncertaintyMs: number } | null,
    private readonly received: () => { playbackId: string; lastUs: number | null } | null,
  ) {}

  add(entry: Omit<FrameRecordWire, 'frame' | 'late'>): FrameRecordWire {
    const interval = this.previousMs === null ? null : entry.stageTimeMs - this.previousMs;
    if (interval !== null) this.refresh.add(interval);
    const record: FrameRecordWire = { ...entry, frame: this.frame++, late: interval !== null && interval > 1.5 * this.refresh.nominalMs };
    this.previousMs = entry.stageTimeMs;
    this.pending.push(record);
    if (entry.stageTimeMs - this.lastSend >= 100) this.send(entry.stageTimeMs);
    return record;
  }

  private send(nowMs: number): void {
    this.lastSend = nowMs;
    const frames = this.pending;
    this.pending = [];
    void this.api.reportFrames({ frames, clock: this.clockEstimate(), refreshHz: 1000 / this.refresh.nominalMs, received: this.received() });
  }
}
