import { describe, expect, it } from 'vitest';
import { batchFrom, lowerBound, sliceBatch, type EventBatch } from '../../../../app/core/events/event-batch';
import { EventImageRenderer } from '../../../../app/core/render/event-image-renderer';
import type { LookSettings } from '../../../../app/core/render/look-settings';
import { renderFrameAt } from '../../../../app/core/render/render-frame-at';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { imageFor, pixels, randomStream } from './images';

// Invariants of the renderer's own design (common practice, no source): incremental
// playback and rendering from scratch must give the same bytes.
const LOOKS: readonly LookSettings[] = [{ look: 'polarity' }, { look: 'decay' }, { look: 'grey' }, { look: 'decay', tauUs: 5000 }, { look: 'grey', windowUs: 8000 }];
const sensor = { width: 16, height: 12 };

/** Index just past the last event with t <= tUs. */
const upTo = (events: EventBatch, tUs: number): number => {
  let i = lowerBound(events.t, tUs);
  while (i < events.t.length && events.t[i] === tUs) i++;
  return i;
};

function fromScratch(events: EventBatch, settings: LookSettings, tUs: number): Uint8ClampedArray {
  const rgba = imageFor(sensor);
  renderFrameAt(events, sensor, settings, tUs, rgba);
  return rgba;
}

describe('EventImageRenderer', () => {
  it('maps sensor pixel (x, y) to rgba index (y * width + x) * 4, y down', () => {
    const renderer = new EventImageRenderer({ width: 4, height: 3 }, { look: 'polarity' });
    renderer.push(batchFrom([[0, 3, 1, 1]]));
    const rgba = imageFor({ width: 4, height: 3 });
    renderer.render(0, rgba);
    expect(Array.from(rgba.subarray(28, 32))).toEqual([255, 184, 28, 255]);
    const others = [...Array.from(rgba.subarray(0, 28)), ...Array.from(rgba.subarray(32))];
    expect(others).toEqual(Array.from({ length: 11 }, () => [128, 128, 128, 255]).flat());
  });

  it.each(LOOKS)('plays back in small batches pushed ahead exactly as rendered from scratch: %o', (settings) => {
    // 300,000 events over 1.5 s. The first pushes run 300 ms ahead (about 60,000 events),
    // the 40th frame's to the end of the clip (about 130,000 held), so the ring also grows
    // while it holds wrapped-around events.
    const events = randomStream(sensor, 300_000, 1_500_000, 11);
    const random = new Xoshiro128(12);
    const renderer = new EventImageRenderer(sensor, settings);
    const rgba = imageFor(sensor);
    let pushed = 0;
    let tUs = 0;
    let lead = 300_000;
    let frames = 0;
    while (tUs < 1_500_000) {
      // Push in batches of up to 3000 events until `lead` ahead of the next frame.
      const target = upTo(events, tUs + lead);
      while (pushed < target) {
        const end = Math.min(target, pushed + 1 + random.nextInt(3000));
        renderer.push(sliceBatch(events, pushed, end));
        pushed = end;
      }
      renderer.render(tUs, rgba);
      expect(pixels(rgba)).toEqual(pixels(fromScratch(events, settings, tUs)));
      frames++;
      // Frames about 1/60 s apart with jitter, a repeated frame now and then (a paused stage).
      tUs += random.nextInt(5) === 0 ? 0 : 12_000 + random.next() * 9_000;
      lead = frames === 40 ? 1_500_000 : random.next() * 200_000;
    }
    expect(frames).toBeGreaterThan(60);
  });

  it.each(LOOKS)('shows time T from events in [T - historyUs, T] alone, as from the beginning: %o', (settings) => {
    const events = randomStream(sensor, 60_000, 1_000_000, 21);
    const renderer = new EventImageRenderer(sensor, settings);
    const fromStart = imageFor(sensor);
    const scrubbed = imageFor(sensor);
    for (const T of [700_000, 250_000, 981_234.5]) {
      renderer.reset();
      renderer.push(sliceBatch(events, 0, upTo(events, T)));
      renderer.render(T, fromStart);
      renderer.reset();
      renderer.push(sliceBatch(events, lowerBound(events.t, T - renderer.historyUs), upTo(events, T)));
      renderer.render(T, scrubbed);
      expect(pixels(scrubbed)).toEqual(pixels(fromStart));
    }
  });

  it.each(LOOKS)('still shows an event half of historyUs old: %o', (settings) => {
    const T = 500_000;
    const h = new EventImageRenderer(sensor, settings).historyUs;
    const shown = pixels(fromScratch(batchFrom([[T - h / 2, 5, 5, 1]]), settings, T));
    expect(shown[5 * 16 + 5]).not.toEqual([128, 128, 128, 255]);
    expect(shown[5 * 16 + 6]).toEqual([128, 128, 128, 255]);
  });

  it('counts events pushed late (earlier than a time already drawn) from the next render on', () => {
    for (const settings of LOOKS) {
      const events = batchFrom([
        [10_000, 1, 1, 1],
        [10_000, 2, 1, 0],
        [24_000, 3, 1, 1],
      ]);
      const renderer = new EventImageRenderer(sensor, settings);
      const rgba = imageFor(sensor);
      renderer.render(20_000, rgba);
      renderer.push(events);
      renderer.render(25_000, rgba);
      expect(pixels(rgba)).toEqual(pixels(fromScratch(events, settings, 25_000)));
    }
  });

  it('holds any number of events pushed ahead', () => {
    // 65,537 events in one push: one more than the ring's first size, so it must grow before copying.
    const count = 65_537;
    const events = batchFrom(Array.from({ length: count }, (_, i) => [i, i === 0 ? 0 : 1, 0, i === 0 ? 1 : 0] as const));
    const renderer = new EventImageRenderer({ width: 2, height: 1 }, { look: 'polarity' });
    renderer.push(events);
    const rgba = imageFor({ width: 2, height: 1 });
    renderer.render(0, rgba);
    expect(pixels(rgba)).toEqual([[255, 184, 28, 255], [128, 128, 128, 255]]);
    renderer.render(count - 1, rgba);
    expect(pixels(rgba)).toEqual([[128, 128, 128, 255], [16, 96, 192, 255]]);
  });

  it('draws the same image into any rgba array it is given', () => {
    const events = randomStream(sensor, 5000, 100_000, 31);
    const renderer = new EventImageRenderer(sensor, { look: 'decay' });
    renderer.push(events);
    const a = imageFor(sensor);
    const b = new Uint8ClampedArray(new ArrayBuffer(a.length + 8), 4, a.length);
    renderer.render(60_000, a);
    renderer.render(60_000, b);
    expect(Array.from(b)).toEqual(Array.from(a));
    renderer.render(90_000, a);
    expect(Array.from(a)).toEqual(Array.from(fromScratch(events, { look: 'decay' }, 90_000)));
  });

  it('renderFrameAt counts every event at exactly tUs and none after', () => {
    const events = batchFrom([
      [100, 0, 0, 1],
      [200, 1, 0, 1],
      [200, 2, 0, 1],
      [200, 3, 0, 1],
      [201, 4, 0, 1],
    ]);
    const grey = pixels(fromScratch(events, { look: 'grey' }, 200)).slice(0, 5).map((p) => p[0]);
    expect(grey).toEqual([144, 144, 144, 144, 128]);
  });
});

