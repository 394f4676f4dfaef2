import { describe, expect, it } from 'vitest';
import { DEFAULT_BACKGROUND_RGB, DEFAULT_OFF_RGB, DEFAULT_ON_RGB } from '../../../../app/core/render';
import { regionColour, relativeLuminance, srgbToLinear } from '../../../../app/core/safety';

// W3C (2023), "Web Content Accessibility Guidelines (WCAG) 2.2", definition "relative luminance":
// c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ^ 2.4, L = 0.2126 R + 0.7152 G + 0.0722 B.
describe('relative luminance (WCAG 2.2)', () => {
  it('gives 0 for black, 1 for white and the linear segment below 0.04045', () => {
    expect(relativeLuminance(0, 0, 0)).toBe(0);
    expect(relativeLuminance(255, 255, 255)).toBeCloseTo(1, 12);
    // 10/255 = 0.039216 <= 0.04045: 0.039216 / 12.92 = 0.0030353 (by hand)
    expect(srgbToLinear(10)).toBeCloseTo(0.0030353, 6);
  });

  it('matches hand-computed values for the palette and the thresholds', () => {
    // ON (255, 184, 28): G (0.72157 + 0.055) / 1.055 = 0.73609, ^2.4 = 0.47934; B 0.15621^2.4 = 0.011611;
    // L = 0.2126 + 0.7152 * 0.47934 + 0.0722 * 0.011611 = 0.55626 (by hand)
    expect(relativeLuminance(...DEFAULT_ON_RGB)).toBeCloseTo(0.55626, 4);
    // grey 128: (0.50196 + 0.055) / 1.055 = 0.52792, ^2.4 = 0.21586 (by hand)
    expect(relativeLuminance(...DEFAULT_BACKGROUND_RGB)).toBeCloseTo(0.21586, 4);
    expect(relativeLuminance(...DEFAULT_OFF_RGB)).toBeCloseTo(0.123, 3);
    // The darker-state limit 0.80 falls between grey 231 (0.79907) and grey 232 (0.80695), by hand.
    expect(relativeLuminance(231, 231, 231)).toBeCloseTo(0.79907, 4);
    expect(relativeLuminance(232, 232, 232)).toBeCloseTo(0.80695, 4);
  });

  it('places the sRGB red primary and D65 grey in CIE 1976 UCS', () => {
    // sRGB red: x 0.64, y 0.33 -> u' = 4x / (-2x + 12y + 3) = 0.4507, v' = 9y / (...) = 0.5229 (CIE 15:2004 conversion, by hand)
    const red = regionColour(1, 0, 0);
    expect(red.redRatio).toBe(1);
    expect(red.u).toBeCloseTo(0.4507, 3);
    expect(red.v).toBeCloseTo(0.5229, 3);
    // D65 white: x 0.3127, y 0.3290 -> u' 0.1978, v' 0.4683
    const grey = regionColour(0.2, 0.2, 0.2);
    expect(grey.u).toBeCloseTo(0.1978, 3);
    expect(grey.v).toBeCloseTo(0.4683, 3);
    expect(Math.hypot(red.u - grey.u, red.v - grey.v)).toBeGreaterThan(0.2);
  });
});
