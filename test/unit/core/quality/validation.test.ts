import { describe, expect, it } from 'vitest';
import { degToScreenPx, screenPxToDeg, screenPoint, type DisplayGeometry } from '../../../../app/core/geometry';
import { layoutFractions, summarizeValidation, targetOrder, unitLayout, validationLayout, validationLayoutDeg } from '../../../../app/core/quality';
import type { TargetResult } from '../../../../app/core/study/records';

const G: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
const point = (accuracyDeg: number | null, over: Partial<TargetResult> = {}): TargetResult => ({
  x: 960,
  y: 540,
  accuracyDeg,
  precisionRmsS2SDeg: accuracyDeg === null ? null : 0.02,
  precisionSdDeg: accuracyDeg === null ? null : 0.04,
  dataLossPct: 10,
  samples: 450,
  dxDeg: accuracyDeg,
  dyDeg: accuracyDeg === null ? null : 0,
  ...over,
});
const thresholds = { validationMeanDeg: 1.0, validationMaxDeg: 1.5 };

describe('summarizeValidation against the protocol thresholds', () => {
  it('accepts when the mean is within validationMeanDeg and every point within validationMaxDeg', () => {
    const s = summarizeValidation([point(0.5), point(1.5), point(0.7)], thresholds);
    expect(s).toMatchObject({ accepted: true, reasons: [], maxAccuracyDeg: 1.5, meanPrecisionRmsS2SDeg: 0.02, meanPrecisionSdDeg: 0.04, dataLossPct: 10 });
    expect(s.meanAccuracyDeg).toBeCloseTo(0.9, 14);
  });

  it('rejects a point over the maximum and a mean over the limit, naming the point', () => {
    const s = summarizeValidation([point(0.4), point(1.6, { x: 192, y: 108 })], thresholds);
    expect(s.accepted).toBe(false);
    expect(s.reasons).toEqual(['point 2 at (192, 108): accuracy 1.60° exceeds 1.50°']);
    expect(summarizeValidation([point(1.2), point(1.1)], thresholds).reasons).toEqual(['mean accuracy 1.15° exceeds 1.00°']);
  });

  it('rejects a point without valid gaze, and an empty validation', () => {
    const s = summarizeValidation([point(0.3), point(null, { dataLossPct: 100, samples: 0 })], thresholds);
    expect(s).toMatchObject({ accepted: false, meanAccuracyDeg: 0.3, maxAccuracyDeg: 0.3, dataLossPct: 55 });
    expect(s.reasons).toEqual(['point 2 at (960, 540): no valid gaze samples']);
    expect(summarizeValidation([], thresholds)).toMatchObject({ accepted: false, meanAccuracyDeg: null, dataLossPct: null, reasons: ['no points were measured'] });
    expect(() => summarizeValidation([], { validationMeanDeg: 1, validationMaxDeg: Number.NaN })).toThrow(/thresholds.validationMaxDeg/);
  });
});

describe('validation layouts of 5, 9 and 13 points', () => {
  it('has the documented unit positions, all distinct', () => {
    expect(unitLayout(5)).toEqual([{ u: 0, v: 0 }, { u: -1, v: -1 }, { u: 1, v: -1 }, { u: -1, v: 1 }, { u: 1, v: 1 }]);
    for (const n of [5, 9, 13] as const) {
      const keys = new Set(unitLayout(n).map((p) => `${p.u},${p.v}`));
      expect(keys.size).toBe(n);
    }
    expect(unitLayout(13).slice(9)).toEqual([{ u: -0.5, v: -0.5 }, { u: 0.5, v: -0.5 }, { u: -0.5, v: 0.5 }, { u: 0.5, v: 0.5 }]);
    expect(() => unitLayout(7 as never)).toThrow(/5, 9 or 13/);
  });

  it('places the outer points marginFrac in from the edges of the screen or the stimulus area', () => {
    expect(layoutFractions(9, 0.1).map((p) => [p.x, p.y].map((v) => +v.toFixed(12)))).toEqual([0.1, 0.5, 0.9].flatMap((y) => [0.1, 0.5, 0.9].map((x) => [x, y])));
    const screen = validationLayout(5, { widthPx: 1920, heightPx: 1080 });
    expect(screen[0]).toEqual({ x: 960, y: 540 });
    expect(screen[1]!.x).toBeCloseTo(192, 9);
    expect(screen[4]!.y).toBeCloseTo(972, 9);
    // A 640 x 480 sensor fitted at scale 2.25: 1440 x 1080 from x = 240.
    const stimulus = validationLayout(13, { widthPx: 1440, heightPx: 1080, left: 240, top: 0 }, 0.05);
    expect(stimulus[0]!.x).toBeCloseTo(240 + 0.05 * 1440, 9);
    expect(stimulus[0]!.y).toBeCloseTo(0.05 * 1080, 9);
    expect(stimulus[12]!.x).toBeCloseTo(240 + 0.725 * 1440, 9);
    expect(() => layoutFractions(5, 0.5)).toThrow(/marginFrac/);
  });

  it('places points given in degrees from the centre at those angles', () => {
    const pts = validationLayoutDeg(9, G, { x: 12, y: 8 });
    expect(pts[4]).toEqual(degToScreenPx(G, 0, 0));
    const corner = screenPxToDeg(G, screenPoint(pts[8]!.x, pts[8]!.y));
    expect(corner.x).toBeCloseTo(12, 12);
    expect(corner.y).toBeCloseTo(8, 12);
    expect(() => validationLayoutDeg(5, G, { x: 70, y: 0 })).toThrow(/extentDeg.x/);
  });
});

describe('targetOrder', () => {
  it('is a permutation that the seed reproduces', () => {
    const order = targetOrder(13, 42);
    expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: 13 }, (_, i) => i));
    expect(targetOrder(13, 42)).toEqual(order);
    expect(targetOrder(13, 43)).not.toEqual(order);
    expect(targetOrder(0, 1)).toEqual([]);
    expect(() => targetOrder(2.5, 1)).toThrow(/count/);
  });

  it('puts every target first about equally often over many seeds (uniform shuffle)', () => {
    const firsts = new Array(5).fill(0);
    for (let seed = 0; seed < 5000; seed++) firsts[targetOrder(5, seed)[0]!]++;
    for (const n of firsts) expect(Math.abs(n - 1000)).toBeLessThan(120);
  });
});
