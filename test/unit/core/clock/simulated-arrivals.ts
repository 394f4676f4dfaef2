import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

/**
 * Samples of a simulated tracker as the host receives them. The tracker stamps a regular
 * grid on its own clock, tracker = T0 + (1 + skew)(host − hostStartS) with T0 = hostStartS +
 * offsetS; each sample reaches the host after the minimum delay plus positive jitter:
 * exponential jitter, bursts during which every sample is 20-50 ms late, short host stalls
 * after which the queued samples arrive in one bunch, and optional long stalls.
 */
export interface ArrivalScenario {
  readonly rateHz: number;
  readonly durationS: number;
  readonly offsetS: number;
  readonly skewPpm: number;
  readonly seed: number;
  readonly hostStartS?: number;
  readonly minDelayS?: number;
  readonly jitterMeanS?: number;
  /** Mean host time between bursts and between short stalls (Poisson processes). */
  readonly burstEveryS?: number;
  readonly stallEveryS?: number;
  /** Host-time intervals [startS, startS + durationS) in which nothing is received, relative to hostStartS. */
  readonly longStalls?: readonly { startS: number; durationS: number }[];
}

export interface SimulatedArrivals {
  /** In arrival order. */
  readonly trackerTimeS: Float64Array;
  readonly arrivalHostS: Float64Array;
  /** The host time the sample was taken plus the minimum delay: what a mapping should give. */
  readonly expectedHostS: Float64Array;
  /** Tracker minus (minimally delayed) host time at a given minimally delayed host time. */
  readonly trueOffsetAt: (hostS: number) => number;
  readonly skew: number;
  readonly hostStartS: number;
}

type Interval = { start: number; end: number };

/** Poisson-spaced intervals over [0, durationS) with lengths uniform in [minS, maxS]. */
function intervals(rng: Xoshiro128, durationS: number, everyS: number, minS: number, maxS: number): Interval[] {
  const out: Interval[] = [];
  for (let t = rng.nextExponential(1 / everyS); t < durationS; t += rng.nextExponential(1 / everyS)) {
    out.push({ start: t, end: t + minS + rng.next() * (maxS - minS) });
  }
  return out;
}

export function simulateArrivals(s: ArrivalScenario): SimulatedArrivals {
  const rng = new Xoshiro128(s.seed);
  const hostStartS = s.hostStartS ?? 37.25;
  const minDelayS = s.minDelayS ?? 0.2e-3;
  const jitterRate = 1 / (s.jitterMeanS ?? 1e-3);
  const skew = s.skewPpm * 1e-6;
  const trackerStartS = hostStartS + s.offsetS;
  const bursts = intervals(rng, s.durationS, s.burstEveryS ?? 7, 0.05, 0.3);
  const stalls = [
    ...intervals(rng, s.durationS, s.stallEveryS ?? 1.5, 0.005, 0.03),
    ...(s.longStalls ?? []).map(({ startS, durationS }) => ({ start: startS, end: startS + durationS })),
  ].sort((a, b) => a.start - b.start);
  const n = Math.floor(s.durationS * s.rateHz);
  const tracker = new Float64Array(n);
  const arrival = new Float64Array(n);
  const expected = new Float64Array(n);
  let burst = 0;
  let firstStall = 0;
  for (let k = 0; k < n; k++) {
    tracker[k] = trackerStartS + k / s.rateHz;
    const takenS = k / s.rateHz / (1 + skew); // relative to hostStartS
    while (burst < bursts.length && bursts[burst]!.end <= takenS) burst++;
    const inBurst = burst < bursts.length && bursts[burst]!.start <= takenS;
    let arrivedS = takenS + minDelayS + rng.nextExponential(jitterRate) + (inBurst ? 0.02 + 0.03 * rng.next() : 0);
    // A sample cannot arrive before it is taken, so stalls that ended earlier are passed for good.
    while (firstStall < stalls.length && stalls[firstStall]!.end <= takenS) firstStall++;
    for (let i = firstStall; i < stalls.length && stalls[i]!.start <= arrivedS; i++) {
      if (arrivedS < stalls[i]!.end) arrivedS = stalls[i]!.end; // the queue is read in order: ties are sorted by sample below
    }
    arrival[k] = hostStartS + arrivedS;
    expected[k] = hostStartS + takenS + minDelayS;
  }
  const order = Array.from({ length: n }, (_, k) => k).sort((a, b) => arrival[a]! - arrival[b]! || a - b);
  const pick = (values: Float64Array) => Float64Array.from(order, (k) => values[k]!);
  return {
    trackerTimeS: pick(tracker),
    arrivalHostS: pick(arrival),
    expectedHostS: pick(expected),
    trueOffsetAt: (hostS) => trackerStartS + (1 + skew) * (hostS - minDelayS - hostStartS) - hostS,
    skew,
    hostStartS,
  };
}
