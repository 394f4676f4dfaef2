import type { EventBatch, SensorSize } from '../../../../app/core/events/event-batch';
import { allocateBatch } from '../../../../app/core/events/event-batch';
import { EventImageRenderer } from '../../../../app/core/render/event-image-renderer';
import type { LookSettings } from '../../../../app/core/render/look-settings';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

export type Rgba = [number, number, number, number];

export const imageFor = (sensor: SensorSize): Uint8ClampedArray => new Uint8ClampedArray(sensor.width * sensor.height * 4);

/** Pixel (x, y) of an rgba image, y down. */
export function pixelAt(rgba: Uint8ClampedArray, width: number, x: number, y: number): Rgba {
  const i = (y * width + x) * 4;
  return [rgba[i]!, rgba[i + 1]!, rgba[i + 2]!, rgba[i + 3]!];
}

/** All pixels, row by row, as [r, g, b, a]. */
export function pixels(rgba: Uint8ClampedArray): Rgba[] {
  return Array.from({ length: rgba.length / 4 }, (_, i) => [rgba[4 * i]!, rgba[4 * i + 1]!, rgba[4 * i + 2]!, rgba[4 * i + 3]!] as Rgba);
}

/** One image from events pushed in one go. */
export function renderOnce(sensor: SensorSize, settings: LookSettings, events: EventBatch, tUs: number): Uint8ClampedArray {
  const renderer = new EventImageRenderer(sensor, settings);
  renderer.push(events);
  const rgba = imageFor(sensor);
  renderer.render(tUs, rgba);
  return rgba;
}

/** A seeded stream: `count` events over [0, durationUs) with exponential gaps and some equal timestamps. */
export function randomStream(sensor: SensorSize, count: number, durationUs: number, seed: number): EventBatch {
  const random = new Xoshiro128(seed);
  const events = allocateBatch(count);
  let t = 0;
  for (let i = 0; i < count; i++) {
    // Whole microseconds, so neighbours often share a timestamp, as in microsecond sources.
    t += Math.floor(random.nextExponential(count / durationUs));
    events.t[i] = t;
    events.x[i] = random.nextInt(sensor.width);
    events.y[i] = random.nextInt(sensor.height);
    events.p[i] = random.nextInt(2);
  }
  return events;
}
