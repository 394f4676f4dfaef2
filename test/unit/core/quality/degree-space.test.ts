import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { accuracyOfMeanDeg, dataLossPct, expectedSampleCount, rmsS2SDeg, stdDeg } from '../../../../app/core/quality';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const fixtureDir = join(__dirname, '../../../fixtures/quality');
const script = join(fixtureDir, 'quality_reference.py');
const hasNumpy = spawnSync('/usr/bin/python3', ['-c', 'import numpy'], { stdio: 'ignore' }).status === 0;

// REFERENCES.md section 3: Holmqvist, Nyström and Mulvey (2012), "Eye tracker data quality:
// what it is and how to measure it", Proc. ETRA, pp. 45–52 (values computed with numpy 1.24).
const gx = [0.5, 0.62, 0.41, 0.55, 0.47, 0.58];
const gy = [0.2, 0.31, 0.12, 0.26, 0.18, 0.22];

describe('degree-space measures on the worked example of REFERENCES.md section 3', () => {
  it('accuracy is the offset of the mean gaze, 0.5642349786313421 (not the per-sample mean 0.5651446443386273)', () => {
    const accuracy = accuracyOfMeanDeg(gx, gy, 0, 0);
    expect(Math.abs(accuracy - 0.5642349786313421)).toBeLessThan(1e-12);
    expect(Math.abs(accuracy - 0.5651446443386273)).toBeGreaterThan(1e-4);
  });

  it('RMS-S2S is 0.1856879102149626 and STD 0.09222556888171282', () => {
    expect(Math.abs(rmsS2SDeg(gx, gy) - 0.1856879102149626)).toBeLessThan(1e-12);
    expect(Math.abs(stdDeg(gx, gy) - 0.09222556888171282)).toBeLessThan(1e-12);
  });

  it('data loss of the valid mask 1101110011 is 30%', () => {
    const mask = '1101110011';
    const valid = [...mask].filter((c) => c === '1').length;
    expect(dataLossPct(valid, mask.length)).toBe(30);
  });

  it('white noise gives RMS/STD close to √2 (section 3: σ = 0.1°, 200k samples, 1.41573 with numpy)', () => {
    const rng = new Xoshiro128(5);
    const n = 200_000;
    const xs = Float64Array.from({ length: n }, () => 0.1 * rng.nextGaussian());
    const ys = Float64Array.from({ length: n }, () => 0.1 * rng.nextGaussian());
    expect(rmsS2SDeg(xs, ys) / stdDeg(xs, ys)).toBeCloseTo(Math.SQRT2, 2);
  });
});

describe('degree-space measures: invalid samples and bad input', () => {
  it('leaves NaN samples out of the means, and measures steps only between valid neighbours', () => {
    const xs = [0, 1, Number.NaN, 5, 6];
    const ys = [0, 0, Number.NaN, 0, 0];
    // Steps 0→1 and 5→6 only: never across the gap from 1 to 5.
    expect(rmsS2SDeg(xs, ys)).toBe(1);
    expect(accuracyOfMeanDeg(xs, ys, 3, 4)).toBe(4);
    expect(stdDeg(xs, ys)).toBeCloseTo(Math.sqrt((9 + 4 + 4 + 9) / 4), 14);
  });

  it('is NaN with too few valid samples', () => {
    expect(accuracyOfMeanDeg([], [], 0, 0)).toBeNaN();
    expect(stdDeg([Number.NaN], [1])).toBeNaN();
    expect(rmsS2SDeg([1, Number.NaN, 2], [0, 0, 0])).toBeNaN();
    expect(stdDeg([2], [3])).toBe(0);
  });

  it('throws RangeError naming the parameter', () => {
    expect(() => rmsS2SDeg([1, 2], [1])).toThrow(/xs and ys must have the same length/);
    expect(() => accuracyOfMeanDeg([1], [1], Number.NaN, 0)).toThrow(RangeError);
    expect(() => dataLossPct(3, 0)).toThrow(/expected must be a number > 0/);
    expect(() => dataLossPct(-1, 10)).toThrow(/valid must be an integer >= 0/);
    expect(() => expectedSampleCount(300, 300, 500)).toThrow(/window must run forwards/);
    expect(() => expectedSampleCount(300, 1300, 0)).toThrow(/rateHz/);
  });

  it('counts more valid samples than expected as no loss, and expects duration × rate', () => {
    expect(dataLossPct(501, 500)).toBe(0);
    expect(expectedSampleCount(300, 1300, 500)).toBe(500);
    expect(expectedSampleCount(300, 1300, 60)).toBe(60);
    expect(expectedSampleCount(0, 1, 30)).toBe(1);
  });
});

type GazeSet = { name: string; x: (number | null)[]; y: (number | null)[]; tx: number; ty: number; accuracy_of_mean: number; rms_s2s: number; std: number };
const nan = (a: (number | null)[]) => a.map((v) => (v === null ? Number.NaN : v));

function expectNumpyAgreement(sets: GazeSet[]): void {
  for (const s of sets) {
    const x = nan(s.x);
    const y = nan(s.y);
    expect(Math.abs(accuracyOfMeanDeg(x, y, s.tx, s.ty) - s.accuracy_of_mean), s.name).toBeLessThan(1e-12);
    expect(Math.abs(rmsS2SDeg(x, y) - s.rms_s2s), s.name).toBeLessThan(1e-12);
    expect(Math.abs(stdDeg(x, y) - s.std), s.name).toBeLessThan(1e-12);
  }
}

describe('degree-space measures against numpy (test/fixtures/quality/quality_reference.py)', () => {
  it('match the stored numpy values on seeded sets with blinks and correlated noise', () => {
    const stored = JSON.parse(readFileSync(join(fixtureDir, 'quality_reference.json'), 'utf8')) as { gaze: GazeSet[] };
    expect(stored.gaze.length).toBe(2);
    expectNumpyAgreement(stored.gaze);
  });

  it.skipIf(!hasNumpy)('the stored fixture is what quality_reference.py prints today', () => {
    const stored = JSON.parse(readFileSync(join(fixtureDir, 'quality_reference.json'), 'utf8')) as Record<string, unknown>;
    const today = JSON.parse(execFileSync('/usr/bin/python3', [script], { encoding: 'utf8' })) as Record<string, unknown>;
    expect({ ...today, numpy: null }).toEqual({ ...stored, numpy: null });
  });

  it.skipIf(!hasNumpy)('match numpy run live through /usr/bin/python3 on random sets', () => {
    const rng = new Xoshiro128(31);
    const gaze = [300, 40].map((n, k) => {
      const x: (number | null)[] = Array.from({ length: n }, () => k + 0.2 * rng.nextGaussian());
      const y: (number | null)[] = Array.from({ length: n }, () => -k + 0.2 * rng.nextGaussian());
      for (let i = 0; i < n; i += 7) x[i] = y[i] = null;
      return { x, y, tx: k, ty: 0.5 };
    });
    const live = JSON.parse(execFileSync('/usr/bin/python3', [script, '--stdin'], { input: JSON.stringify({ drift: [], gaze }), encoding: 'utf8' })) as { gaze: GazeSet[] };
    expect(live.gaze.length).toBe(2);
    expectNumpyAgreement(live.gaze.map((s) => ({ ...s, name: 'live' })));
  });
});
