import { lowerBound, sliceBatch, type EventBatch, type SensorSize } from '../events/event-batch';
import { EventImageRenderer } from './event-image-renderer';
import type { LookSettings } from './look-settings';

/**
 * The image at stimulus time tUs from a whole clip's events, for one-off scrubbing: only
 * the events in [tUs - historyUs, tUs] are read, found by binary search. Gives the same
 * image as a renderer that was fed the clip from the start and rendered at tUs.
 */
export function renderFrameAt(events: EventBatch, sensor: SensorSize, settings: LookSettings, tUs: number, rgba: Uint8ClampedArray): void {
  const renderer = new EventImageRenderer(sensor, settings);
  const start = lowerBound(events.t, tUs - renderer.historyUs);
  let end = lowerBound(events.t, tUs, start);
  while (end < events.t.length && events.t[end] === tUs) end++;
  renderer.push(sliceBatch(events, start, end));
  renderer.render(tUs, rgba);
}
