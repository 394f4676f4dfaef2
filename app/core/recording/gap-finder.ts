/**
 * Gaps in a gaze recording, in tracker time (seconds):
 *   from the recorded gap_start / gap_end message pairs (a disconnection until the first
 *   sample after it; `end` is null when the recording ended inside the gap, `start` null
 *   when no sample had arrived before it);
 *   from jumps between consecutive samples (in recorded order) where GAP_MISSING_SAMPLES
 *   (3) or more samples in a row are missing: counted by sequence number when both samples
 *   carry one (seq difference >= 4), else estimated from tracker time (difference >= 3.5
 *   nominal intervals, i.e. rounding to 4 or more, so timestamp jitter of under half an
 *   interval cannot make or hide a gap). One or two lost samples are data loss, not gaps.
 * The nominal interval is 1 / the hello's rate; without one, the median of the first
 * RATE_PROBE intervals. Overlapping gaps are merged, so a disconnection reported by both
 * its messages and its jump is one gap.
 */
export interface Gap {
  readonly start: number | null;
  readonly end: number | null;
}

export const GAP_MISSING_SAMPLES = 3;
const RATE_PROBE = 1000;

export class GapFinder {
  private intervalS: number | null;
  private readonly probe: { seq: number | null; t: number }[] = [];
  private previous: { seq: number | null; t: number } | null = null;
  private readonly jumps: Gap[] = [];
  private readonly reported: Gap[] = [];
  private openStart: number | null | undefined = undefined;

  constructor(nominalRateHz: number | null) {
    if (nominalRateHz !== null && !(nominalRateHz > 0)) throw new RangeError(`nominalRateHz must be positive or null, got ${nominalRateHz}`);
    this.intervalS = nominalRateHz === null ? null : 1 / nominalRateHz;
  }

  sample(seq: number | null, trackerTimeS: number): void {
    if (this.intervalS === null) {
      this.probe.push({ seq, t: trackerTimeS });
      if (this.probe.length > RATE_PROBE) this.settleInterval();
      return;
    }
    this.step({ seq, t: trackerTimeS });
  }

  gapStart(lastTrackerTimeS: number | null): void {
    if (this.openStart === undefined) this.openStart = lastTrackerTimeS;
  }

  gapEnd(firstTrackerTimeS: number): void {
    if (this.openStart === undefined) return;
    this.reported.push({ start: this.openStart, end: firstTrackerTimeS });
    this.openStart = undefined;
  }

  finish(): Gap[] {
    this.settleInterval();
    const all = [...this.reported, ...this.jumps];
    if (this.openStart !== undefined) all.push({ start: this.openStart, end: null });
    return mergeGaps(all);
  }

  private settleInterval(): void {
    if (this.intervalS !== null) return;
    const steps = this.probe
      .slice(1)
      .map((s, i) => s.t - this.probe[i]!.t)
      .filter((d) => d > 0)
      .sort((a, b) => a - b);
    if (steps.length === 0) return;
    this.intervalS = steps[Math.floor(steps.length / 2)]!;
    for (const s of this.probe.splice(0)) this.step(s);
  }

  private step(s: { seq: number | null; t: number }): void {
    const p = this.previous;
    this.previous = s;
    if (!p) return;
    const jump = p.seq !== null && s.seq !== null ? s.seq - p.seq >= GAP_MISSING_SAMPLES + 1 : s.t - p.t >= (GAP_MISSING_SAMPLES + 0.5) * this.intervalS!;
    if (jump) this.jumps.push({ start: p.t, end: s.t });
  }
}

const startOf = (g: Gap) => g.start ?? -Infinity;
const endOf = (g: Gap) => g.end ?? Infinity;

export function mergeGaps(gaps: readonly Gap[]): Gap[] {
  const sorted = [...gaps].sort((a, b) => startOf(a) - startOf(b) || endOf(a) - endOf(b));
  const merged: Gap[] = [];
  for (const g of sorted) {
    const last = merged[merged.length - 1];
    if (last && startOf(g) <= endOf(last)) merged[merged.length - 1] = { start: last.start, end: endOf(g) > endOf(last) ? g.end : last.end };
    else merged.push(g);
  }
  return merged;
}
