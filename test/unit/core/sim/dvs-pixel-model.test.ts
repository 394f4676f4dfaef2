import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { OFF, ON, type EventBatch } from '../../../../app/core/events/event-batch';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { DvsPixelModel } from '../../../../app/core/sim/dvs-pixel-model';
import type { DvsParams } from '../../../../app/core/sim/dvs-params';
import { EventBuffer } from '../../../../app/core/sim/event-buffer';

/** An ideal pixel: no mismatch, noise, hot pixels or refractory period, exact timestamps. */
const IDEAL: Partial<DvsParams> = { thresholdMismatchSigma: 0, refractoryUs: 0, noiseRateHz: 0, hotPixelCount: 0, timeResolution: null };

/** Runs one pixel through log-intensity samples at the given times (µs) and returns its events. */
function runPixel(tUs: readonly number[], logIntensity: readonly number[], params: Partial<DvsParams>): EventBatch {
  const model = new DvsPixelModel({ width: 1, height: 1 }, { ...IDEAL, ...params }, new Xoshiro128(1));
  const out = new EventBuffer();
  model.reset(Float64Array.of(logIntensity[0]!));
  for (let k = 1; k < tUs.length; k++) model.step(Float64Array.of(logIntensity[k]!), tUs[k - 1]!, tUs[k]!, out);
  return out.take();
}

/** Samples of f at t = k * stepS for k = 0..n (times returned in µs). */
function sampled(n: number, stepS: number, f: (tS: number) => number): { tUs: number[]; values: number[] } {
  const tS = Array.from({ length: n + 1 }, (_, k) => k * stepS);
  return { tUs: tS.map((t) => t * 1e6), values: tS.map(f) };
}

function referenceRun(script: string): unknown {
  try {
    return JSON.parse(execFileSync('/usr/bin/python3', [script], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }));
  } catch {
    return null;
  }
}

const seconds = (batch: EventBatch): number[] => Array.from(batch.t, (t) => t / 1e6);

