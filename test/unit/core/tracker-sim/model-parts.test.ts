import { describe, expect, it } from 'vitest';
import { angleBetween, degToScreenPx, screenPoint, screenPxToDeg } from '../../../../app/core/geometry';
import { DEFAULT_EYE_MOTION, minimumJerkFraction, offsetByAngle, resolveEyeMotion, saccadeDurationS } from '../../../../app/core/tracker-sim';
import { CENTRE, DISPLAY, fitLine, rmsS2S, stdAround } from './helpers';

describe('offsetByAngle', () => {
  it('turns the gaze 12.954653982174476° right of centre onto the point 500 px right of it (REFERENCES.md section 1, Holmqvist et al. 2011)', () => {
    const p = offsetByAngle(DISPLAY, CENTRE, 12.954653982174476, 0);
    expect(p.x).toBeCloseTo(1460, 9);
    expect(p.y).toBeCloseTo(540, 9);
  });

  it('moves the gaze by exactly hypot(right, down) degrees anywhere on the screen, in the local frame of the gaze (common practice, no source)', () => {
    for (const [x, y] of [[960, 540], [0, 0], [1900, 1000], [200, 900]] as const) {
      const p = screenPoint(x, y);
      for (const [r, d] of [[0.02, 0], [0, -0.5], [1.2, 0.7], [-3, 4]] as const) expect(angleBetween(DISPLAY, p, offsetByAngle(DISPLAY, p, r, d))).toBeCloseTo(Math.hypot(r, d), 10);
    }
    const far = screenPoint(1800, 540);
    // A rightward turn on the horizontal meridian stays on it; a downward one moves down.
    expect(offsetByAngle(DISPLAY, far, 1, 0).y).toBeCloseTo(540, 9);
    expect(offsetByAngle(DISPLAY, CENTRE, 0, 1).y).toBeGreaterThan(540);
    expect(offsetByAngle(DISPLAY, CENTRE, 0, 0)).toBe(CENTRE);
  });

  it('agrees with the per-axis angles at the centre', () => {
    const d = screenPxToDeg(DISPLAY, offsetByAngle(DISPLAY, CENTRE, 0, 3));
    expect(d.y).toBeCloseTo(3, 10);
    expect(degToScreenPx(DISPLAY, 0, 3).y).toBeCloseTo(offsetByAngle(DISPLAY, CENTRE, 0, 3).y, 9);
  });
});

describe('the saccade profile', () => {
  it('follows the minimum-jerk position 10τ³ − 15τ⁴ + 6τ⁵ (Flash & Hogan 1985), symmetric, with peak speed 1.875 × the mean', () => {
    expect(minimumJerkFraction(0)).toBe(0);
    expect(minimumJerkFraction(1)).toBe(1);
    expect(minimumJerkFraction(-0.1)).toBe(0);
    expect(minimumJerkFraction(1.2)).toBe(1);
    expect(minimumJerkFraction(0.5)).toBeCloseTo(0.5, 15);
    expect(minimumJerkFraction(0.25)).toBeCloseTo(10 / 64 - 15 / 256 + 6 / 1024, 15);
    for (const tau of [0.1, 0.3, 0.45]) expect(minimumJerkFraction(tau) + minimumJerkFraction(1 - tau)).toBeCloseTo(1, 14);
    const h = 1e-6;
    expect((minimumJerkFraction(0.5 + h) - minimumJerkFraction(0.5 - h)) / (2 * h)).toBeCloseTo(1.875, 8);
  });

  it('lasts D = 2.2·A + 21 ms (Carpenter 1988)', () => {
    expect(saccadeDurationS(10, DEFAULT_EYE_MOTION)).toBeCloseTo(0.043, 12);
    expect(saccadeDurationS(0, DEFAULT_EYE_MOTION)).toBeCloseTo(0.021, 12);
  });
});

describe('the eye-motion parameters', () => {
  it('refuse bad values, naming them', () => {
    expect(() => resolveEyeMotion({ saccadeGain: 0 })).toThrow(/eyeMotion\.saccadeGain must be a finite number > 0, got 0/);
    expect(() => resolveEyeMotion({ fixationalSdDeg: -1 })).toThrow(/eyeMotion\.fixationalSdDeg must be a finite number >= 0/);
    expect(() => resolveEyeMotion({ pursuitGain: Number.NaN })).toThrow(/eyeMotion\.pursuitGain/);
    expect(() => resolveEyeMotion({ dwellGammaShape: 1.5 })).toThrow(/eyeMotion\.dwellGammaShape must be a whole number/);
    expect(() => resolveEyeMotion({ blinkIntervalMaxS: 1 })).toThrow(/eyeMotion\.blinkIntervalMaxS must be >= blinkIntervalMinS/);
    expect(() => resolveEyeMotion({ blinkDurationMaxS: 2.5 })).toThrow(/never overlap/);
    expect(() => resolveEyeMotion({ dwellMaxS: 0.2 })).toThrow(/eyeMotion\.dwellMaxS must be > dwellMinS/);
    expect(() => resolveEyeMotion({ wobble: 1 } as never)).toThrow(/eyeMotion\.wobble is not a parameter/);
    expect(resolveEyeMotion({ pursuitGain: 0.8 }).pursuitGain).toBe(0.8);
  });
});

describe('the measures the tests use', () => {
  it('give the data-quality check values of REFERENCES.md section 3 (numpy; Holmqvist, Nyström & Mulvey 2012)', () => {
    const gx = [0.5, 0.62, 0.41, 0.55, 0.47, 0.58];
    const gy = [0.2, 0.31, 0.12, 0.26, 0.18, 0.22];
    const pts = gx.map((x, i) => ({ x, y: gy[i]! }));
    const dist = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);
    const mean = { x: gx.reduce((a, b) => a + b) / 6, y: gy.reduce((a, b) => a + b) / 6 };
    expect(rmsS2S(pts, dist)).toBeCloseTo(0.1856879102149626, 12);
    expect(stdAround(pts, mean, dist)).toBeCloseTo(0.09222556888171282, 12);
  });

  it('fit a line as numpy polyfit does on the clock check of REFERENCES.md section 7', () => {
    const x = [0, 1, 2, 3, 4, 5];
    const noise = [3, -2, 1, 0, -1, 2].map((v) => v * 1e-4);
    const fit = fitLine(x, x.map((v, i) => 12.5 + (1 + 20e-6) * v + noise[i]!));
    expect(fit.slope).toBeCloseTo(1.0000114285714286, 12);
    expect(fit.intercept).toBeCloseTo(12.500071428571427, 12);
  });
});
