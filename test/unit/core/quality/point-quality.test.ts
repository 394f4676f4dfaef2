import { describe, expect, it } from 'vitest';
import { angleBetween, pixelsPerDegreeAtCentre, screenPoint, screenPxToDeg, type DisplayGeometry } from '../../../../app/core/geometry';
import { pointQuality, pointWithoutAngles, samplesInWindow, type TimedSample } from '../../../../app/core/quality';

// REFERENCES.md section 1 (standard geometry; Holmqvist et al. 2011, "Eye Tracking: A
// Comprehensive Guide to Methods and Measures", OUP): a 53 cm, 1920 px wide screen at 60 cm.
const G: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
const pxPerMm = 1920 / 530;
const cmRight = (cm: number) => 960 + cm * 10 * pxPerMm;
const atanDeg = (mm: number) => (Math.atan(mm / 600) * 180) / Math.PI;

const at = (x: number, y: number, k: number, valid = true): TimedSample => ({ hostNs: k * 2e6, x, y, valid });

describe('the pixel-to-degree step (REFERENCES.md section 1 check values)', () => {
  it('gives 37.93717620737406 px/deg at the centre and 12.954653982174476° for 500 px right of centre', () => {
    expect(Math.abs(pixelsPerDegreeAtCentre(G) - 37.93717620737406)).toBeLessThan(1e-12);
    expect(Math.abs(screenPxToDeg(G, screenPoint(1460, 540)).x - 12.954653982174476)).toBeLessThan(1e-12);
  });

  it('gives 4.573921259900861° between (10, 0) cm and (15, 0) cm, not the centred 4.7719°', () => {
    expect(Math.abs(angleBetween(G, screenPoint(cmRight(10), 540), screenPoint(cmRight(15), 540)) - 4.573921259900861)).toBeLessThan(1e-12);
  });
});

describe('pointQuality: screen samples measured as angles seen from the eye', () => {
  it('measures accuracy as the angle from the target to the mean gaze, with per-axis offsets', () => {
    const samples = Array.from({ length: 10 }, (_, k) => at(cmRight(15), 540, k));
    const r = pointQuality({ x: cmRight(10), y: 540 }, samples, 10, G);
    expect(Math.abs(r.accuracyDeg! - 4.573921259900861)).toBeLessThan(1e-12);
    expect(Math.abs(r.dxDeg! - 4.573921259900861)).toBeLessThan(1e-12);
    expect(r.dyDeg).toBe(0);
    expect(r).toMatchObject({ precisionRmsS2SDeg: 0, precisionSdDeg: 0, dataLossPct: 0, samples: 10, x: cmRight(10), y: 540 });
  });

  it('takes down as positive dy and right as positive dx', () => {
    const r = pointQuality({ x: 960, y: 540 }, [at(950, 560, 0), at(950, 560, 1)], 2, G);
    expect(r.dxDeg!).toBeLessThan(0);
    expect(r.dyDeg!).toBeGreaterThan(0);
    expect(Math.abs(r.dxDeg! + atanDeg(10 / pxPerMm))).toBeLessThan(1e-12);
    expect(Math.abs(r.dyDeg! - atanDeg(20 / pxPerMm))).toBeLessThan(1e-12);
  });

  it('measures RMS-S2S between valid neighbours and SD around the mean position, in true angles', () => {
    // Alternating between 10 cm and 15 cm right of centre on the horizontal midline, where
    // the angle between two points is the difference of their atan angles.
    const xs = [10, 15, 10, 15, 10, 15].map(cmRight);
    const samples = [...xs.map((x, k) => at(x, 540, k)), at(Number.NaN, Number.NaN, 6, false), at(cmRight(10), 540, 7), at(cmRight(15), 540, 8), at(cmRight(10), 540, 9)];
    const r = pointQuality({ x: cmRight(12), y: 540 }, samples, 10, G);
    expect(Math.abs(r.precisionRmsS2SDeg! - 4.573921259900861)).toBeLessThan(1e-12); // no step across the invalid sample
    const meanMm = ((10 * 5 + 15 * 4) / 9) * 10;
    const from10 = atanDeg(meanMm) - atanDeg(100);
    const from15 = atanDeg(150) - atanDeg(meanMm);
    expect(Math.abs(r.precisionSdDeg! - Math.sqrt((5 * from10 ** 2 + 4 * from15 ** 2) / 9))).toBeLessThan(1e-12);
    expect(r.samples).toBe(9);
    expect(r.dataLossPct).toBeCloseTo(10, 12);
  });

  it('counts invalid and missing samples against the expected number, and has no angles without valid gaze', () => {
    const valid = [...'1101110011'].map((c, k) => at(c === '1' ? 960 : Number.NaN, 540, k, c === '1'));
    expect(pointQuality({ x: 960, y: 540 }, valid, 10, G).dataLossPct).toBe(30);
    expect(pointQuality({ x: 960, y: 540 }, valid, 20, G).dataLossPct).toBe(65);
    const none = pointQuality({ x: 100, y: 100 }, [at(1, 1, 0, false)], 500, G);
    expect(none).toEqual({ x: 100, y: 100, accuracyDeg: null, precisionRmsS2SDeg: null, precisionSdDeg: null, dataLossPct: 100, samples: 0, dxDeg: null, dyDeg: null });
    expect(pointQuality({ x: 960, y: 540 }, [at(961, 540, 0)], 500, G).precisionRmsS2SDeg).toBeNull();
    expect(pointWithoutAngles({ x: 5, y: 6 }, 400, 500)).toMatchObject({ accuracyDeg: null, samples: 400, dataLossPct: 20 });
  });

  it('treats a sample marked valid but without a finite position as invalid', () => {
    const r = pointQuality({ x: 960, y: 540 }, [at(960, 540, 0), at(Number.NaN, 540, 1, true)], 2, G);
    expect(r).toMatchObject({ samples: 1, dataLossPct: 50, accuracyDeg: 0 });
  });

  it('refuses a bad geometry or target, naming it', () => {
    expect(() => pointQuality({ x: 0, y: 0 }, [], 1, { ...G, distanceMm: 0 })).toThrow(/display.distanceMm/);
    expect(() => pointQuality({ x: Number.NaN, y: 0 }, [], 1, G)).toThrow(/target must be finite/);
    expect(() => pointQuality({ x: 0, y: 0 }, [], 0, G)).toThrow(/expected/);
  });
});

describe('samplesInWindow', () => {
  const samples = Array.from({ length: 2000 }, (_, k) => ({ hostNs: 5e9 + k * 1e6, x: 0, y: 0, valid: true }));

  it('keeps samples from 300 ms to 1300 ms after onset by default, both ends included (common practice, no source)', () => {
    const w = samplesInWindow(samples, 5e9);
    expect(w.length).toBe(1001);
    expect(w[0]!.hostNs).toBe(5.3e9);
    expect(w.at(-1)!.hostNs).toBe(6.3e9);
  });

  it('takes another window, and refuses one that does not run forwards', () => {
    expect(samplesInWindow(samples, 5e9, 0, 10).length).toBe(11);
    expect(() => samplesInWindow(samples, 5e9, 500, 400)).toThrow(/0 <= fromMs < toMs/);
    expect(() => samplesInWindow(samples, Number.NaN)).toThrow(/onsetNs/);
  });
});
