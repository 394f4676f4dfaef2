import { DECAY_TABLE_STEPS, DecayTable } from './decay-table';
import type { EventRing } from './event-ring';
import { LatestEvents } from './latest-events';
import type { Look } from './look';
import { DEFAULT_BACKGROUND_RGB, DEFAULT_OFF_RGB, DEFAULT_ON_RGB } from './render-defaults';

/** Covers every table step (0..4096) and keeps wild ones below 8192. */
const STEP_MASK = 2 * DECAY_TABLE_STEPS - 1;

/**
 * The time surface of Lagorce et al. (2017), "HOTS: a hierarchy of event-based
 * time-surfaces for pattern recognition", IEEE TPAMI 39(7): each pixel's weight is
 * exp(-(tUs - tLast)/tau) for its latest event, and the pixel is the background blended
 * that far toward that event's polarity colour. A pixel that never fired, or whose latest
 * event is historyUs (tau * ln 256) old or older, shows the background.
 */
export class DecayLook implements Look {
  readonly historyUs: number;
  private readonly latest: LatestEvents;
  private readonly table: DecayTable;

  constructor(pixelCount: number, tauUs: number) {
    this.table = new DecayTable(tauUs, DEFAULT_BACKGROUND_RGB, DEFAULT_OFF_RGB, DEFAULT_ON_RGB);
    this.historyUs = this.table.historyUs;
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
    const table = this.table;
    const colours = table.colours;
    const stepsPerUs = table.stepsPerUs;
    const stride = DecayTable.STRIDE;
    // Branch-free, since which pixels show is as unpredictable as the events: a pixel past
    // the cut-off (or never fired) multiplies its index down to colours[0], the background.
    // Its step is then meaningless; the mask only keeps the sum a small integer.
    for (let i = 0; i < pixels.length; i++) {
      const t = lastT[i]!;
      const step = (((tUs - t) * stepsPerUs + 0.5) | 0) & STEP_MASK;
      pixels[i] = colours[Number(t > cutoffUs) * (1 + polarity[i]! * stride + step)]!;
    }
  }
}
