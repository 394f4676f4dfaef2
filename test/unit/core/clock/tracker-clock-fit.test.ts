import { describe, expect, it } from 'vitest';
import {
  ASSUMED_SKEW_BOUND,
  MIN_SKEW_WINDOWS,
  TrackerClockFit,
  fitTrackerClock,
  trackerToHostS,
  type TrackerClockMapping,
} from '../../../../app/core/clock/tracker-clock-fit';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { simulateArrivals, type ArrivalScenario, type SimulatedArrivals } from './simulated-arrivals';

const WARM_UP_S = 10;
const TOLERANCE_S = 0.1e-3;

/** Worst |mapped − expected| of every sample under one mapping. */
function worstBatchError(sim: SimulatedArrivals, m: TrackerClockMapping): number {
  let worst = 0;
  for (let i = 0; i < sim.trackerTimeS.length; i++) worst = Math.max(worst, Math.abs(trackerToHostS(m, sim.trackerTimeS[i]!) - sim.expectedHostS[i]!));
  return worst;
}

/**
 * Feeds the samples in arrival order and maps each one as it arrives, as the recorder does.
 * Worst errors from 1 s to the end of the warm-up (offset only, then the first skew fits),
 * by how much an error of the warm-up exceeds the mapping's own uncertainty, and after the
 * warm-up. The first second is left out: its first samples carry their own jitter, as
 * nothing better is known yet.
 */
function streamingErrors(sim: SimulatedArrivals): { warmUpS: number; warmUpBeyondUncertaintyS: number; afterS: number } {
  const fit = new TrackerClockFit();
  const worst = { warmUpS: 0, warmUpBeyondUncertaintyS: -Infinity, afterS: 0 };
  for (let i = 0; i < sim.trackerTimeS.length; i++) {
    fit.add(sim.trackerTimeS[i]!, sim.arrivalHostS[i]!);
    const error = Math.abs(fit.toHostS(sim.trackerTimeS[i]!)! - sim.expectedHostS[i]!);
    const sinceStartS = sim.arrivalHostS[i]! - sim.hostStartS;
    if (sinceStartS >= WARM_UP_S) worst.afterS = Math.max(worst.afterS, error);
    else if (sinceStartS >= 1) {
      worst.warmUpS = Math.max(worst.warmUpS, error);
      worst.warmUpBeyondUncertaintyS = Math.max(worst.warmUpBeyondUncertaintyS, error - fit.mapping()!.uncertaintyS);
    }
  }
  return worst;
}

const session = (rateHz: number, skewPpm: number, seed: number, extra: Partial<ArrivalScenario> = {}): ArrivalScenario => ({
  rateHz,
  durationS: 600,
  offsetS: 12.3,
  skewPpm,
  seed,
  ...extra,
});

describe('TrackerClockFit acceptance (issue 4): a 10-minute session, offset 12.3 s, mapped host times within 0.1 ms of the truth', () => {
  // Truth = the host time the sample was taken plus the 0.2 ms minimum delay, which no fit can separate from the offset.
  // Jitter: exponential with mean 1 ms, bursts of 20-50 ms every ~7 s, host stalls of 5-30 ms every ~1.5 s that release samples in bunches.
  const cases = [
    { name: '1000 Hz, 50 ppm', scenario: session(1000, 50, 1) },
    { name: '250 Hz, 50 ppm', scenario: session(250, 50, 2) },
    { name: '1000 Hz, no skew', scenario: session(1000, 0, 3) },
    { name: '1000 Hz, -80 ppm', scenario: session(1000, -80, 4) },
    { name: '250 Hz, -80 ppm', scenario: session(250, -80, 5) },
  ];
  for (const { name, scenario } of cases) {
    it(`${name}: batch fit over the session and streaming fit after ${WARM_UP_S} s (common practice, no source)`, () => {
      const sim = simulateArrivals(scenario);
      const m = fitTrackerClock(sim);
      expect(m.skewFitted).toBe(true);
      expect(Math.abs(m.skew - sim.skew)).toBeLessThan(0.05e-6);
      expect(Math.abs(m.offsetS - sim.trueOffsetAt(m.hostRefS))).toBeLessThan(20e-6);
      const batch = worstBatchError(sim, m);
      expect(batch).toBeLessThan(TOLERANCE_S);
      // As tight as the window minima allow: the least of N exponential delays with mean 1 ms has mean 1 ms / N.
      expect(batch).toBeLessThan((3 * 1e-3) / scenario.rateHz);
      expect(m.uncertaintyS).toBeGreaterThan(0);
      expect(m.uncertaintyS).toBeLessThan(TOLERANCE_S);
      const streaming = streamingErrors(sim);
      expect(streaming.afterS).toBeLessThan(TOLERANCE_S);
      // During the warm-up the mapping's uncertainty (offset only: 100 ppm over the age of its window) covers the error
      // but for the jitter left in a young window's minimum.
      expect(streaming.warmUpBeyondUncertaintyS).toBeLessThan(50e-6);
      expect(streaming.warmUpS).toBeLessThan(0.25e-3);
    });
  }
});

