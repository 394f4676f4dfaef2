import { describe, expect, it } from 'vitest';
import {
  angleBetween,
  degToScreenPx,
  pixelsPerDegreeAtCentre,
  screenPoint,
  screenPxToDeg,
  visualAngleOfSize,
  type DisplayGeometry,
} from '../../../../app/core/geometry';

// Check values of ../shared/REFERENCES.md section 1, computed with numpy by
// reference-scripts/t1_angle.py; formulas from Holmqvist et al. (2011), "Eye Tracking:
// A Comprehensive Guide to Methods and Measures", OUP. Tolerance 1e-12 as REFERENCES asks.
const screen: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };

describe('visual angle on a flat screen', () => {
  it('gives the angle a size subtends: θ = 2·atan(S/2D)', () => {
    expect(visualAngleOfSize(10, 570)).toBeCloseTo(1.0051633334420622, 12);
    expect(visualAngleOfSize(50, 600)).toBeCloseTo(4.771888060777625, 12);
    // size of 1° at 60 cm, by inverting the same formula
    expect(2 * 600 * Math.tan(Math.PI / 360)).toBeCloseTo(10.472241348910547, 11);
  });

  it('gives pixels per degree at the centre: (px/cm)·2D·tan(0.5°)', () => {
    expect(pixelsPerDegreeAtCentre(screen)).toBeCloseTo(37.93717620737406, 12);
    expect(screen.widthPx / (screen.widthMm / 10)).toBeCloseTo(36.22641509433962, 12);
    // The small-angle and screen-average figures differ: which is why Gazeloom never uses a constant ppd.
    expect(36.22641509433962 * 60 * (Math.PI / 180)).toBeCloseTo(37.936213175423916, 12);
    expect(screen.widthPx / visualAngleOfSize(530, 600)).toBeCloseTo(40.286285291135876, 12);
  });

  it('measures eccentricity from the eye: 500 px right of centre is 12.9547°', () => {
    const p = screenPoint(960 + 500, 540);
    expect(screenPxToDeg(screen, p).x).toBeCloseTo(12.954653982174476, 12);
    expect(angleBetween(screen, screenPoint(960, 540), p)).toBeCloseTo(12.954653982174476, 12);
  });

  it('measures an off-centre pair by the angle between the rays, not the centred formula', () => {
    // (10, 0) cm to (15, 0) cm at 60 cm: 4.573921259900861°; the centred formula would give 4.7719°.
    const pxPerMm = screen.widthPx / screen.widthMm;
    const a = screenPoint(960 + 100 * pxPerMm, 540);
    const b = screenPoint(960 + 150 * pxPerMm, 540);
    expect(angleBetween(screen, a, b)).toBeCloseTo(4.573921259900861, 12);
    expect(Math.abs(angleBetween(screen, a, b) - 4.771888060777625)).toBeGreaterThan(0.19);
  });

  it('round-trips degrees and pixels, and the angle is symmetric and zero on itself (common practice, no source)', () => {
    for (const [x, y] of [[-10, 5], [0, 0], [12.5, -7.25]] as const) {
      const p = degToScreenPx(screen, x, y);
      const back = screenPxToDeg(screen, p);
      expect(back.x).toBeCloseTo(x, 12);
      expect(back.y).toBeCloseTo(y, 12);
    }
    const p = screenPoint(100, 200);
    const q = screenPoint(1500, 900);
    expect(angleBetween(screen, p, q)).toBeCloseTo(angleBetween(screen, q, p), 12);
    expect(angleBetween(screen, p, p)).toBe(0);
  });
});
