import type { SensorSize } from '../events/event-batch';
import { screenPoint, sensorPoint, type ScreenPoint, type SensorPoint } from './units';

/**
 * Where a sensor's image sits on the screen:
 *   fit      the largest uniform scale that fits, centred, letterboxed;
 *   1:1      one sensor pixel per screen pixel, centred (cropped if larger than the screen);
 *   integer  the largest whole-number scale that fits (at least 1), centred, for crisp pixels.
 */
export type PlacementMode = 'fit' | '1:1' | 'integer';

export interface Placement {
  readonly mode: PlacementMode;
  /** Screen pixels per sensor pixel. */
  readonly scale: number;
  /** Screen position of the sensor image's top-left corner. */
  readonly left: number;
  readonly top: number;
  readonly sensor: SensorSize;
}

export function placeSensor(sensor: SensorSize, screen: { widthPx: number; heightPx: number }, mode: PlacementMode): Placement {
  const fitScale = Math.min(screen.widthPx / sensor.width, screen.heightPx / sensor.height);
  const scale = mode === 'fit' ? fitScale : mode === '1:1' ? 1 : Math.max(1, Math.floor(fitScale));
  if (!(scale > 0)) throw new RangeError(`cannot place a ${sensor.width}x${sensor.height} sensor on a ${screen.widthPx}x${screen.heightPx} screen`);
  return { mode, scale, left: (screen.widthPx - sensor.width * scale) / 2, top: (screen.heightPx - sensor.height * scale) / 2, sensor };
}

/**
 * Sensor pixel (x, y) is centred on integer coordinates, so the pixel covers
 * [x - 0.5, x + 0.5) and its centre lies at screen left + (x + 0.5)·scale.
 */
export function sensorToScreen(p: Placement, point: SensorPoint): ScreenPoint {
  return screenPoint(p.left + (point.x + 0.5) * p.scale, p.top + (point.y + 0.5) * p.scale);
}

export function screenToSensor(p: Placement, point: ScreenPoint): SensorPoint {
  return sensorPoint((point.x - p.left) / p.scale - 0.5, (point.y - p.top) / p.scale - 0.5);
}

/** True when a sensor-space point lies on the sensor's image (not in the letterbox). */
export function onSensor(p: Placement, point: SensorPoint): boolean {
  return point.x >= -0.5 && point.y >= -0.5 && point.x < p.sensor.width - 0.5 && point.y < p.sensor.height - 0.5;
}
