import { describe, expect, it } from 'vitest';
import { batchFrom } from '../../../../app/core/events/event-batch';
import { EventImageRenderer } from '../../../../app/core/render/event-image-renderer';
import { GREY_GAIN_PER_EVENT, GREY_MID_LEVEL } from '../../../../app/core/render/render-defaults';
import { imageFor, pixels, renderOnce } from './images';

// Hand-computed images (common practice, no source): level = clamp(128 + 16 * (nOn - nOff), 0, 255).
const grey = (level: number): number[] => [level, level, level, 255];
const sensor = { width: 4, height: 3 };
const repeat = (n: number, t: number, x: number, y: number, p: number) => Array.from({ length: n }, () => [t, x, y, p] as const);

describe('grey accumulation look', () => {
  it('uses mid-grey 128 and 16 levels per event', () => {
    expect([GREY_MID_LEVEL, GREY_GAIN_PER_EVENT]).toEqual([128, 16]);
  });

  it('sums ON minus OFF over the window from mid-grey and clamps to 0..255', () => {
    const events = batchFrom([
      ...repeat(3, 1000, 0, 0, 1), // +3 -> 176
      ...repeat(2, 1000, 1, 0, 0), // -2 -> 96
      [1000, 2, 0, 1],
      [1000, 2, 0, 0], // +1 -1 -> 128
      ...repeat(10, 2000, 3, 0, 1), // +10 -> 288, clamped to 255
      ...repeat(9, 2000, 0, 1, 0), // -9 -> -16, clamped to 0
      ...repeat(8, 3000, 1, 1, 1), // +8 -> 256, clamped to 255
      ...repeat(8, 3000, 2, 1, 0), // -8 -> 0
      ...repeat(7, 3000, 3, 1, 1), // +7 -> 240
      [40_000, 0, 2, 1], // after the rendered time
    ]);
    const rgba = renderOnce(sensor, { look: 'grey' }, events, 20_000);
    expect(pixels(rgba)).toEqual([
      grey(176), grey(96), grey(128), grey(255),
      grey(0), grey(255), grey(0), grey(240),
      grey(128), grey(128), grey(128), grey(128),
    ]);
  });

  it('drops events as they leave the window, one exactly 33 ms old no longer counting', () => {
    const renderer = new EventImageRenderer(sensor, { look: 'grey' });
    expect(renderer.historyUs).toBe(33_000);
    renderer.push(batchFrom([
      [0, 0, 0, 1],
      [10_000, 0, 0, 1],
      [20_000, 0, 0, 0],
      [20_000, 1, 0, 0],
    ]));
    const rgba = imageFor(sensor);
    const levelAt = (tUs: number): number[] => {
      renderer.render(tUs, rgba);
      return [rgba[0]!, rgba[4]!];
    };
    expect(levelAt(20_000)).toEqual([128 + 16, 128 - 16]); // +1 +1 -1, -1
    expect(levelAt(32_999)).toEqual([144, 112]);
    expect(levelAt(33_000)).toEqual([128, 112]); // the event at 0 has left
    expect(levelAt(43_000)).toEqual([112, 112]); // and the one at 10 ms
    expect(levelAt(53_000)).toEqual([128, 128]); // now empty
    expect(levelAt(53_000)).toEqual([128, 128]); // drawing the same time again changes nothing
  });

  it('keeps clamping counts far beyond the levels (a hot pixel)', () => {
    const events = batchFrom([...repeat(256, 1000, 0, 0, 1), ...repeat(260, 1000, 1, 0, 0), ...repeat(100_000, 2000, 2, 0, 1)]);
    expect(pixels(renderOnce(sensor, { look: 'grey' }, events, 3000)).slice(0, 4)).toEqual([grey(255), grey(0), grey(255), grey(128)]);
  });

  it('takes windowUs when given', () => {
    const events = batchFrom([[0, 0, 0, 1]]);
    expect(pixels(renderOnce(sensor, { look: 'grey', windowUs: 5000 }, events, 4999))[0]).toEqual(grey(144));
    expect(pixels(renderOnce(sensor, { look: 'grey', windowUs: 5000 }, events, 5000))[0]).toEqual(grey(128));
  });
});
