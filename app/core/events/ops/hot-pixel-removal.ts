import type { EventBatch, SensorSize } from '../event-batch';
import { checkEventsInSensor, validateSensorSize } from './sensor-bounds';
import { maskWithRoom, selectEvents } from './select-events';

/** A pixel to silence; the `hot_pixels.pixels` entries of the stream statistics fit as they are. */
export interface PixelAddress {
  readonly x: number;
  readonly y: number;
}

/**
 * Drops every event of the listed pixels (typically the hot pixels found by the stream
 * statistics) and keeps all others in order. Stateless: one instance serves a whole stream.
 */
export class HotPixelRemoval {
  private readonly sensor: SensorSize;
  private readonly silenced: Uint8Array;
  private keep: Uint8Array = new Uint8Array(0);

  constructor(sensor: SensorSize, pixels: readonly PixelAddress[]) {
    validateSensorSize(sensor);
    this.sensor = { width: sensor.width, height: sensor.height };
    this.silenced = new Uint8Array(sensor.width * sensor.height);
    pixels.forEach(({ x, y }, i) => {
      if (!Number.isInteger(x) || x < 0 || x >= sensor.width) throw new RangeError(`pixels[${i}].x must be an integer from 0 to ${sensor.width - 1}, got ${x}`);
      if (!Number.isInteger(y) || y < 0 || y >= sensor.height) throw new RangeError(`pixels[${i}].y must be an integer from 0 to ${sensor.height - 1}, got ${y}`);
      this.silenced[y * sensor.width + x] = 1;
    });
  }

  /** The batch's events that are not from a listed pixel (a new batch). */
  push(batch: EventBatch): EventBatch {
    checkEventsInSensor(batch, this.sensor);
    const { x, y } = batch;
    const n = x.length;
    const width = this.sensor.width;
    const silenced = this.silenced;
    const keep = (this.keep = maskWithRoom(this.keep, n));
    let kept = 0;
    for (let i = 0; i < n; i++) {
      const k = 1 - silenced[y[i]! * width + x[i]!]!;
      keep[i] = k;
      kept += k;
    }
    return selectEvents(batch, keep, kept);
  }
}
