import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { leastSquaresLine } from '../../../../app/core/clock/least-squares-line';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const fixtureDir = join(__dirname, '../../../fixtures/clock');
const script = join(fixtureDir, 'line_fit_reference.py');
const hasNumpy = spawnSync('/usr/bin/python3', ['-c', 'import numpy, scipy'], { stdio: 'ignore' }).status === 0;

type ReferenceFit = { slope: number; intercept: number; linregress_slope: number; linregress_intercept: number };
type ReferenceSet = ReferenceFit & { name: string; x: number[]; y: number[] };

/** Agreement to 1e-12 of the scale of each quantity: the slope's own size, and for the intercept the size of the y values it is computed from. */
function expectSameFit(x: readonly number[], y: readonly number[], reference: { slope: number; intercept: number }): void {
  const fit = leastSquaresLine(x, y);
  const yScale = Math.max(...y.map(Math.abs), Math.abs(reference.slope) * Math.max(...x.map(Math.abs)));
  expect(Math.abs(fit.slope - reference.slope)).toBeLessThanOrEqual(1e-12 * Math.abs(reference.slope));
  expect(Math.abs(fit.intercept - reference.intercept)).toBeLessThanOrEqual(1e-12 * yScale);
}

describe('leastSquaresLine against the worked examples of REFERENCES.md section 7 (t7_clock.py: numpy polyfit, scipy linregress)', () => {
  const x = [0, 1, 2, 3, 4, 5];
  const exact = x.map((v) => 12.5 + (1 + 20e-6) * v);

  it('y = 12.5 + (1 + 20 ppm) x for x = 0..5 gives slope 1.00002 and intercept 12.5', () => {
    const fit = leastSquaresLine(x, exact);
    expect(Math.abs(fit.slope - 1.00002)).toBeLessThan(1e-12);
    expect(Math.abs(fit.intercept - 12.5)).toBeLessThan(1e-12);
  });

  it('with the noise [3, -2, 1, 0, -1, 2]e-4 gives slope 1.0000114285714286 and intercept 12.500071428571427', () => {
    const noise = [3, -2, 1, 0, -1, 2].map((v) => v * 1e-4);
    const fit = leastSquaresLine(x, exact.map((v, i) => v + noise[i]!));
    expect(Math.abs(fit.slope - 1.0000114285714286)).toBeLessThan(1e-12);
    expect(Math.abs(fit.intercept - 12.500071428571427)).toBeLessThan(1e-12);
  });
});

describe('leastSquaresLine against numpy.polyfit and scipy.stats.linregress', () => {
  it('matches the stored fits of line_fit_reference.py (test/fixtures/clock) on seeded sets', () => {
    const stored = JSON.parse(readFileSync(join(fixtureDir, 'line_fit_reference.json'), 'utf8')) as { sets: ReferenceSet[] };
    expect(stored.sets.length).toBe(3);
    for (const set of stored.sets) {
      expectSameFit(set.x, set.y, set);
      expectSameFit(set.x, set.y, { slope: set.linregress_slope, intercept: set.linregress_intercept });
    }
  });

  it.skipIf(!hasNumpy)('matches numpy.polyfit and scipy linregress run live through /usr/bin/python3 on random sets', () => {
    const rng = new Xoshiro128(77);
    const sets = [20, 300, 3].map((n, k) => {
      const x = Array.from({ length: n }, () => 1000 * k + rng.next() * 600);
      const slope = 1 + (rng.next() - 0.5) * 2e-4;
      const y = x.map((v) => 40 * rng.next() + slope * v + rng.nextExponential(1e3));
      return { x, y };
    });
    const live = JSON.parse(execFileSync('/usr/bin/python3', [script, '--stdin'], { input: JSON.stringify({ sets }), encoding: 'utf8' })) as {
      sets: ReferenceFit[];
    };
    sets.forEach(({ x, y }, i) => {
      expectSameFit(x, y, live.sets[i]!);
      expectSameFit(x, y, { slope: live.sets[i]!.linregress_slope, intercept: live.sets[i]!.linregress_intercept });
    });
  });

  it.skipIf(!hasNumpy)('the stored fixture is what line_fit_reference.py prints today', () => {
    const stored = readFileSync(join(fixtureDir, 'line_fit_reference.json'), 'utf8');
    const fresh = execFileSync('/usr/bin/python3', [script], { encoding: 'utf8' });
    const [a, b] = [fresh, stored].map((text) => (JSON.parse(text) as { sets: ReferenceSet[] }).sets);
    // numpy's seeded generator streams are stable across versions; the fits may differ in the last bits between BLAS builds.
    a!.forEach((set, i) => {
      expect(set.x).toEqual(b![i]!.x);
      expect(set.y).toEqual(b![i]!.y);
      expect(Math.abs(set.slope - b![i]!.slope)).toBeLessThanOrEqual(1e-12 * Math.abs(set.slope));
      expect(Math.abs(set.intercept - b![i]!.intercept)).toBeLessThanOrEqual(1e-12 * Math.max(...set.y.map(Math.abs)));
    });
  });
});

describe('leastSquaresLine input policy', () => {
  it('uses only the points the mask includes (common practice, no source)', () => {
    const fit = leastSquaresLine([0, 1, 2, 3], [1, 3, 100, 7], Uint8Array.of(1, 1, 0, 1));
    expect(fit.slope).toBeCloseTo(2, 14);
    expect(fit.intercept).toBeCloseTo(1, 14);
    expect(fit.n).toBe(3);
    expect(fit.residualSd).toBeCloseTo(0, 14);
  });

  it('reports NaN scatter for two points and the residual standard deviation with n - 2 degrees of freedom otherwise', () => {
    expect(leastSquaresLine([0, 1], [0, 1]).residualSd).toBeNaN();
    // Residuals of y = [0, 1, 0] on x = [0, 1, 2] about the flat line y = 1/3: [-1/3, 2/3, -1/3], SSE = 2/3, one degree of freedom.
    expect(leastSquaresLine([0, 1, 2], [0, 1, 0]).residualSd).toBeCloseTo(Math.sqrt(2 / 3), 14);
  });

  it('throws RangeError naming the problem for mismatched, short, constant-x or non-finite input', () => {
    expect(() => leastSquaresLine([0, 1], [0])).toThrow(/x and y must have the same length/);
    expect(() => leastSquaresLine([0, 1], [0, 1], [1])).toThrow(/include must have the length of x/);
    expect(() => leastSquaresLine([0], [0])).toThrow(/at least two points/);
    expect(() => leastSquaresLine([2, 2, 2], [0, 1, 2])).toThrow(/two distinct values/);
    expect(() => leastSquaresLine([0, 1, NaN], [0, 1, 2])).toThrow(RangeError);
  });
});
