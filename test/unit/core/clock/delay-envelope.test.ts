import { describe, expect, it } from 'vitest';
import { DelayEnvelope } from '../../../../app/core/clock/delay-envelope';
import { windowMinima } from '../../../../app/core/clock/window-minima';

describe('DelayEnvelope, the streaming window minima (common practice, no source)', () => {
  it('keeps the least-delay sample of each closed window, relative to the first sample and the first point', () => {
    const e = new DelayEnvelope(1, 10);
    // Delays (arrival − tracker): window 0: 5, 3, 4 ms; window 1: 2, 6 ms; window 2 (open): 1 ms.
    for (const [t, d] of [[10, 5], [10.4, 3], [10.9, 4], [11.1, 2], [11.7, 6], [12.2, 1]] as const) e.add(t, t - 7 + d * 1e-3);
    expect(e.closedWindows).toBe(2);
    const p = e.points();
    expect(Array.from(p.x)).toEqual([10.4 - 10, 11.1 - 10]);
    expect(p.originTS).toBe(10);
    expect(p.originDS).toBeCloseTo(-7 + 3e-3, 12);
    expect(p.y[1]).toBeCloseTo(-1e-3, 12);
    const all = e.windowPoints();
    expect(all.trackerTimeS).toEqual([10.4, 11.1, 12.2]);
    all.delayS.forEach((d, i) => expect(d).toBeCloseTo(-7 + [3, 2, 1][i]! * 1e-3, 12));
  });

  it('lowers a closed window with a late sample, changes its version, and ignores samples of windows no longer kept', () => {
    const e = new DelayEnvelope(1, 2);
    for (const t of [0.5, 1.5, 2.5, 3.5]) e.add(t, t + 0.01);
    expect(e.closedWindows).toBe(2); // windows 1 and 2; window 0 has left the ring
    const v = e.version;
    e.add(2.7, 2.7 + 0.005); // late, lower: window 2 ([2.5, 3.5) from the first sample) takes it
    expect(e.version).toBe(v + 1);
    expect(e.points().x[1]).toBeCloseTo(2.7 - 0.5, 12);
    e.add(2.8, 2.8 + 0.009); // late, not lower
    e.add(0.7, 0.7 + 0.001); // window 0 is gone
    expect(e.version).toBe(v + 1);
  });

  it('chooses minima against the trend it is given, keeping the samples themselves', () => {
    const e = new DelayEnvelope(1, 10);
    e.trendSlope = -50e-6;
    // Jitter 5 µs at 0 s, then 8 µs at 0.9 s where the drift has taken 45 µs off the delay: the raw delay favours the
    // second (-37 µs < 5 µs), the detrended one the first, less jittered sample.
    e.add(0, 5e-6);
    e.add(0.9, 0.9 + 8e-6 - 45e-6);
    e.add(1.5, 1.5);
    expect(e.points().x[0]).toBe(0);
  });

  it('forgets everything on reset()', () => {
    const e = new DelayEnvelope(1, 10);
    e.add(0, 1);
    e.add(2, 3);
    e.reset();
    expect(e.closedWindows).toBe(0);
    expect(e.windowPoints()).toEqual({ trackerTimeS: [], delayS: [] });
    expect(e.latestTrackerS).toBeNaN();
  });

  it('throws RangeError for bad parameters', () => {
    expect(() => new DelayEnvelope(NaN, 10)).toThrow(/windowS must be a positive number/);
    expect(() => new DelayEnvelope(1, 0)).toThrow(/maxWindows must be a positive integer/);
  });
});

describe('windowMinima, the batch window minima (common practice, no source)', () => {
  it('cuts windows from the earliest tracker time in any input order and skips empty windows', () => {
    const t = [3.2, 0.1, 0.6, 7.5, 3.9];
    const d = [2, 4, 3, 1, 1.5].map((v) => v * 1e-3);
    const m = windowMinima(t, t.map((v, i) => v + d[i]!), 1, 0);
    expect(m.originTS).toBe(0.1);
    expect(Array.from(m.x, (x) => m.originTS + x)).toEqual([0.6, 3.9, 7.5]);
    expect(m.originDS).toBeCloseTo(3e-3, 12);
    expect(m.spanS).toBeCloseTo(7.4, 12);
  });
});