describe('TrackerClockFit robustness (common practice, no source)', () => {
  it('ignores windows delayed whole by long host stalls, at the start and mid-session', () => {
    const longStalls = [
      { startS: 0.5, durationS: 3 },
      { startS: 200.2, durationS: 2.5 },
      { startS: 400, durationS: 4 },
    ];
    const sim = simulateArrivals(session(1000, 50, 6, { longStalls }));
    const m = fitTrackerClock(sim);
    // Windows 1-2, 201 and 401-403 hold only stalled samples, delayed by 0.5 s or more.
    expect(m.windows).toBeLessThanOrEqual(600 - 6);
    expect(worstBatchError(sim, m)).toBeLessThan(TOLERANCE_S);
    const streaming = streamingErrors(sim);
    expect(streaming.afterS).toBeLessThan(TOLERANCE_S);
    // The samples held by the first stall arrive during the warm-up: the older, clean window keeps their mapping right.
    expect(streaming.warmUpS).toBeLessThan(0.25e-3);
  });

  it('follows a change of skew with the sliding window of the streaming fit, where one line over the session cannot', () => {
    // The tracker's rate changes from +50 ppm to -30 ppm at host time 60 s (a temperature step), for a 3-minute session at 500 Hz.
    const rng = new Xoshiro128(8);
    const trackerAt = (h: number) => 1000 + (h < 60 ? h * (1 + 50e-6) : 60 * (1 + 50e-6) + (h - 60) * (1 - 30e-6));
    const n = 180 * 500;
    const takenS = Float64Array.from({ length: n }, (_, k) => k / 500);
    const trackerTimeS = takenS.map(trackerAt);
    const arrivalHostS = takenS.map((h) => h + 0.2e-3 + rng.nextExponential(1000));
    const fit = new TrackerClockFit({ maxWindows: 20 });
    let worstAfterChange = 0;
    for (let k = 0; k < n; k++) {
      fit.add(trackerTimeS[k]!, arrivalHostS[k]!);
      if (takenS[k]! > 60 + 25) worstAfterChange = Math.max(worstAfterChange, Math.abs(fit.toHostS(trackerTimeS[k]!)! - takenS[k]! - 0.2e-3));
    }
    expect(fit.mapping()!.windows).toBeLessThanOrEqual(20);
    expect(Math.abs(fit.mapping()!.skew - -30e-6)).toBeLessThan(0.2e-6);
    expect(worstAfterChange).toBeLessThan(TOLERANCE_S);
    const batch = fitTrackerClock({ trackerTimeS, arrivalHostS });
    const worstBatch = Math.max(...Array.from(takenS, (h, k) => Math.abs(trackerToHostS(batch, trackerTimeS[k]!) - h - 0.2e-3)));
    expect(worstBatch).toBeGreaterThan(1e-3);
  });

  it('gives the same batch mapping whatever the order of the pairs', () => {
    const sim = simulateArrivals({ rateHz: 250, durationS: 60, offsetS: -3.25, skewPpm: 35, seed: 9 });
    const forward = fitTrackerClock(sim);
    const reversed = fitTrackerClock({ trackerTimeS: sim.trackerTimeS.slice().reverse(), arrivalHostS: sim.arrivalHostS.slice().reverse() });
    expect(reversed).toEqual(forward);
  });
});

