import type { EventRing } from './event-ring';
import { LatestEvents } from './latest-events';
import type { Look } from './look';
import { packRgb } from './packed-rgba';
import { DEFAULT_BACKGROUND_RGB, DEFAULT_OFF_RGB, DEFAULT_ON_RGB } from './render-defaults';

/**
 * Each pixel shows the polarity colour of its latest event within the window, else the
 * background. The window is half-open, (tUs - windowUs, tUs]: an event exactly windowUs
 * old no longer shows, so with the window equal to the frame interval, frames drawn one
 * interval apart show each event once (exactly so when tUs - windowUs lands on the
 * previous frame's time in floating point, as with 15625 us at 64 Hz; with 1e6/60 it can
 * round a hair lower, and an event exactly on a frame's time may show in the next too).
 */
export class PolarityLook implements Look {
  readonly historyUs: number;
  private readonly latest: LatestEvents;
  /** Indexed by shown * 2 + polarity: background twice, then OFF and ON. */
  private readonly colours = new Uint32Array([
    packRgb(...DEFAULT_BACKGROUND_RGB),
    packRgb(...DEFAULT_BACKGROUND_RGB),
    packRgb(...DEFAULT_OFF_RGB),
    packRgb(...DEFAULT_ON_RGB),
  ]);

  constructor(pixelCount: number, windowUs: number) {
    this.historyUs = windowUs;
    this.latest = new LatestEvents(pixelCount);
  }

  reset(): void {
    this.latest.reset();
  }

  advance(ring: EventRing, tUs: number): void {
    this.latest.takeFrom(ring, tUs);
  }

  draw(tUs: number, pixels: Uint32Array): void {
    const cutoffUs = tUs - this.historyUs;
    const { tUs: lastT, polarity } = this.latest;
    const colours = this.colours;
    // A table lookup rather than a branch: which pixels show is as unpredictable as the events.
    for (let i = 0; i < pixels.length; i++) {
      pixels[i] = colours[Number(lastT[i]! > cutoffUs) * 2 + polarity[i]!]!;
    }
  }
}
