import type { EventRing } from './event-ring';

/** One way of turning events into an image; the renderer feeds it and asks it to draw. */
export interface Look {
  /** Events older than this before the rendered time no longer change the image. */
  readonly historyUs: number;
  reset(): void;
  /** Applies the ring's pending events with t <= tUs and drops the ones it no longer needs. */
  advance(ring: EventRing, tUs: number): void;
  /** Writes the image at tUs, one packed colour (see packed-rgba.ts) per pixel. */
  draw(tUs: number, pixels: Uint32Array): void;
}