describe('TrackerClockMapping arithmetic (common practice, no source)', () => {
  it('recovers offset and skew exactly from arrivals with a constant delay', () => {
    // tracker = 12.3 + 37.25 + (1 + 50 ppm)(host − 37.25), 100 Hz for 20 s, every sample 0.2 ms late.
    const takenS = Float64Array.from({ length: 2000 }, (_, k) => 37.25 + k / 100);
    const trackerTimeS = takenS.map((h) => 49.55 + (1 + 50e-6) * (h - 37.25));
    const arrivalHostS = takenS.map((h) => h + 0.2e-3);
    for (const m of [fitTrackerClock({ trackerTimeS, arrivalHostS }), streamed(trackerTimeS, arrivalHostS)]) {
      expect(m.skewFitted).toBe(true);
      expect(Math.abs(m.skew - 50e-6)).toBeLessThan(1e-12);
      // Tracker minus minimally delayed host time at hostRefS.
      expect(Math.abs(m.offsetS - (49.55 + (1 + 50e-6) * (m.hostRefS - 0.2e-3 - 37.25) - m.hostRefS))).toBeLessThan(1e-12);
      expect(m.uncertaintyS).toBeLessThan(1e-12);
      trackerTimeS.forEach((t, k) => expect(Math.abs(trackerToHostS(m, t) - arrivalHostS[k]!)).toBeLessThan(1e-11));
    }
  });

  it('trackerToHostS inverts tracker = hostRefS + offsetS + (1 + skew)(host − hostRefS)', () => {
    const m: TrackerClockMapping = { offsetS: 12.3, skew: -80e-6, hostRefS: 500, uncertaintyS: 0, windows: 10, skewFitted: true };
    for (const hostS of [0, 500, 537.123456, 4000]) {
      const trackerS = m.hostRefS + m.offsetS + (1 + m.skew) * (hostS - m.hostRefS);
      expect(Math.abs(trackerToHostS(m, trackerS) - hostS)).toBeLessThan(1e-12);
    }
  });
});

/** The streaming fit's mapping after all the pairs, in order. */
function streamed(trackerTimeS: Float64Array, arrivalHostS: Float64Array): TrackerClockMapping {
  const fit = new TrackerClockFit();
  trackerTimeS.forEach((t, k) => fit.add(t, arrivalHostS[k]!));
  return fit.mapping()!;
}

