import type { EventBatch, SensorSize } from '../events/event-batch';
import { DecayLook } from './decay-look';
import { EventRing } from './event-ring';
import { GreyLook } from './grey-look';
import type { Look } from './look';
import { resolveLook, type LookSettings } from './look-settings';
import { PolarityLook } from './polarity-look';

/** Pixels are coded as pixel * 2 + polarity in 32 bits. */
const MAX_PIXELS = 2 ** 31;

function createLook(pixelCount: number, settings: LookSettings): Look {
  const resolved = resolveLook(settings);
  switch (resolved.look) {
    case 'polarity':
      return new PolarityLook(pixelCount, resolved.windowUs);
    case 'decay':
      return new DecayLook(pixelCount, resolved.tauUs);
    case 'grey':
      return new GreyLook(pixelCount, resolved.windowUs);
  }
}

function checkSensor(sensor: SensorSize): number {
  for (const side of ['width', 'height'] as const) {
    const v = sensor[side];
    if (!Number.isInteger(v) || v < 1 || v > 65536) throw new RangeError(`sensor.${side} must be an integer from 1 to 65536, got ${v}`);
  }
  const pixels = sensor.width * sensor.height;
  if (pixels > MAX_PIXELS) throw new RangeError(`sensor ${sensor.width}x${sensor.height} has more than ${MAX_PIXELS} pixels`);
  return pixels;
}

/**
 * Gazeloom's one event renderer: the stimulus preview, the stage and the flash-hazard
 * analysis all see the images it makes. Push events in time order (across calls too, and
 * ahead of need: events later than the rendered time wait in a queue), then render the
 * image as shown at stimulus time tUs, counting only events with t <= tUs.
 *
 * Render times must not go back between resets: the looks keep per-pixel state, not the
 * past. To show an earlier time, reset() and push events from tUs - historyUs on (or use
 * renderFrameAt). Events pushed late (earlier than a time already rendered) are fine; they
 * count from the next render on, as if they had arrived in time.
 *
 * Cost: push is O(events) and copies them into a reused ring buffer; render is O(events
 * that became due or aged out + pixels) and allocates nothing once the ring has grown to
 * the stream's rate and the same rgba array is passed again.
 * Pixel (x, y) is rgba[(y * width + x) * 4 .. + 3] (r, g, b, a = 255), y down.
 */
export class EventImageRenderer {
  /** How far back events still matter: to show time T from scratch, reset() and push events from T - historyUs to T. */
  readonly historyUs: number;
  private readonly pixelCount: number;
  private readonly look: Look;
  private readonly ring: EventRing;
  private renderedUs = -Infinity;
  private target: Uint8ClampedArray | null = null;
  private pixels: Uint32Array = new Uint32Array(0);

  constructor(sensor: SensorSize, settings: LookSettings) {
    this.pixelCount = checkSensor(sensor);
    this.look = createLook(this.pixelCount, settings);
    this.historyUs = this.look.historyUs;
    this.ring = new EventRing(sensor);
  }

  /** Forgets all events and the last rendered time. */
  reset(): void {
    this.ring.clear();
    this.look.reset();
    this.renderedUs = -Infinity;
  }

  /** Queues events; they must be in time order and not earlier than events pushed before. A batch that fails the checks changes nothing. */
  push(batch: EventBatch): void {
    this.ring.push(batch);
  }

  /** Writes the image as shown at stimulus time tUs into rgba (width * height * 4 bytes, starting on a 4-byte boundary). */
  render(tUs: number, rgba: Uint8ClampedArray): void {
    if (!Number.isFinite(tUs)) throw new RangeError(`tUs must be a finite time in microseconds, got ${tUs}`);
    if (tUs < this.renderedUs) throw new RangeError(`tUs ${tUs} is earlier than the last rendered time ${this.renderedUs}; reset() and push from tUs - historyUs to go back`);
    const pixels = this.pixelsOf(rgba);
    this.look.advance(this.ring, tUs);
    this.look.draw(tUs, pixels);
    this.renderedUs = tUs;
  }

  /** A whole-pixel view of rgba, made again only when the caller passes a different array. */
  private pixelsOf(rgba: Uint8ClampedArray): Uint32Array {
    if (rgba === this.target) return this.pixels;
    if (rgba.length !== this.pixelCount * 4) throw new RangeError(`rgba must hold ${this.pixelCount * 4} bytes (width * height * 4), got ${rgba.length}`);
    if (rgba.byteOffset % 4 !== 0) throw new RangeError(`rgba must start on a 4-byte boundary of its buffer, got byteOffset ${rgba.byteOffset}`);
    this.pixels = new Uint32Array(rgba.buffer, rgba.byteOffset, this.pixelCount);
    this.target = rgba;
    return this.pixels;
  }
}
