import type { EventBatch, SensorSize } from '../event-batch';

/** Coordinates are Uint16, so a sensor is at most 65536 pixels on a side. */
const MAX_SIDE_PX = 65536;

/** Throws a RangeError naming `name.width` or `name.height` unless both are integers in 1..65536. */
export function validateSensorSize(sensor: SensorSize, name = 'sensor'): void {
  for (const side of ['width', 'height'] as const) {
    const value = sensor[side];
    if (!Number.isInteger(value) || value < 1 || value > MAX_SIDE_PX) {
      throw new RangeError(`${name}.${side} must be an integer from 1 to ${MAX_SIDE_PX}, got ${value}`);
    }
  }
}

/**
 * Throws a RangeError for the first event outside the sensor, so that per-pixel tables indexed
 * by y * width + x can never be written through a neighbouring row. Decoders already reject such
 * events with the file and line; this guards the core against batches built any other way.
 */
export function checkEventsInSensor(batch: EventBatch, sensor: SensorSize): void {
  const { x, y } = batch;
  const { width, height } = sensor;
  for (let i = 0; i < x.length; i++) {
    if (x[i]! >= width || y[i]! >= height) {
      throw new RangeError(`batch event ${i} at (${x[i]}, ${y[i]}) is outside the ${width}x${height} sensor`);
    }
  }
}
