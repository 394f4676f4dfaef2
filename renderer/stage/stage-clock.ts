import type { GazeloomApi } from '../../app/contract';
import { PingClockEstimator } from '../../app/core/clock/ping-clock';

/**
 * Maps the stage's clock (performance.now and animation-frame timestamps, ms) to host time
 * by ping exchanges with the host, keeping those with the smallest round trip. Pings are
 * frequent at first, so playback can start within a second of the page loading, then once
 * a second so the estimate follows any drift.
 */
export class StageClock {
  private readonly estimator = new PingClockEstimator();
  private timer = 0;
  private sent = 0;

  constructor(private readonly api: GazeloomApi) {}

  start(): void {
    const tick = async () => {
      const t1 = performance.now();
      const result = await this.api.ping({ clientSentMs: t1 });
      const t4 = performance.now();
      if (result.ok) this.estimator.add({ t1, t2: result.value.hostReceivedNs / 1e6, t3: result.value.hostSentNs / 1e6, t4 });
      this.sent++;
      this.timer = window.setTimeout(tick, this.sent < 20 ? 50 : 1000);
    };
    void tick();
  }

  stop(): void {
    clearTimeout(this.timer);
  }

  /** Host time (ns) of a stage time (ms), or null before the first exchange. */
  toHostNs(stageMs: number): number | null {
    const hostMs = this.estimator.toServer(stageMs);
    return hostMs === null ? null : hostMs * 1e6;
  }

  /** Offset (host minus stage, ms) and its uncertainty (half the best round trip, ms). */
  estimate(): { offsetMs: number; uncertaintyMs: number } | null {
    const e = this.estimator.estimate();
    return e ? { offsetMs: e.offset, uncertaintyMs: e.uncertainty } : null;
  }
}
