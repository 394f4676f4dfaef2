import type { HostClock } from '../../../core/clock/host-clock';

/** Waits until a host time: the live one sleeps, a simulated one advances its clock. */
export interface DeadlineTimer {
  readonly clock: HostClock;
  sleepUntilNs(deadlineNs: number): Promise<void>;
}

/** Below this, timers are too coarse (about 1 ms) and the wait yields to the event loop instead. */
const SPIN_BELOW_NS = 2e6;

/**
 * The live timer: a timeout for the bulk of the wait, then turns of the event loop
 * (setImmediate, so sockets are still served) for the last 2 ms, so that a 2000 Hz
 * replay keeps its 0.5 ms spacing. It costs a busy core while rates are that high.
 */
export function createLiveDeadlineTimer(clock: HostClock): DeadlineTimer {
  return {
    clock,
    async sleepUntilNs(deadlineNs) {
      let remaining = deadlineNs - clock.nowNs();
      if (remaining > SPIN_BELOW_NS) await new Promise((resolve) => setTimeout(resolve, (remaining - SPIN_BELOW_NS) / 1e6));
      while ((remaining = deadlineNs - clock.nowNs()) > 0) await new Promise((resolve) => setImmediate(resolve));
    },
  };
}
