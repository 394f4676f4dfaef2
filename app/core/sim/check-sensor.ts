import type { SensorSize } from '../events/event-batch';

/** Throws a RangeError unless the sensor has whole-pixel sides that fit the 16-bit event columns. */
export function checkSensor(sensor: SensorSize): void {
  for (const side of ['width', 'height'] as const) {
    const value = sensor[side];
    if (!Number.isInteger(value) || value < 1 || value > 65536) throw new RangeError(`sensor.${side} must be an integer in 1..65536, got ${value}`);
  }
}