describe('EventImageRenderer input checks', () => {
  const renderer = (): EventImageRenderer => new EventImageRenderer({ width: 4, height: 3 }, { look: 'grey' });

  it('rejects bad sensors and looks with a RangeError naming the parameter', () => {
    expect(() => new EventImageRenderer({ width: 0, height: 3 }, { look: 'grey' })).toThrow(/sensor\.width/);
    expect(() => new EventImageRenderer({ width: 4, height: 2.5 }, { look: 'grey' })).toThrow(/sensor\.height/);
    expect(() => new EventImageRenderer({ width: 65537, height: 1 }, { look: 'grey' })).toThrow(RangeError);
    expect(() => new EventImageRenderer({ width: 4, height: 3 }, { look: 'decay', tauUs: 0 })).toThrow(/tauUs/);
  });

  it('rejects events out of order, off the sensor or without a polarity, and keeps its state', () => {
    const r = renderer();
    r.push(batchFrom([[50, 0, 0, 1]]));
    expect(() => r.push(batchFrom([[40, 0, 0, 1]]))).toThrow(/batch\.t\[0\] = 40 .*\(50\)/);
    expect(() => r.push(batchFrom([[60, 0, 0, 1], [59, 0, 0, 1]]))).toThrow(/batch\.t\[1\] = 59/);
    expect(() => r.push(batchFrom([[60, 4, 0, 1]]))).toThrow(/event 0 at \(4, 0\) is outside the 4x3 sensor/);
    expect(() => r.push(batchFrom([[60, 0, 3, 1]]))).toThrow(/outside/);
    expect(() => r.push(batchFrom([[60, 0, 0, 2]]))).toThrow(/batch\.p\[0\] = 2/);
    expect(() => r.push(batchFrom([[Number.NaN, 0, 0, 1]]))).toThrow(/batch\.t\[0\] = NaN/);
    expect(() => r.push(batchFrom([[60, 0, 0, 1], [Infinity, 0, 0, 1]]))).toThrow(/batch\.t\[1\] = Infinity/);
    expect(() => r.push({ t: new Float64Array(2), x: new Uint16Array(2), y: new Uint16Array(1), p: new Uint8Array(2) })).toThrow(/equal lengths/);
    for (const error of [() => r.push(batchFrom([[40, 0, 0, 1]])), () => r.push(batchFrom([[60, 9, 9, 1]]))]) expect(error).toThrow(RangeError);
    // None of the failed batches was kept: only the first event counts, and 50 is still the time to follow.
    r.push(batchFrom([[50, 1, 0, 0]]));
    const rgba = imageFor({ width: 4, height: 3 });
    r.render(100, rgba);
    expect(pixels(rgba).slice(0, 3).map((p) => p[0])).toEqual([144, 112, 128]);
  });

  it('rejects a bad time, a time earlier than the last one drawn, and a wrong image', () => {
    const r = renderer();
    const rgba = imageFor({ width: 4, height: 3 });
    expect(() => r.render(Number.NaN, rgba)).toThrow(/tUs/);
    r.render(1000, rgba);
    expect(() => r.render(999, rgba)).toThrow(/earlier than the last rendered time 1000; reset\(\)/);
    expect(() => r.render(2000, new Uint8ClampedArray(47))).toThrow(/rgba must hold 48 bytes/);
    expect(() => r.render(2000, new Uint8ClampedArray(new ArrayBuffer(52), 2, 48))).toThrow(/4-byte boundary/);
    r.reset();
    r.render(10, rgba); // after reset() any time may be drawn
    expect(pixels(rgba)[0]).toEqual([128, 128, 128, 255]);
  });
});
