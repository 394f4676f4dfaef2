import { hostNs, type HostClock, type HostNs } from '../core/clock/host-clock';

/** The live host clock: process.hrtime, counted from the moment this clock was made. */
export function createMonotonicClock(): HostClock & { readonly originNs: bigint } {
  const originNs = process.hrtime.bigint();
  return {
    originNs,
    nowNs(): HostNs {
      return hostNs(Number(process.hrtime.bigint() - originNs));
    },
  };
}
