import type { EventBatch, SensorSize } from '../event-batch';
import { checkEventsInSensor, validateSensorSize } from './sensor-bounds';
import { maskWithRoom, selectEvents } from './select-events';

/**
 * Default support window: 10 ms (common practice, value from memory; Delbruck's own
 * implementation defaults to 30 ms). Longer windows keep more noise, shorter ones start to
 * thin out slow edges.
 */
export const DEFAULT_BACKGROUND_ACTIVITY_DT_US = 10_000;

export interface BackgroundActivityOptions {
  /** How recent a neighbour's event must be to support an event, in µs (> 0). */
  readonly dtUs?: number;
}

/**
 * Background-activity filter (Delbruck 2008, "Frame-free dynamic digital vision", Proc. Intl.
 * Symp. on Secure-Life Electronics). Noise events are isolated in space and time, real edges
 * are not: an event is kept only if one of its 8 neighbours (never the pixel itself) fired at
 * most dtUs before it, t - t_neighbour <= dtUs (inclusive, so a neighbour at the same
 * timestamp earlier in the stream counts).
 *
 * Every event, kept or not, becomes its own pixel's last timestamp. This is the usual
 * formulation (so a burst of noise can support its neighbours), and for time-ordered events
 * it decides exactly as the variant that writes each timestamp into the 8 neighbours' cells
 * and reads the event's own cell.
 *
 * State is one timestamp per pixel, so batches of one stream must come in time order through
 * one instance; reset() forgets all of it (a new stream, or a seek).
 */
export class BackgroundActivityFilter {
  readonly dtUs: number;
  private readonly sensor: SensorSize;
  /** Last timestamp per pixel on a grid padded by one pixel on every side, so the 8-neighbour reads need no bounds checks. */
  private readonly lastUs: Float64Array;
  private readonly stride: number;
  private keep: Uint8Array = new Uint8Array(0);

  constructor(sensor: SensorSize, options: BackgroundActivityOptions = {}) {
    validateSensorSize(sensor);
    const dtUs = options.dtUs ?? DEFAULT_BACKGROUND_ACTIVITY_DT_US;
    if (!Number.isFinite(dtUs) || dtUs <= 0) throw new RangeError(`dtUs must be a positive finite number of microseconds, got ${dtUs}`);
    this.dtUs = dtUs;
    this.sensor = { width: sensor.width, height: sensor.height };
    this.stride = sensor.width + 2;
    this.lastUs = new Float64Array(this.stride * (sensor.height + 2));
    this.reset();
  }

  /** The batch's supported events (a new batch), after updating the per-pixel timestamps. */
  push(batch: EventBatch): EventBatch {
    checkEventsInSensor(batch, this.sensor);
    const { t, x, y } = batch;
    const n = t.length;
    const last = this.lastUs;
    const stride = this.stride;
    const dt = this.dtUs;
    const keep = (this.keep = maskWithRoom(this.keep, n));
    let kept = 0;
    for (let i = 0; i < n; i++) {
      const ti = t[i]!;
      const c = (y[i]! + 1) * stride + x[i]! + 1;
      const up = c - stride;
      const down = c + stride;
      // A pixel that never fired holds -Infinity, so ti - last is +Infinity and never supports.
      const supported =
        ti - last[up - 1]! <= dt ||
        ti - last[up]! <= dt ||
        ti - last[up + 1]! <= dt ||
        ti - last[c - 1]! <= dt ||
        ti - last[c + 1]! <= dt ||
        ti - last[down - 1]! <= dt ||
        ti - last[down]! <= dt ||
        ti - last[down + 1]! <= dt;
      keep[i] = supported ? 1 : 0;
      if (supported) kept++;
      last[c] = ti;
    }
    return selectEvents(batch, keep, kept);
  }

  reset(): void {
    this.lastUs.fill(-Infinity);
  }
}