describe('DvsPixelModel against the analytic answers', () => {
  it('a linear log-intensity ramp by D over T gives floor(|D|/C) events at k*C/|D|*T, both polarities (Gallego et al. 2020, eq. 1)', () => {
    const C = 0.2;
    const T = 0.07;
    // D / C = 6.5 and 26.5: away from exact crossings at the last sample. Three frames for D = 5.3 puts nine crossings in each.
    for (const [D, frames] of [[1.3, 7], [-1.3, 7], [5.3, 3], [-5.3, 3]] as const) {
      const { tUs, values } = sampled(frames, T / frames, (t) => Math.log(150) + (D * t) / T);
      const events = runPixel(tUs, values, { contrastThresholdOn: C, contrastThresholdOff: C });
      const n = Math.floor(Math.abs(D) / C);
      expect(events.t.length).toBe(n);
      expect(Array.from(events.p)).toEqual(Array(n).fill(D > 0 ? ON : OFF));
      seconds(events).forEach((t, i) => expect(Math.abs(t - ((i + 1) * C * T) / Math.abs(D))).toBeLessThan(1e-12));
    }
  });

  it('a step that doubles the intensity gives 6/4/3/2/1 ON events for C = 0.1/0.15/0.2/0.3/0.5; halving at C = 0.2 gives 3 OFF (REFERENCES.md section 6, t6_dvs.py)', () => {
    const doubling = [Math.log(100), Math.log(200)];
    const counts = [0.1, 0.15, 0.2, 0.3, 0.5].map((C) => {
      const events = runPixel([0, 1000], doubling, { contrastThresholdOn: C, contrastThresholdOff: C });
      expect(events.p.every((p) => p === ON)).toBe(true);
      return events.t.length;
    });
    expect(counts).toEqual([6, 4, 3, 2, 1]);
    const halving = runPixel([0, 1000], [Math.log(200), Math.log(100)], { contrastThresholdOn: 0.2, contrastThresholdOff: 0.2 });
    expect(Array.from(halving.p)).toEqual([OFF, OFF, OFF]);
  });

  it('I = 100 e^t sampled every 1 ms fires at exactly t = 0.2, 0.4, 0.6, 0.8 s for C = 0.2 (REFERENCES.md section 6)', () => {
    // Stop at 0.999 s: the crossing at 1.0 s is ambiguous in floating point.
    const { tUs, values } = sampled(999, 0.001, (t) => Math.log(100 * Math.exp(t)));
    const events = runPixel(tUs, values, { contrastThresholdOn: 0.2, contrastThresholdOff: 0.2 });
    const t = seconds(events);
    expect(t.length).toBe(4);
    [0.2, 0.4, 0.6, 0.8].forEach((expected, i) => expect(Math.abs(t[i]! - expected)).toBeLessThan(1e-12));
  });

  it('I = 100(1 + t) sampled every 10 µs fires at t_k = e^(kC) - 1 (REFERENCES.md section 6)', () => {
    const { tUs, values } = sampled(100000, 1e-5, (t) => Math.log(100 * (1 + t)));
    const t = seconds(runPixel(tUs, values, { contrastThresholdOn: 0.2, contrastThresholdOff: 0.2 }));
    const expected = [0.22140275816016985, 0.49182469764127035, 0.8221188003905091];
    expect(t.length).toBe(3);
    // Linear interpolation of ln(1 + t) over 10 µs errs by at most dt^2/8 * |L''/L'| = 1.25e-11 s.
    expected.forEach((e, i) => expect(Math.abs(t[i]! - e)).toBeLessThan(1e-10));
  });

  it('I = 100 e^(10t), C = 0.2: events every 20 ms, and a 30 ms refractory period keeps only 20 and 60 ms in [0, 0.1) (REFERENCES.md section 6)', () => {
    const { tUs, values } = sampled(9999, 1e-5, (t) => Math.log(100 * Math.exp(10 * t)));
    const free = seconds(runPixel(tUs, values, { contrastThresholdOn: 0.2, contrastThresholdOff: 0.2 }));
    [0.02, 0.04, 0.06, 0.08].forEach((e, i) => expect(Math.abs(free[i]! - e)).toBeLessThan(1e-12));
    expect(free.length).toBe(4);
    // Suppressed crossings still advance the reference: were they not to, 40 ms would fire two events at once at 60 ms.
    const refractory = seconds(runPixel(tUs, values, { contrastThresholdOn: 0.2, contrastThresholdOff: 0.2, refractoryUs: 30000 }));
    expect(refractory.length).toBe(2);
    [0.02, 0.06].forEach((e, i) => expect(Math.abs(refractory[i]! - e)).toBeLessThan(1e-12));
  });

  it('matches the reference model of t6_dvs.py on a waveform with several crossings per sample, unequal thresholds and a refractory period', () => {
    const dir = join(__dirname, '../../../fixtures/sim');
    type Reference = { C_on: number; C_off: number; refractory_s: number; t_s: number[]; intensity: number[]; events: [number, number][] };
    const stored = JSON.parse(readFileSync(join(dir, 'dvs_reference.json'), 'utf8')) as Reference;
    // Debian's python3-numpy recomputes the reference where it is installed (always in CI); the stored copy serves elsewhere.
    const live = referenceRun(join(dir, 'dvs_reference.py')) as Reference | null;
    if (live) expect(live.events).toEqual(stored.events);
    const events = runPixel(
      stored.t_s.map((t) => t * 1e6),
      stored.intensity.map(Math.log),
      { contrastThresholdOn: stored.C_on, contrastThresholdOff: stored.C_off, refractoryUs: stored.refractory_s * 1e6 },
    );
    expect(events.t.length).toBe(stored.events.length);
    stored.events.forEach(([t, p], i) => {
      expect(Math.abs(events.t[i]! / 1e6 - t)).toBeLessThan(1e-12);
      expect(events.p[i]).toBe(p > 0 ? ON : OFF);
    });
  });
});

