import { describe, expect, it } from 'vitest';
import { batchFrom } from '../../../../app/core/events/event-batch';
import { EventImageRenderer } from '../../../../app/core/render/event-image-renderer';
import { DEFAULT_FRAME_INTERVAL_US } from '../../../../app/core/render/render-defaults';
import { imageFor, pixels, renderOnce, type Rgba } from './images';

// Hand-computed images (common practice, no source): the colours are the defaults of
// render-defaults.ts, pinned here so that a change to them shows in review.
const BG: Rgba = [128, 128, 128, 255];
const ON: Rgba = [255, 184, 28, 255];
const OFF: Rgba = [16, 96, 192, 255];
const sensor = { width: 4, height: 3 };

describe('polarity look', () => {
  it('shows the colour of each pixel’s latest event within the frame, else the background', () => {
    const events = batchFrom([
      [1000, 0, 0, 1],
      [2000, 1, 0, 0],
      [3000, 2, 1, 1],
      [4000, 2, 1, 0], // overwrites the ON at (2, 1)
      [5000, 3, 2, 0],
      [5000, 3, 2, 1], // same time: the later event in the stream wins
      [10000, 0, 2, 1], // after the rendered time
    ]);
    const renderer = new EventImageRenderer(sensor, { look: 'polarity' });
    renderer.push(events);
    const rgba = imageFor(sensor);
    renderer.render(9000, rgba);
    expect(pixels(rgba)).toEqual([ON, OFF, BG, BG, BG, BG, OFF, BG, BG, BG, BG, ON]);
    renderer.render(10000, rgba);
    expect(pixels(rgba)).toEqual([ON, OFF, BG, BG, BG, BG, OFF, BG, ON, BG, BG, ON]);
  });

  it('does not show an event exactly one frame interval old, and shows one just younger', () => {
    const events = batchFrom([
      [0, 0, 0, 1],
      [1, 1, 0, 0],
    ]);
    const atInterval = renderOnce(sensor, { look: 'polarity' }, events, DEFAULT_FRAME_INTERVAL_US);
    expect(pixels(atInterval).slice(0, 2)).toEqual([BG, OFF]);
    const justBefore = renderOnce(sensor, { look: 'polarity' }, events, DEFAULT_FRAME_INTERVAL_US - 0.5);
    expect(pixels(justBefore).slice(0, 2)).toEqual([ON, OFF]);
  });

  it('shows each event in exactly one of the frames drawn one interval apart', () => {
    // A 64 Hz frame (15625 us) keeps the frame times exact in floating point; with
    // 1e6/60, k*w - w can round below (k-1)*w and an event on the edge would show twice.
    const w = 15_625;
    // Events on distinct pixels at the edges of frames 1..3: (0, 1w], (1w, 2w], (2w, 3w].
    const events = batchFrom([
      [0.5, 0, 0, 1],
      [w, 1, 0, 1],
      [w + 0.5, 2, 0, 0],
      [2 * w, 3, 0, 0],
      [2 * w + 1, 0, 1, 1],
      [3 * w, 1, 1, 0],
    ]);
    const renderer = new EventImageRenderer(sensor, { look: 'polarity', frameIntervalUs: w });
    renderer.push(events);
    const rgba = imageFor(sensor);
    const frames = [1, 2, 3].map((k) => {
      renderer.render(k * w, rgba);
      return pixels(rgba).slice(0, 6);
    });
    expect(frames).toEqual([
      [ON, ON, BG, BG, BG, BG],
      [BG, BG, OFF, OFF, BG, BG],
      [BG, BG, BG, BG, ON, OFF],
    ]);
  });

  it('takes its window from windowUs, else frameIntervalUs, else one 60 Hz frame', () => {
    expect(new EventImageRenderer(sensor, { look: 'polarity' }).historyUs).toBe(1e6 / 60);
    expect(new EventImageRenderer(sensor, { look: 'polarity', frameIntervalUs: 1e6 / 120 }).historyUs).toBe(1e6 / 120);
    expect(new EventImageRenderer(sensor, { look: 'polarity', frameIntervalUs: 1e6 / 120, windowUs: 50_000 }).historyUs).toBe(50_000);
    const events = batchFrom([[0, 0, 0, 1]]);
    // 10 ms old: outside a 120 Hz frame (8.3 ms), inside one 60 Hz frame (16.7 ms).
    expect(pixels(renderOnce(sensor, { look: 'polarity', frameIntervalUs: 1e6 / 120 }, events, 10_000))[0]).toEqual(BG);
    expect(pixels(renderOnce(sensor, { look: 'polarity' }, events, 10_000))[0]).toEqual(ON);
  });
});
