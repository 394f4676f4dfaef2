import { describe, expect, it } from 'vitest';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { runFitWindowS, TrackerRuns } from '../../../../app/core/recording/tracker-runs';

// Ground truth by construction: a tracker whose clock is host + offset with a skew, samples
// at 500 Hz on its own grid, arriving after a 0.2 ms minimum delay plus exponential jitter
// (mean 1 ms). The fit maps to host time plus the minimum delay (tracker-clock-fit.ts), so
// the expected mapped time of a sample is its true host time + 0.2 ms.
const MIN_DELAY_S = 0.0002;

function run(runs: TrackerRuns, random: Xoshiro128, fromHostS: number, toHostS: number, offsetS: number, skew: number): { trackerTimeS: number; arrivalS: number; trueHostS: number }[] {
  const out = [];
  const t0 = fromHostS + offsetS;
  for (let k = 0; ; k++) {
    const trackerTimeS = t0 + k / 500;
    const trueHostS = fromHostS + (trackerTimeS - t0) / (1 + skew);
    if (trueHostS >= toHostS) break;
    const arrivalS = trueHostS + MIN_DELAY_S + random.nextExponential(1000);
    runs.add(trackerTimeS, arrivalS);
    out.push({ trackerTimeS, arrivalS, trueHostS });
  }
  return out;
}

describe('TrackerRuns', () => {
  it('fits each tracker run on its own: a restarted tracker clock does not spoil the mapping', () => {
    const random = new Xoshiro128(7);
    // A hello at 30 s: the tracker restarted with a new clock.
    const runs = new TrackerRuns([30]);
    const first = run(runs, random, 0, 30, 12.3, 50e-6);
    const second = run(runs, random, 30.05, 60, -5, -20e-6);
    const fits = runs.fit();
    expect(fits.map((f) => f?.samples)).toEqual([first.length, second.length]);
    expect(fits[0]!.mapping.skew).toBeCloseTo(50e-6, 6);
    expect(fits[1]!.mapping.skew).toBeCloseTo(-20e-6, 6);
    let worst = 0;
    for (const s of [...first, ...second]) worst = Math.max(worst, Math.abs(runs.toSessionS(s.trackerTimeS, s.arrivalS) - (s.trueHostS + MIN_DELAY_S)));
    expect(worst).toBeLessThan(1e-4);
  });

  it('assigns a sample to the run of the latest start at or before its arrival', () => {
    const runs = new TrackerRuns([20, 10]);
    expect([0, 9.99, 10, 15, 20, 99].map((t) => runs.runOf(t))).toEqual([0, 0, 1, 1, 2, 2]);
    runs.add(100, 12);
    expect(runs.fit().map((f) => f?.samples ?? null)).toEqual([null, 1, null]);
    expect(() => runs.toSessionS(1, 5)).toThrow(RangeError);
  });

  it('uses 1 s windows for long runs and about 20 windows of at least 20 samples for short ones', () => {
    expect(runFitWindowS(600, 600_000)).toBe(1);
    expect(runFitWindowS(4, 2001)).toBeCloseTo(0.2, 12);
    expect(runFitWindowS(4, 201)).toBeCloseTo(0.4, 12);
    expect(runFitWindowS(0, 1)).toBe(1);
  });
});