describe('DvsPixelModel ordering and timestamps', () => {
  const ramps = (params: Partial<DvsParams>) => {
    // Pixels 0 and 2 ramp identically (ties), pixel 1 falls twice as fast, pixel 3 stays put.
    const model = new DvsPixelModel({ width: 2, height: 2 }, { ...IDEAL, ...params }, new Xoshiro128(1));
    const out = new EventBuffer();
    model.reset(Float64Array.of(0, 0, 0, 0));
    model.step(Float64Array.of(0.93, -1.86, 0.93, 0), 1000, 1777, out);
    return out.take();
  };

  it('emits an interval in time order, ties by pixel index (common practice, no source)', () => {
    const e = ramps({ contrastThresholdOn: 0.2, contrastThresholdOff: 0.2 });
    const rows = Array.from(e.t, (t, i) => [t, e.y[i]! * 2 + e.x[i]!, e.p[i]!] as const);
    expect(rows.length).toBe(4 + 9 + 4);
    for (let i = 1; i < rows.length; i++) {
      const [t0, px0] = rows[i - 1]!;
      const [t1, px1] = rows[i]!;
      expect(t1 > t0 || (t1 === t0 && px1 > px0)).toBe(true);
    }
    // The k-th ON crossing of pixels 0 and 2 at 1000 + 777 * 0.2k / 0.93 µs, the OFF ones of pixel 1 at twice the rate.
    const onTimes = rows.filter(([, px]) => px === 0).map(([t]) => t);
    onTimes.forEach((t, k) => expect(t).toBeCloseTo(1000 + (777 * 0.2 * (k + 1)) / 0.93, 9));
    expect(rows.filter(([, px]) => px === 1).every(([, , p]) => p === OFF)).toBe(true);
  });

  it('truncates to the microsecond or nanosecond tick, keeping (tPrev, tNow] inside [tPrev, tNow)', () => {
    const exact = ramps({ contrastThresholdOn: 0.2, contrastThresholdOff: 0.2 });
    const us = ramps({ contrastThresholdOn: 0.2, contrastThresholdOff: 0.2, timeResolution: 'us' });
    const ns = ramps({ contrastThresholdOn: 0.2, contrastThresholdOff: 0.2, timeResolution: 'ns' });
    expect(Array.from(us.t)).toEqual(Array.from(exact.t, Math.floor));
    expect(Array.from(ns.t)).toEqual(Array.from(exact.t, (t) => Math.floor(t * 1000) / 1000));
    // A crossing exactly at tNow (three steps of 0.25, exact in binary, reach 0.75 on the sample) stays below tNow.
    const atEnd = runPixel([0, 1000], [0, 0.75], { contrastThresholdOn: 0.25, timeResolution: 'us' });
    expect(Array.from(atEnd.t)).toEqual([333, 666, 999]);
  });

  it('visits only the listed pixels when told which changed, with the same events as visiting all', () => {
    const run = (listChanged: boolean) => {
      const model = new DvsPixelModel({ width: 8, height: 8 }, { noiseRateHz: 5, hotPixelCount: 2 }, new Xoshiro128(3));
      const frame = new Float32Array(64).fill(4);
      const out = new EventBuffer();
      model.reset(frame);
      for (let k = 1; k <= 50; k++) {
        frame[9] = 4 + Math.sin(k / 5);
        frame[40] = 4 - Math.sin(k / 3);
        model.step(frame, (k - 1) * 1000, k * 1000, out, listChanged ? Uint32Array.of(9, 40, 9) : undefined);
      }
      return out.take();
    };
    const all = run(false);
    expect(all.t.length).toBeGreaterThan(20);
    expect(run(true)).toEqual(all);
  });
});