describe('TrackerClockFit before a skew can be fitted', () => {
  it('maps by the window whose delay plus the drift an unfitted skew could have caused since is least, skew 0', () => {
    const fit = new TrackerClockFit();
    expect(fit.mapping()).toBeNull();
    expect(fit.toHostS(100)).toBeNull();
    fit.add(100.0, 50.0104); // delay -49.9896
    fit.add(100.5, 50.5003); // delay -49.9997, the least so far
    expect(fit.mapping()).toEqual({ offsetS: 49.9997, skew: 0, hostRefS: 50.5003, uncertaintyS: ASSUMED_SKEW_BOUND * 1, windows: 1, skewFitted: false });
    fit.add(101.2, 51.2011); // opens window 1 (delay -49.9989); window 0 closes with its least delay at 100.5
    // Opens window 2 (delay -49.9995). Window 0's delay is lower by 0.2 ms but 2.4 s older: 2.4 s at 100 ppm could have
    // moved the delay by 0.24 ms, so window 2 gives the offset.
    fit.add(102.9, 52.9005);
    let m = fit.mapping()!;
    expect(m.hostRefS).toBeCloseTo(52.9005, 12);
    expect(m.offsetS).toBeCloseTo(49.9995, 12);
    expect(m.uncertaintyS).toBeCloseTo(ASSUMED_SKEW_BOUND * 1, 15);
    expect(m.windows).toBe(3);
    expect(fit.toHostS(103)).toBeCloseTo(103 - 49.9995, 12);
    fit.add(104.95, 54.951); // opens window 4 (delay -49.999, 0.5 ms above window 2's, now 2.05 s old)
    m = fit.mapping()!;
    expect(m.offsetS).toBeCloseTo(49.9995, 12);
    expect(m.uncertaintyS).toBeCloseTo(ASSUMED_SKEW_BOUND * 2.05, 15);
    expect(m.windows).toBe(4);
    expect(m.skewFitted).toBe(false);
  });

  it('keeps the offset of an older window over a recent one delayed by a stall', () => {
    const fit = new TrackerClockFit();
    fit.add(0.2, 0.2 + 1e-3);
    for (let t = 1.0; t < 1.9; t += 0.1) fit.add(t, 1.95 + (t - 1) * 1e-3); // window 1 arrives in one bunch at 1.95 s
    expect(fit.mapping()!.hostRefS).toBeCloseTo(0.201, 12);
    expect(fit.mapping()!.uncertaintyS).toBeCloseTo(ASSUMED_SKEW_BOUND * 1.6, 12);
  });

  it(`fits a skew once ${MIN_SKEW_WINDOWS} windows have closed`, () => {
    const fit = new TrackerClockFit();
    const delayS = (k: number) => 1e-3 + ((k * 37) % 11) * 1e-5;
    for (let k = 0; k < 40; k++) fit.add(k / 10, k / 10 + delayS(k));
    expect(fit.mapping()!.skewFitted).toBe(false);
    fit.add(4, 4 + delayS(40)); // the first sample of window 4 closes window 3
    expect(fit.mapping()!.skewFitted).toBe(true);
    expect(fit.mapping()!.windows).toBe(MIN_SKEW_WINDOWS);
    // A recording of three windows is offset only, by the same rule: here the last window's 1 ms delay, uncertain by one window of skew.
    const short = fitTrackerClock({ trackerTimeS: [0, 0.5, 1.5, 2.5], arrivalHostS: [0.003, 0.5012, 1.5015, 2.501] });
    expect(short.offsetS).toBeCloseTo(-0.001, 15);
    expect(short.hostRefS).toBeCloseTo(2.501, 15);
    expect(short.uncertaintyS).toBeCloseTo(ASSUMED_SKEW_BOUND * 1, 15);
    expect([short.skew, short.windows, short.skewFitted]).toEqual([0, 3, false]);
  });

  it('starts afresh after reset(), as after a tracker restart with a new clock', () => {
    const fit = new TrackerClockFit();
    const before = simulateArrivals({ rateHz: 100, durationS: 20, offsetS: 5, skewPpm: 40, seed: 10 });
    before.trackerTimeS.forEach((t, i) => fit.add(t, before.arrivalHostS[i]!));
    fit.reset();
    expect(fit.mapping()).toBeNull();
    const after = simulateArrivals({ rateHz: 100, durationS: 20, offsetS: -700, skewPpm: -20, seed: 11, hostStartS: 60 });
    after.trackerTimeS.forEach((t, i) => fit.add(t, after.arrivalHostS[i]!));
    expect(Math.abs(fit.mapping()!.skew - -20e-6)).toBeLessThan(1e-6);
    expect(Math.abs(fit.toHostS(after.trackerTimeS.at(-1)!)! - after.expectedHostS.at(-1)!)).toBeLessThan(TOLERANCE_S);
  });
});

describe('TrackerClockFit input policy', () => {
  it('throws RangeError naming the parameter', () => {
    expect(() => new TrackerClockFit({ windowS: 0 })).toThrow(/windowS must be a positive number/);
    expect(() => new TrackerClockFit({ maxWindows: 3 })).toThrow(/maxWindows must be an integer >= 4/);
    expect(() => new TrackerClockFit().add(NaN, 1)).toThrow(/trackerTimeS must be a finite/);
    expect(() => new TrackerClockFit().add(1, Infinity)).toThrow(/arrivalHostS must be a finite/);
    expect(() => fitTrackerClock({ trackerTimeS: [], arrivalHostS: [] })).toThrow(/at least one sample/);
    expect(() => fitTrackerClock({ trackerTimeS: [1, 2], arrivalHostS: [1] })).toThrow(/pairs.arrivalHostS must have the length/);
    expect(() => fitTrackerClock({ trackerTimeS: [1, NaN], arrivalHostS: [1, 2] })).toThrow(/pairs.trackerTimeS\[1\] must be a finite/);
    expect(() => fitTrackerClock({ trackerTimeS: [1], arrivalHostS: [1] }, { windowS: -1 })).toThrow(/windowS must be a positive number/);
  });
});
