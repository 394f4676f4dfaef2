import { describe, expect, it } from 'vitest';
import { rectangleSolidAngle, screenClipFlashes, type FlashSettings } from '../../../../app/core/safety';
import { squareFlashClip, TEST_DISPLAY, TEST_SENSOR } from './synthetic-flash-clip';

const settings: FlashSettings = { look: 'polarity', speed: 1, placement: 'fit', display: TEST_DISPLAY, rateHz: 60 };

/*
 * Thresholds by hand from W3C (2023), "Web Content Accessibility Guidelines (WCAG) 2.2",
 * SC 2.3.1 and "general flash and red flash thresholds" (which follow ITU-R BT.1702):
 * - a flash is a pair of opposing changes of >= 0.1 in relative luminance with the darker
 *   state < 0.80. Here the square alternates between the grey background (L 0.2159) and the
 *   amber ON colour (L 0.5563): change 0.340 >= 0.1, darker 0.216 < 0.8, so each bright
 *   phase and the dark phase after it make one flash;
 * - more than 3 flashes in any second fails, when the flashing area in a 10-degree field
 *   exceeds 0.006 sr. At 600 mm, 0.006 sr is a centred square of 46.5 mm (see
 *   solid-angle.test.ts), 168 screen px, 14.0 sensor px at the fit scale of 12.
 *   The small square: 6 sensor px = 72 px = 19.9 mm, 0.0011 sr. The large one: 24 sensor px
 *   = 288 px = 79.5 mm, 0.0175 sr, most of the 10-degree field (105 mm across).
 * - at 60 Hz, 2 flashes/s give 2 per second, 4 give 4, 10 give 10 (a half period of 15,
 *   7.5 and 3 frames); none flashes exactly 3 times.
 */
const mmPerSensorPx = (12 * 530) / 1920;
const squareSr = (side: number) => rectangleSolidAngle((-side / 2) * mmPerSensorPx, (-side / 2) * mmPerSensorPx, (side / 2) * mmPerSensorPx, (side / 2) * mmPerSensorPx, 600);

describe('flash screening of event clips', () => {
  it('the test squares sit on either side of 0.006 sr', () => {
    expect(squareSr(6)).toBeCloseTo(0.0011, 4);
    expect(squareSr(24)).toBeCloseTo(0.0175, 3);
    expect(squareSr(14)).toBeCloseTo(0.006, 3);
  });

  it('passes 2 flashes a second over a large area', () => {
    const result = screenClipFlashes(squareFlashClip({ flashesPerS: 2, side: 24, durationS: 3 }), TEST_SENSOR, settings);
    expect(result).toMatchObject({ pass: true, failures: [] });
    expect(result.analysedWith).toMatchObject({ frames: 181, look: 'polarity', rateHz: 60 });
  });

  for (const flashesPerS of [4, 10]) {
    it(`fails ${flashesPerS} flashes a second over a large area, naming the time and region`, () => {
      const { pass, failures } = screenClipFlashes(squareFlashClip({ flashesPerS, side: 24, durationS: 3 }), TEST_SENSOR, settings);
      expect(pass).toBe(false);
      expect(failures).toHaveLength(1);
      const [failure] = failures;
      expect(failure).toMatchObject({ kind: 'general', flashes_per_s: flashesPerS });
      // The first bright frame is frame 1; the last flash ends within the last half period.
      expect(failure!.start_s).toBeCloseTo(1 / 60, 4);
      expect(failure!.end_s).toBeGreaterThan(3 - 1 / flashesPerS);
      // The square covers screen px 816..1104 x 396..684; the region is the cells it touches (36 px each).
      const r = failure!.region;
      expect(r.x_px).toBeLessThanOrEqual(816);
      expect(r.x_px).toBeGreaterThan(816 - 36);
      expect(r.x_px + r.width_px).toBeGreaterThanOrEqual(1104);
      expect(r.x_px + r.width_px).toBeLessThan(1104 + 36);
      expect(r.y_px).toBe(396);
      expect(r.height_px).toBe(288);
      expect(r.left_deg).toBeLessThan(0);
      expect(r.right_deg).toBeGreaterThan(0);
      expect(r.solid_angle_sr).toBeGreaterThanOrEqual(squareSr(24) * 0.999);
    });

    it(`passes ${flashesPerS} flashes a second over a small area`, () => {
      expect(screenClipFlashes(squareFlashClip({ flashesPerS, side: 6, durationS: 3 }), TEST_SENSOR, settings).pass).toBe(true);
    });
  }

  it('counts flashes in viewing time: 4 per clip second at half speed is 2 a second', () => {
    const slow = screenClipFlashes(squareFlashClip({ flashesPerS: 4, side: 24, durationS: 3 }), TEST_SENSOR, { ...settings, speed: 0.5 });
    // At half speed each 60 Hz frame advances 1/120 s of clip and the stage's polarity window
    // stays 1/60 s of clip, so each event shows on two frames: the phases simply last twice as long.
    expect(slow.pass).toBe(true);
    expect(slow.analysedWith.frames).toBe(361);
  });

  it('a smaller placement shrinks a large flash below the area limit', () => {
    // Integer placement of 160 x 90 on 1920 x 1080 is also 12x; 1:1 makes the square 24 px (6.6 mm, 0.00012 sr).
    const result = screenClipFlashes(squareFlashClip({ flashesPerS: 10, side: 24, durationS: 2 }), TEST_SENSOR, { ...settings, placement: '1:1' });
    expect(result.pass).toBe(true);
  });
});
