import { describe, expect, it } from 'vitest';
import { FlashFrameAnalyser, flashCells } from '../../../../app/core/safety';
import { TEST_DISPLAY, TEST_SENSOR } from './synthetic-flash-clip';

type Rgb = readonly [number, number, number];

/** Whole-screen frames alternating between two colours, `flashesPerS` cycles a second for 2 s at 60 Hz. */
function alternate(a: Rgb, b: Rgb, flashesPerS: number) {
  const cells = flashCells(TEST_SENSOR, TEST_DISPLAY, 'fit');
  const analyser = new FlashFrameAnalyser(cells, { rateHz: 60, speed: 1 });
  const frame = new Uint8ClampedArray(TEST_SENSOR.width * TEST_SENSOR.height * 4);
  const fill = (colour: Rgb) => {
    frame.set([...colour, 255]);
    new Uint32Array(frame.buffer).fill(new Uint32Array(frame.buffer, 0, 1)[0]!);
  };
  for (let k = 0; k < 120; k++) {
    fill(Math.floor((2 * flashesPerS * k) / 60) % 2 === 0 ? a : b);
    analyser.addFrame(frame);
  }
  return analyser.finish();
}

// Limits from W3C (2023), WCAG 2.2, "general flash and red flash thresholds"; luminances by hand in relative-luminance.test.ts.
describe('the flash definitions, frame by frame', () => {
  it('a darker state at or above 0.80 is no flash: white against grey 232 (L 0.807) passes, against grey 231 (L 0.799) fails', () => {
    expect(alternate([255, 255, 255], [232, 232, 232], 10)).toEqual([]);
    const failures = alternate([255, 255, 255], [231, 231, 231], 10);
    expect(failures.map((f) => [f.kind, f.flashes_per_s])).toEqual([['general', 10]]);
  });

  it('a change under 0.1 is no flash: grey 128 (L 0.2159) against 145 (0.2832) passes, against 155 (0.3278) fails', () => {
    expect(alternate([128, 128, 128], [145, 145, 145], 10)).toEqual([]);
    expect(alternate([128, 128, 128], [155, 155, 155], 10).map((f) => f.kind)).toEqual(['general']);
  });

  it('saturated red against grey of the same luminance is a red flash only', () => {
    // Red (255, 0, 0): L 0.2126, R/(R+G+B) = 1 >= 0.8; grey 128: L 0.2159 (a change of 0.003, no general flash);
    // their (u', v') differ by 0.259 > 0.2 (relative-luminance.test.ts).
    const failures = alternate([255, 0, 0], [128, 128, 128], 4);
    expect(failures.map((f) => [f.kind, f.flashes_per_s])).toEqual([['red', 4]]);
    expect(failures[0]!.region).toMatchObject({ x_px: 0, y_px: 0, width_px: 1920, height_px: 1080 });
    expect(alternate([255, 0, 0], [128, 128, 128], 2)).toEqual([]);
  });

  it('amber against grey is not red: the palette ratio 0.55 stays under 0.8', () => {
    expect(alternate([255, 184, 28], [128, 128, 128], 4).map((f) => f.kind)).toEqual(['general']);
  });
});