describe('DvsPixelModel mismatch, noise and hot pixels', () => {
  it('draws per-pixel thresholds with the configured mean and sigma, ON and OFF independent (sampling statistics, common practice)', () => {
    const n = 200 * 200;
    const model = new DvsPixelModel({ width: 200, height: 200 }, { contrastThresholdOn: 0.2, contrastThresholdOff: 0.3, thresholdMismatchSigma: 0.02 }, new Xoshiro128(11));
    const stats = (a: Float64Array) => {
      const mean = a.reduce((s, v) => s + v, 0) / n;
      return { mean, sd: Math.sqrt(a.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1)) };
    };
    const on = stats(model.thresholdsOn);
    const off = stats(model.thresholdsOff);
    // Standard errors: of the mean 0.02/200 = 1e-4, of the sd about 0.02/sqrt(2n) = 7e-5; five of each allowed.
    expect(Math.abs(on.mean - 0.2)).toBeLessThan(5e-4);
    expect(Math.abs(off.mean - 0.3)).toBeLessThan(5e-4);
    expect(Math.abs(on.sd - 0.02)).toBeLessThan(3.5e-4);
    expect(Math.abs(off.sd - 0.02)).toBeLessThan(3.5e-4);
    let cov = 0;
    for (let i = 0; i < n; i++) cov += (model.thresholdsOn[i]! - on.mean) * (model.thresholdsOff[i]! - off.mean);
    expect(Math.abs(cov / (n * on.sd * off.sd))).toBeLessThan(5 / Math.sqrt(n));
  });

  it('fires background noise as a Poisson process per pixel at the configured rate, either polarity (Poisson counts: mean = variance)', () => {
    const side = 100;
    const rateHz = 1;
    const durationS = 10;
    const model = new DvsPixelModel({ width: side, height: side }, { noiseRateHz: rateHz, hotPixelCount: 0 }, new Xoshiro128(5));
    const frame = new Float32Array(side * side);
    const out = new EventBuffer();
    model.reset(frame);
    const nothingChanged = new Uint32Array(0);
    for (let k = 1; k <= durationS * 1000; k++) model.step(frame, (k - 1) * 1000, k * 1000, out, nothingChanged);
    const events = out.take();
    const expected = side * side * rateHz * durationS;
    expect(Math.abs(events.t.length - expected)).toBeLessThan(5 * Math.sqrt(expected));
    const on = events.p.reduce((s, p) => s + p, 0);
    expect(Math.abs(on - expected / 2)).toBeLessThan(5 * Math.sqrt(expected / 4));
    const perPixel = new Float64Array(side * side);
    events.x.forEach((x, i) => perPixel[events.y[i]! * side + x]++);
    const mean = perPixel.reduce((s, v) => s + v, 0) / perPixel.length;
    const variance = perPixel.reduce((s, v) => s + (v - mean) ** 2, 0) / (perPixel.length - 1);
    // Index of dispersion of Poisson counts: 1, with standard error sqrt(2 / (n - 1)) = 0.014.
    expect(Math.abs(variance / mean - 1)).toBeLessThan(0.07);
    expect(Array.from(events.t).every((t, i) => i === 0 || t >= events.t[i - 1]!)).toBe(true);
  });

  it('has the configured number of hot pixels, firing ON at their own rate far above the rest', () => {
    const model = new DvsPixelModel({ width: 64, height: 48 }, { noiseRateHz: 0.5, hotPixelCount: 5, hotPixelRateHz: 200 }, new Xoshiro128(9));
    const frame = new Float32Array(64 * 48);
    const out = new EventBuffer();
    model.reset(frame);
    for (let k = 1; k <= 2000; k++) model.step(frame, (k - 1) * 1000, k * 1000, out, new Uint32Array(0));
    const events = out.take();
    const counts = new Map<number, number>();
    events.x.forEach((x, i) => counts.set(events.y[i]! * 64 + x, (counts.get(events.y[i]! * 64 + x) ?? 0) + 1));
    const busy = [...counts].filter(([, n]) => n > 100).map(([pixel]) => pixel).sort((a, b) => a - b);
    expect(model.hotPixels.length).toBe(5);
    expect(busy).toEqual(Array.from(model.hotPixels));
    for (const pixel of busy) expect(Math.abs(counts.get(pixel)! - 400)).toBeLessThan(5 * Math.sqrt(400) + 3);
    expect(events.p.filter((p, i) => busy.includes(events.y[i]! * 64 + events.x[i]!) && p === OFF).length).toBeLessThan(10);
  });

  it('is reproducible from its generator and differs between seeds', () => {
    const build = (seed: number) => new DvsPixelModel({ width: 32, height: 32 }, {}, new Xoshiro128(seed));
    expect(build(4).thresholdsOn).toEqual(build(4).thresholdsOn);
    expect(build(4).hotPixels).toEqual(build(4).hotPixels);
    expect(build(4).thresholdsOn).not.toEqual(build(5).thresholdsOn);
  });
});

describe('DvsPixelModel input checks', () => {
  const sensor = { width: 4, height: 3 };
  it('rejects bad parameters with a RangeError naming them', () => {
    const make = (params: Partial<DvsParams>) => () => new DvsPixelModel(sensor, params, new Xoshiro128(1));
    expect(make({ contrastThresholdOn: 0 })).toThrow(/contrastThresholdOn/);
    expect(make({ contrastThresholdOff: Number.NaN })).toThrow(/contrastThresholdOff/);
    expect(make({ thresholdMismatchSigma: -0.1 })).toThrow(/thresholdMismatchSigma/);
    expect(make({ refractoryUs: Infinity })).toThrow(/refractoryUs/);
    expect(make({ noiseRateHz: -1 })).toThrow(/noiseRateHz/);
    expect(make({ hotPixelCount: 13 })).toThrow(/hotPixelCount must be an integer in 0..12/);
    expect(make({ hotPixelCount: 1.5 })).toThrow(RangeError);
    expect(make({ timeResolution: 'ms' as never })).toThrow(/timeResolution/);
    expect(() => new DvsPixelModel({ width: 0, height: 3 }, {}, new Xoshiro128(1))).toThrow(/sensor.width/);
  });

  it('rejects frames of the wrong size, time running backwards and stepping before reset', () => {
    const model = new DvsPixelModel(sensor, {}, new Xoshiro128(1));
    const out = new EventBuffer();
    expect(() => model.step(new Float32Array(12), 0, 1000, out)).toThrow(/before reset/);
    expect(() => model.reset(new Float32Array(11))).toThrow(/initialLogIntensity must hold 12 pixels \(4x3\), got 11/);
    model.reset(new Float32Array(12));
    expect(() => model.step(new Float32Array(13), 0, 1000, out)).toThrow(/logIntensity must hold 12/);
    expect(() => model.step(new Float32Array(12), 1000, 1000, out)).toThrow(/tNowUs must be finite and after tPrevUs/);
  });
});
