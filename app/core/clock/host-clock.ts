/**
 * Host time: nanoseconds on the host's monotonic clock, counted from the host's start so
 * that a float64 keeps nanosecond resolution for about 104 days. Everything that deals
 * with time takes one of these, so the same code runs live and in simulated time.
 */
export type HostNs = number & { readonly __unit: 'host-ns' };

export interface HostClock {
  nowNs(): HostNs;
}

export const hostNs = (value: number): HostNs => value as HostNs;

/** A clock that moves only when told to: tests and the simulated demo study run on it. */
export class ManualClock implements HostClock {
  private current: number;

  constructor(startNs = 0) {
    this.current = startNs;
  }

  nowNs(): HostNs {
    return this.current as HostNs;
  }

  advanceNs(deltaNs: number): void {
    if (!(deltaNs >= 0)) throw new RangeError(`deltaNs must be >= 0, got ${deltaNs}`);
    this.current += deltaNs;
  }

  advanceMs(deltaMs: number): void {
    this.advanceNs(deltaMs * 1e6);
  }
}
