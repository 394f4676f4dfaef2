import { combinedGaze, type GazeSample } from '../gaze/gaze-sample';

interface Arrival {
  readonly arrivalNs: number;
  readonly seq: number | null;
  readonly valid: boolean;
  readonly point: { x: number; y: number } | null;
}

export interface LiveFigures {
  readonly measuredRateHz: number | null;
  readonly dataLossPct10s: number | null;
  readonly lastSampleAgeMs: number | null;
  readonly alarm: boolean;
  readonly trail: ({ x: number; y: number } | null)[];
}

const WINDOW_NS = 10e9;
const TRAIL_NS = 0.5e9;
export const NO_SAMPLE_ALARM_MS = 500;

/**
 * The console's live figures, from the samples as they arrive (host times in ns):
 *   measured rate  samples in the last 2 s over the span they cover;
 *   data loss      over the last 10 s, (invalid + missing) / expected, where expected is
 *                  last seq − first seq + 1 when the tracker sends sequence numbers, else
 *                  1 + (now − first arrival) · nominal rate (common practice, no source);
 *   alarm          a running source has sent nothing for 500 ms.
 */
export class LiveMonitor {
  private readonly arrivals: Arrival[] = [];
  private head = 0;

  constructor(private nominalRateHz: number | null = null) {}

  setNominalRate(hz: number | null): void {
    this.nominalRateHz = hz;
  }

  add(sample: GazeSample, arrivalNs: number): void {
    const point = combinedGaze(sample);
    this.arrivals.push({ arrivalNs, seq: sample.seq, valid: point !== null, point });
    if (this.head > 4096 && this.head > this.arrivals.length / 2) {
      this.arrivals.splice(0, this.head);
      this.head = 0;
    }
  }

  reset(): void {
    this.arrivals.length = 0;
    this.head = 0;
  }

  figures(nowNs: number, sourceRunning: boolean): LiveFigures {
    while (this.head < this.arrivals.length && this.arrivals[this.head]!.arrivalNs < nowNs - WINDOW_NS) this.head++;
    const recent = this.arrivals.slice(this.head);
    const last = recent.at(-1) ?? this.arrivals.at(-1) ?? null;
    const lastSampleAgeMs = last ? (nowNs - last.arrivalNs) / 1e6 : null;
    const alarm = sourceRunning && (lastSampleAgeMs === null || lastSampleAgeMs > NO_SAMPLE_ALARM_MS);
    return { measuredRateHz: this.rate(recent, nowNs), dataLossPct10s: this.loss(recent, nowNs), lastSampleAgeMs, alarm, trail: this.trail(recent, nowNs) };
  }

  private rate(recent: readonly Arrival[], nowNs: number): number | null {
    const inWindow = recent.filter((a) => a.arrivalNs >= nowNs - 2e9);
    if (inWindow.length < 2) return null;
    const span = inWindow.at(-1)!.arrivalNs - inWindow[0]!.arrivalNs;
    return span > 0 ? ((inWindow.length - 1) / span) * 1e9 : null;
  }

  private loss(recent: readonly Arrival[], nowNs: number): number | null {
    if (recent.length === 0) return this.nominalRateHz ? 100 : null;
    const valid = recent.reduce((n, a) => n + (a.valid ? 1 : 0), 0);
    const first = recent[0]!;
    const lastArrival = recent.at(-1)!;
    let expected: number;
    if (first.seq !== null && lastArrival.seq !== null && lastArrival.seq >= first.seq) expected = lastArrival.seq - first.seq + 1;
    else if (this.nominalRateHz) expected = Math.max(recent.length, 1 + Math.round(((nowNs - first.arrivalNs) / 1e9) * this.nominalRateHz));
    else expected = recent.length;
    return expected > 0 ? (100 * (expected - valid)) / expected : null;
  }

  private trail(recent: readonly Arrival[], nowNs: number): ({ x: number; y: number } | null)[] {
    const tail = recent.filter((a) => a.arrivalNs >= nowNs - TRAIL_NS);
    const step = Math.max(1, Math.ceil(tail.length / 60));
    const out: ({ x: number; y: number } | null)[] = [];
    for (let i = 0; i < tail.length; i += step) out.push(tail[i]!.point);
    return out;
  }
}
