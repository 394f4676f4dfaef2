import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { driftOffset, driftRateDegPerMin, meanDriftOffset, summarizeDriftCheck } from '../../../../app/core/quality';
import type { TargetResult } from '../../../../app/core/study/records';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const fixtureDir = join(__dirname, '../../../fixtures/quality');
const script = join(fixtureDir, 'quality_reference.py');
const hasNumpy = spawnSync('/usr/bin/python3', ['-c', 'import numpy'], { stdio: 'ignore' }).status === 0;

type DriftSet = { name: string; t: number[]; offset: number[]; rate_deg_per_min: number };

const point = (over: Partial<TargetResult>): TargetResult => ({ x: 960, y: 540, accuracyDeg: 0.5, precisionRmsS2SDeg: 0.02, precisionSdDeg: 0.03, dataLossPct: 0, samples: 500, dxDeg: 0.3, dyDeg: -0.4, ...over });

describe('driftRateDegPerMin: least-squares line with intercept, against numpy.polyfit', () => {
  it('is 60 × the slope of an exact line, whatever its intercept (common practice, no source)', () => {
    const t = [60, 600, 1200, 1800];
    expect(driftRateDegPerMin(t, t.map((s) => 0.7 + (1.5 * s) / 60))).toBeCloseTo(1.5, 12);
  });

  it('matches the stored numpy.polyfit rates (quality_reference.py, numpy 1.24)', () => {
    const stored = JSON.parse(readFileSync(join(fixtureDir, 'quality_reference.json'), 'utf8')) as { drift: DriftSet[] };
    expect(stored.drift.length).toBe(2);
    for (const s of stored.drift) expect(Math.abs(driftRateDegPerMin(s.t, s.offset)! - s.rate_deg_per_min), s.name).toBeLessThan(1e-10);
  });

  it.skipIf(!hasNumpy)('matches numpy.polyfit run live through /usr/bin/python3', () => {
    const rng = new Xoshiro128(8);
    const drift = [12, 2, 5].map((n) => {
      const t = Array.from({ length: n }, () => rng.next() * 3600).sort((a, b) => a - b);
      const rate = rng.next() * 2;
      return { t, offset: t.map((s) => 0.2 + (rate * s) / 60 + 0.1 * rng.nextGaussian()) };
    });
    const live = JSON.parse(execFileSync('/usr/bin/python3', [script, '--stdin'], { input: JSON.stringify({ drift, gaze: [] }), encoding: 'utf8' })) as { drift: DriftSet[] };
    live.drift.forEach((s) => expect(Math.abs(driftRateDegPerMin(s.t, s.offset)! - s.rate_deg_per_min)).toBeLessThan(1e-10 * Math.max(1, Math.abs(s.rate_deg_per_min))));
  });

  it('is null with fewer than two checks or all at one time, and names a bad value', () => {
    expect(driftRateDegPerMin([], [])).toBeNull();
    expect(driftRateDegPerMin([5], [1])).toBeNull();
    expect(driftRateDegPerMin([5, 5], [1, 2])).toBeNull();
    expect(() => driftRateDegPerMin([1, 2], [1])).toThrow(/same length/);
    expect(() => driftRateDegPerMin([1, Number.NaN], [1, 2])).toThrow(/timesS\[1\]/);
    expect(() => driftRateDegPerMin([1, 2], [1, Number.POSITIVE_INFINITY])).toThrow(/offsetsDeg\[1\]/);
  });
});

describe('drift offsets at a check', () => {
  it('takes dx, dy and the angle from the target result, and is null without valid gaze', () => {
    expect(driftOffset(point({}))).toEqual({ dxDeg: 0.3, dyDeg: -0.4, offsetDeg: 0.5 });
    expect(driftOffset(point({ accuracyDeg: null, dxDeg: null, dyDeg: null }))).toBeNull();
  });

  it('averages a check with a few targets over those with gaze', () => {
    const offset = meanDriftOffset([point({ dxDeg: 1, dyDeg: 0, accuracyDeg: 1 }), point({ dxDeg: 0, dyDeg: 2, accuracyDeg: 2 }), point({ accuracyDeg: null, dxDeg: null, dyDeg: null })]);
    expect(offset).toEqual({ dxDeg: 0.5, dyDeg: 1, offsetDeg: 1.5 });
    expect(meanDriftOffset([])).toBeNull();
  });

  it('accepts a check up to the protocol threshold and says why it does not', () => {
    expect(summarizeDriftCheck([point({ accuracyDeg: 1.5 })], { driftDeg: 1.5 })).toMatchObject({ accepted: true, reasons: [] });
    expect(summarizeDriftCheck([point({ accuracyDeg: 1.6 })], { driftDeg: 1.5 })).toMatchObject({ accepted: false, reasons: ['drift 1.60° exceeds 1.50°'] });
    expect(summarizeDriftCheck([point({ accuracyDeg: null, dxDeg: null, dyDeg: null })], { driftDeg: 1.5 })).toMatchObject({ offset: null, accepted: false });
    expect(() => summarizeDriftCheck([], { driftDeg: 0 })).toThrow(/thresholds.driftDeg/);
  });
});
