import { describe, expect, it } from 'vitest';
import { angleBetween } from '../../../../../app/core/geometry/display-geometry';
import { screenPoint } from '../../../../../app/core/geometry/units';
import { applyRawCalibration, fitRawCalibration } from '../../../../../app/core/quality/correction';
import { storedReference } from './reference';

const display = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 };

describe('fitRawCalibration: raw tracker coordinates to screen px', () => {
  const set = storedReference().maps[2]!;
  const points = set.from.map(([x, y], i) => ({ raw: { x, y }, target: { x: set.to[i]![0], y: set.to[i]![1] } }));

  it('fits the second-order polynomial as numpy.linalg.lstsq does on the same points', () => {
    const fit = fitRawCalibration(points, display);
    expect(fit.params.model).toBe('polynomial2');
    fit.params.ax.forEach((v, k) => expect(v).toBeCloseTo(set.ax[k]!, 6));
    fit.params.ay.forEach((v, k) => expect(v).toBeCloseTo(set.ay[k]!, 6));
    fit.residuals.forEach((r, i) => expect(r.px).toBeCloseTo(set.residuals_px[i]!, 6));
  });

  it('reports each point’s residual in degrees as the angle seen from the eye, and their RMS', () => {
    const fit = fitRawCalibration(points, display);
    points.forEach((p, i) => {
      const s = applyRawCalibration(fit.params, p.raw.x, p.raw.y);
      expect(fit.residuals[i]!.deg).toBeCloseTo(angleBetween(display, screenPoint(s.x, s.y), screenPoint(p.target.x, p.target.y)), 12);
    });
    expect(fit.rmsDeg).toBeCloseTo(Math.sqrt(fit.residuals.reduce((s, r) => s + r.deg ** 2, 0) / 9), 12);
    // A few px on a 1920 px wide, 531 mm screen at 650 mm: well under a quarter of a degree.
    expect(fit.rmsDeg).toBeGreaterThan(0);
    expect(fit.rmsDeg).toBeLessThan(0.25);
  });

  it('needs six points with valid gaze, and finite values', () => {
    expect(() => fitRawCalibration(points.slice(0, 5), display)).toThrow(/at least 6 calibration points with valid gaze/);
    expect(() => fitRawCalibration([{ raw: { x: Number.NaN, y: 0 }, target: { x: 0, y: 0 } }], display)).toThrow(/points\[0\]\.raw\.x must be finite/);
    expect(() => fitRawCalibration(points, { ...display, distanceMm: 0 })).toThrow(/distanceMm/);
  });
});
