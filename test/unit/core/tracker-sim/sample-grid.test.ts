import { describe, expect, it } from 'vitest';
import type { EyeSample } from '../../../../app/core/gaze/gaze-sample';
import { SimulatedTracker, type TrackerRecord } from '../../../../app/core/tracker-sim';
import { DISPLAY, point, runs, simulate } from './helpers';

describe('the simulated tracker: sample grid, determinism, loss and blinks', () => {
  it('is reproducible from its seed, and another seed gives other samples', () => {
    const looks = [{ atS: 1, target: point(300, 200) }, { atS: 3, target: { kind: 'idle' } as const }];
    const a = simulate({ rateHz: 500, seed: 21, lossPct: 3, driftDegPerMin: 0.5 }, 6, looks);
    const b = simulate({ rateHz: 500, seed: 21, lossPct: 3, driftDegPerMin: 0.5 }, 6, looks);
    const c = simulate({ rateHz: 500, seed: 22, lossPct: 3, driftDegPerMin: 0.5 }, 6, looks);
    expect(b).toEqual(a);
    expect(c.map((r) => r.sample.left?.x)).not.toEqual(a.map((r) => r.sample.left?.x));
  });

  it('gives the same samples whether asked in one call or many', () => {
    const whole = simulate({ rateHz: 300, seed: 4 }, 5);
    const tracker = new SimulatedTracker({ rateHz: 300, seed: 4, display: DISPLAY, startHostS: 10 });
    const pieces = [10.0001, 10.5, 10.5, 12.37, 15].flatMap((h) => tracker.samplesUntil(h));
    expect(pieces).toEqual(whole);
  });

  it('stamps sample k with h0 + offset + k/rate, taken at host time h with timestamp h0 + offset + (h − h0)(1 + skew) (the issue’s clock)', () => {
    const h0 = 1234.5;
    const rateHz = 600;
    const skew = 50e-6;
    const records = simulate({ rateHz, seed: 3, startHostS: h0, offsetS: 12.3, skewPpm: 50 }, 60);
    expect(records.length).toBe(Math.floor(60 * rateHz * (1 + skew)) + 1);
    expect(records[0]!.hostS).toBe(h0);
    expect(records.map((r) => r.sample.seq)).toEqual(records.map((_, k) => k));
    const worst = (error: (r: TrackerRecord, k: number) => number) => Math.max(...records.map((r, k) => Math.abs(error(r, k))));
    expect(worst((r, k) => r.sample.trackerTimeS - (h0 + 12.3 + k / rateHz))).toBeLessThan(1e-9);
    expect(worst((r) => r.sample.trackerTimeS - (h0 + 12.3 + (r.hostS - h0) * (1 + skew)))).toBeLessThan(1e-9);
    // With the defaults the timestamps are the host clock itself.
    expect(simulate({ rateHz: 250, seed: 3, startHostS: h0 }, 2).every((r) => Math.abs(r.sample.trackerTimeS - r.hostS) < 1e-12)).toBe(true);
  });

  it('loses lossPct of the samples within binomial bounds, never a blink, and the sequence gaps count the losses', () => {
    const lossPct = 10;
    const lossy = simulate({ rateHz: 1000, seed: 8, lossPct }, 120);
    const blinkSample = (i: number) => !lossy[i]!.sample.left!.valid;
    const candidates = lossy.filter((_, i) => !blinkSample(i)).length;
    const lost = lossy.filter((r) => !r.delivered).length;
    // Bernoulli losses: the count is binomial(n, p); allow 5 of its standard deviations √(np(1−p)) (common practice, no source).
    const p = lossPct / 100;
    expect(Math.abs(lost - candidates * p)).toBeLessThan(5 * Math.sqrt(candidates * p * (1 - p)));
    expect(lossy.every((r, i) => r.delivered || !blinkSample(i))).toBe(true);

    const delivered = lossy.filter((r) => r.delivered).map((r) => r.sample.seq!);
    let gaps = delivered[0]!;
    for (let i = 1; i < delivered.length; i++) gaps += delivered[i]! - delivered[i - 1]! - 1;
    gaps += lossy.length - 1 - delivered.at(-1)!;
    expect(gaps).toBe(lost);

    // Loss draws from its own generator: the same eye and the same samples without loss.
    const lossless = simulate({ rateHz: 1000, seed: 8 }, 120);
    expect(lossless.every((r) => r.delivered)).toBe(true);
    expect(lossy.map((r) => r.sample)).toEqual(lossless.map((r) => r.sample));
  });

  it('sends blinks as invalid samples on the grid, of plausible duration and rate, never omitted', () => {
    const rateHz = 250;
    const records = simulate({ rateHz, seed: 5, lossPct: 30 }, 600);
    expect(records.map((r) => r.sample.seq)).toEqual(records.map((_, k) => k));
    const closed = (i: number) => !records[i]!.sample.left!.valid;
    expect(records.every((r, i) => r.sample.right!.valid === !closed(i))).toBe(true);
    const blinks = runs(records.length, closed);
    const blinkSamples = blinks.flatMap(([i, j]) => records.slice(i, j + 1));
    expect(blinkSamples.every((r) => r.delivered)).toBe(true);
    // No position and no pupil while the lids are closed.
    const empty = (e: EyeSample) => Number.isNaN(e.x) && Number.isNaN(e.y) && e.pupil === null;
    expect(blinkSamples.every((r) => empty(r.sample.left!) && empty(r.sample.right!))).toBe(true);
    for (const [i, j] of blinks) {
      // 100-300 ms (Bentivoglio et al. 1997 and the example; value from memory), to within a sample.
      const durationS = (j - i + 1) / rateHz;
      expect(durationS).toBeGreaterThanOrEqual(0.1 - 1 / rateHz);
      expect(durationS).toBeLessThanOrEqual(0.3 + 1 / rateHz);
    }
    for (let b = 1; b < blinks.length; b++) {
      const intervalS = (blinks[b]![0] - blinks[b - 1]![0]) / rateHz;
      expect(intervalS).toBeGreaterThanOrEqual(2 - 1 / rateHz);
      expect(intervalS).toBeLessThanOrEqual(6 + 1 / rateHz);
    }
    // About 15 a minute: within the resting range of 10-20 (Bentivoglio et al. 1997, value from memory).
    const perMinute = blinks.length / 10;
    expect(perMinute).toBeGreaterThan(12);
    expect(perMinute).toBeLessThan(18);
  });

  it('records the eyes asked for, with their own noise, and a pupil size in mm', () => {
    const left = simulate({ rateHz: 100, seed: 1, eyes: 'left' }, 2);
    expect(left.every((r) => r.sample.left !== null && r.sample.right === null)).toBe(true);
    const right = simulate({ rateHz: 100, seed: 1, eyes: 'right' }, 2);
    expect(right.every((r) => r.sample.left === null && r.sample.right !== null)).toBe(true);
    const both = simulate({ rateHz: 100, seed: 1 }, 20).filter((r) => r.sample.left!.valid);
    expect(both.every((r) => r.sample.left!.x !== r.sample.right!.x)).toBe(true);
    // A lit-room pupil of about 3.5 mm, between 2 and 8 mm (value from memory).
    expect(both.every((r) => r.sample.left!.pupil! > 2 && r.sample.left!.pupil! < 8)).toBe(true);
  });

  it('describes itself in the feed’s hello', () => {
    const tracker = new SimulatedTracker({ rateHz: 500, seed: 9, display: DISPLAY, startHostS: 0, eyes: 'left' });
    expect(tracker.hello()).toEqual({ protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 500, eyes: 'left', screen: { widthPx: 1920, heightPx: 1080 }, pupilUnit: 'mm', source: 'gazeloom simulated tracker (seed 9)' });
  });

  it('refuses bad options and look targets, naming them', () => {
    const base = { rateHz: 500, seed: 1, display: DISPLAY, startHostS: 0 };
    expect(() => new SimulatedTracker({ ...base, rateHz: 0 })).toThrow(/^rateHz must be a number in \(0, 10000\], got 0$/);
    expect(() => new SimulatedTracker({ ...base, seed: 1.5 })).toThrow(/seed must be an integer/);
    expect(() => new SimulatedTracker({ ...base, lossPct: 101 })).toThrow(/lossPct must be a number in \[0, 100\], got 101/);
    expect(() => new SimulatedTracker({ ...base, noiseDeg: -0.1 })).toThrow(/noiseDeg must be a finite number >= 0/);
    expect(() => new SimulatedTracker({ ...base, latencyMs: Number.NaN })).toThrow(/latencyMs/);
    expect(() => new SimulatedTracker({ ...base, skewPpm: 2e4 })).toThrow(/skewPpm/);
    expect(() => new SimulatedTracker({ ...base, eyes: 'cyclops' as never })).toThrow(/eyes must be 'left', 'right' or 'both'/);
    expect(() => new SimulatedTracker({ ...base, display: { ...DISPLAY, distanceMm: 0 } })).toThrow(/display\.distanceMm/);
    expect(() => new SimulatedTracker({ ...base, eyeMotion: { pursuitGain: -1 } })).toThrow(/eyeMotion\.pursuitGain/);
    const tracker = new SimulatedTracker(base);
    tracker.samplesUntil(1);
    expect(() => tracker.setLook(point(10, 10), 0.5)).toThrow(/atHostS \(0\.5\) must not be earlier than 1/);
    expect(() => tracker.setLook(point(Number.NaN, 10), 2)).toThrow(/target\.x must be a finite number/);
    expect(() => tracker.setLook({ kind: 'clip', tracks: null as never, placement: null as never, clipStartHostS: 2, speed: 0 }, 2)).toThrow(/target\.speed must be a finite number > 0/);
    expect(() => tracker.setLook(point(10, 10), 1)).not.toThrow();
  });
});
