import { describe, expect, it } from 'vitest';
import { rateBinWidthMs, rateSeriesFromMsBins } from '../../../../app/core/events/stats';

describe('rateBinWidthMs (1-2-5 steps of milliseconds; common practice, no source)', () => {
  it('picks the smallest 1-2-5 width that fits the stream into 1000 points', () => {
    const cases: Array<[msBins: number, widthMs: number]> = [
      [0, 1], [1, 1], [1000, 1], [1001, 2], [2000, 2], [2001, 5], [5000, 5], [5001, 10],
      [10_000, 10], [10_001, 20], [3_600_000, 5000], [3_600_001, 5000], [5_000_001, 10_000],
    ];
    for (const [msBins, widthMs] of cases) expect([msBins, rateBinWidthMs(msBins)]).toEqual([msBins, widthMs]);
  });

  it('honours another point budget and refuses a budget below one point', () => {
    expect(rateBinWidthMs(100, 10)).toBe(10);
    expect(rateBinWidthMs(101, 10)).toBe(20);
    expect(() => rateBinWidthMs(100, 0)).toThrow(/maxPoints/);
  });
});

describe('rateSeriesFromMsBins (common practice, no source)', () => {
  it('keeps 1 ms bins as they are for a short stream', () => {
    expect(rateSeriesFromMsBins(Uint32Array.of(3, 0, 7, 99), 3)).toEqual({ bin_s: 0.001, rate_hz: [3000, 0, 7000] });
  });

  it('merges bins and divides the last, partial one by the full width', () => {
    // 11 ms into at most 3 points: 5 ms bins [0,5) [5,10) [10,11).
    const ms = Uint32Array.of(1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11);
    expect(rateSeriesFromMsBins(ms, 11, 3)).toEqual({ bin_s: 0.005, rate_hz: [3000, 8000, 2200] });
  });

  it('keeps every event: sum of rate * bin width is the count', () => {
    const ms = new Uint32Array(123_457).map((_, i) => (i * 7919) % 13);
    const total = ms.reduce((a, b) => a + b, 0);
    const s = rateSeriesFromMsBins(ms, ms.length);
    expect(s.bin_s).toBe(0.2);
    expect(s.rate_hz.length).toBe(618);
    expect(s.rate_hz.reduce((sum, r) => sum + r * s.bin_s, 0)).toBeCloseTo(total, 6);
  });
});
