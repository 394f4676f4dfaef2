import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { coneSolidAngle, FLASH_AREA_LIMIT_SR, flashCells, rectangleSolidAngle } from '../../../../app/core/safety';
import { TEST_DISPLAY, TEST_SENSOR } from './synthetic-flash-clip';

const fixtureDir = join(__dirname, '../../../fixtures/safety');
interface Row {
  readonly rect_mm: [number, number, number, number];
  readonly distance_mm: number;
  readonly solid_angle_sr: number;
}
/** Values of scipy.integrate.dblquad (Debian python3-scipy), made by make-solid-angle.py beside them. */
const fixture = (): Row[] => JSON.parse(readFileSync(join(fixtureDir, 'solid-angle-scipy.json'), 'utf8')).rows;
const hasScipy = existsSync('/usr/bin/python3') && (() => {
  try {
    execFileSync('/usr/bin/python3', ['-c', 'import scipy'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
})();

describe('solid angle of a screen rectangle', () => {
  it('agrees with numerical integration by scipy (kept as a fixture), centred and off-centre', () => {
    const rows = fixture();
    expect(rows).toHaveLength(3);
    for (const { rect_mm: [x0, y0, x1, y1], distance_mm, solid_angle_sr } of rows) {
      expect(rectangleSolidAngle(x0, y0, x1, y1, distance_mm)).toBeCloseTo(solid_angle_sr, 9);
    }
  });

  it.runIf(hasScipy)('the fixture is what scipy gives on this machine', () => {
    const [x0, y0, x1, y1] = fixture()[2]!.rect_mm;
    const script = `from scipy.integrate import dblquad\nprint(repr(dblquad(lambda y, x: 600 / (x*x + y*y + 360000) ** 1.5, ${x0}, ${x1}, ${y0}, ${y1}, epsabs=1e-13, epsrel=1e-11)[0]))`;
    const fresh = Number(execFileSync('/usr/bin/python3', ['-c', script], { encoding: 'utf8' }));
    expect(fresh).toBeCloseTo(fixture()[2]!.solid_angle_sr, 11);
  });

  it('puts WCAG 2.2 quarter of a 10-degree field at 0.006 sr', () => {
    // 2 pi (1 - cos 5 deg) = 2 pi * 0.0038053 = 0.023909 sr; a quarter is 0.0059773 ~ 0.006 (W3C 2023, WCAG 2.2, "general flash and red flash thresholds")
    expect(coneSolidAngle(10)).toBeCloseTo(0.023909, 5);
    expect(coneSolidAngle(10) / 4).toBeCloseTo(FLASH_AREA_LIMIT_SR, 4);
    // Centred square of side s at d = 600 mm: 4 asin(s^2 / (s^2 + 4 d^2)) = 0.006 gives s = 46.51 mm (by hand)
    expect(rectangleSolidAngle(-46.51 / 2, -46.51 / 2, 46.51 / 2, 46.51 / 2, 600)).toBeCloseTo(0.006, 5);
  });

  it('cells tile the fitted image, and their solid angles add up to the image', () => {
    const cells = flashCells(TEST_SENSOR, TEST_DISPLAY, 'fit');
    // 37.9 px per degree at the centre over a fit scale of 12 -> cells of 3 sensor pixels: 54 x 30 of them.
    expect([cells.sidePx, cells.cols, cells.rows]).toEqual([3, 54, 30]);
    expect(cells.pixelsInCell.reduce((a, b) => a + b, 0)).toBe(160 * 90);
    const total = cells.solidAngleSr.reduce((a, b) => a + b, 0);
    expect(total).toBeCloseTo(rectangleSolidAngle(-265, -149, 265, 149, 600), 9);
  });
});
