import { allocateBatch, type EventBatch, type SensorSize } from '../event-batch';
import { validateSensorSize } from './sensor-bounds';

/** A rectangle of sensor pixels: top-left corner (x0, y0), size width x height. */
export interface SensorRegion {
  readonly x0: number;
  readonly y0: number;
  readonly width: number;
  readonly height: number;
}

/**
 * Keeps the events inside a region and shifts them so the region's top-left pixel becomes
 * (0, 0); the cropped stream's sensor is the region's size (`outputSensor`). Events outside
 * the region, including any outside the sensor, are dropped. Stateless: one instance serves
 * a whole stream, batch by batch.
 */
export class RegionCrop {
  readonly outputSensor: SensorSize;
  private readonly region: SensorRegion;

  constructor(sensor: SensorSize, region: SensorRegion) {
    validateSensorSize(sensor);
    for (const key of ['x0', 'y0'] as const) {
      if (!Number.isInteger(region[key]) || region[key] < 0) throw new RangeError(`region.${key} must be a non-negative integer, got ${region[key]}`);
    }
    for (const key of ['width', 'height'] as const) {
      if (!Number.isInteger(region[key]) || region[key] < 1) throw new RangeError(`region.${key} must be a positive integer, got ${region[key]}`);
    }
    if (region.x0 + region.width > sensor.width) {
      throw new RangeError(`region.width: x0 + width = ${region.x0 + region.width} exceeds the sensor width ${sensor.width}`);
    }
    if (region.y0 + region.height > sensor.height) {
      throw new RangeError(`region.height: y0 + height = ${region.y0 + region.height} exceeds the sensor height ${sensor.height}`);
    }
    this.region = { x0: region.x0, y0: region.y0, width: region.width, height: region.height };
    this.outputSensor = { width: region.width, height: region.height };
  }

  /** The batch's events inside the region, in region coordinates (a new batch). */
  push(batch: EventBatch): EventBatch {
    const { t, x, y, p } = batch;
    const { x0, y0, width, height } = this.region;
    // Unsigned wrap-around turns "x0 <= x < x0 + width" into one comparison.
    let kept = 0;
    for (let i = 0; i < t.length; i++) {
      if ((x[i]! - x0) >>> 0 < width && (y[i]! - y0) >>> 0 < height) kept++;
    }
    const out = allocateBatch(kept);
    let j = 0;
    for (let i = 0; i < t.length; i++) {
      const dx = (x[i]! - x0) >>> 0;
      const dy = (y[i]! - y0) >>> 0;
      if (dx >= width || dy >= height) continue;
      out.t[j] = t[i]!;
      out.x[j] = dx;
      out.y[j] = dy;
      out.p[j] = p[i]!;
      j++;
    }
    return out;
  }
}
