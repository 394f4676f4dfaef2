import { hostNs, type HostClock, type HostNs } from '../../core/clock/host-clock';
import { resolveTrackerSimOptions, SimulatedTracker, type LookTarget, type TrackerRecord, type TrackerSimOptions } from '../../core/tracker-sim';
import type { GazeSink, GazeSource } from './gaze-source';

export interface SimulatedTrackerSourceOptions {
  readonly clock: HostClock;
  /** The tracker model's options; its first sample is taken when the source starts. */
  readonly tracker: Omit<TrackerSimOptions, 'startHostS'>;
  /**
   * 'timer' (the default): runs in real time, delivering every tickMs the samples that are
   * due, stamped with the clock's time at delivery. 'manual': delivers only in advanceTo,
   * for simulated time (ManualClock in tests and the simulated demo study).
   */
  readonly drive?: 'timer' | 'manual';
  readonly tickMs?: number;
}

const PEER = 'simulated';

/**
 * The simulated tracker inside the host, as a gaze source. Each sample reaches the sink
 * latencyMs after the host time it was taken at; lost samples never do. The host points it
 * at calibration and validation targets and at the clip playing (setLook); control
 * messages are for network bridges and are ignored here.
 */
export class SimulatedTrackerSource implements GazeSource {
  readonly kind = 'simulated' as const;
  readonly description: string;
  private readonly clock: HostClock;
  private readonly drive: 'timer' | 'manual';
  private readonly tickMs: number;
  private readonly latencyS: number;
  private tracker: SimulatedTracker | null = null;
  private sink: GazeSink | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private readonly looksBeforeStart: { target: LookTarget; atNs: number }[] = [];

  constructor(private readonly options: SimulatedTrackerSourceOptions) {
    this.clock = options.clock;
    this.drive = options.drive ?? 'timer';
    this.tickMs = options.tickMs ?? 5;
    if (this.drive !== 'timer' && this.drive !== 'manual') throw new RangeError(`drive must be 'timer' or 'manual', got ${String(this.drive)}`);
    if (!(Number.isFinite(this.tickMs) && this.tickMs >= 1)) throw new RangeError(`tickMs must be a number >= 1, got ${this.tickMs}`);
    // Checked now, so bad options fail where the source is made rather than at start.
    const { rateHz, seed, latencyMs } = resolveTrackerSimOptions({ ...options.tracker, startHostS: 0 });
    this.latencyS = latencyMs / 1000;
    this.description = `Simulated tracker at ${rateHz} Hz (seed ${seed})`;
  }

  async start(sink: GazeSink): Promise<void> {
    if (this.sink) throw new Error('the simulated tracker is already started');
    const startNs = this.clock.nowNs();
    const tracker = new SimulatedTracker({ ...this.options.tracker, startHostS: startNs / 1e9 });
    for (const { target, atNs } of this.looksBeforeStart.splice(0)) tracker.setLook(target, Math.max(atNs, startNs) / 1e9);
    this.tracker = tracker;
    this.sink = sink;
    sink.connection('connected', PEER);
    sink.hello(tracker.hello(), PEER);
    if (this.drive === 'timer') this.timer = setInterval(() => this.deliverDue(), this.tickMs);
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    const sink = this.sink;
    this.sink = null;
    this.tracker = null;
    sink?.connection('disconnected', PEER);
  }

  control(): void {}

  /** Looks at `target` from host time atNs on (now by default); before start, from the start. */
  setLook(target: LookTarget, atNs: HostNs = this.clock.nowNs()): void {
    if (this.tracker) this.tracker.setLook(target, atNs / 1e9);
    else this.looksBeforeStart.push({ target, atNs });
  }

  /**
   * Simulated time: delivers, in order, every sample due by host time untilNs, each stamped
   * as arriving exactly when it became due (taken + latency). Returns how many were delivered.
   */
  advanceTo(untilNs: HostNs): number {
    return this.deliver(untilNs, (r) => hostNs(Math.min(untilNs, Math.round(r.dueHostS * 1e9))));
  }

  /** Real time: delivers what is due by the clock's time now, stamped with that time. */
  private deliverDue(): void {
    const nowNs = this.clock.nowNs();
    this.deliver(nowNs, () => nowNs);
  }

  private deliver(untilNs: HostNs, arrival: (r: TrackerRecord) => HostNs): number {
    const { tracker, sink } = this;
    if (!tracker || !sink) throw new Error('the simulated tracker is not started');
    let delivered = 0;
    // Half a nanosecond of slack, so a sample due exactly at untilNs is not lost to rounding.
    for (const r of tracker.samplesUntil((untilNs + 0.5) / 1e9 - this.latencyS)) {
      if (!r.delivered) continue;
      sink.sample(r.sample, arrival(r));
      delivered++;
    }
    return delivered;
  }
}
