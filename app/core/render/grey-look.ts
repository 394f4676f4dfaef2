import type { EventRing } from './event-ring';
import type { Look } from './look';
import { packRgb } from './packed-rgba';
import { GREY_GAIN_PER_EVENT, GREY_MID_LEVEL } from './render-defaults';

/** Levels are tabulated for net counts -128..127; any gain of at least one level per event saturates inside that range. */
const TABLE_OFFSET = 128;

/**
 * Plain accumulation: each pixel counts its ON minus OFF events over the half-open window
 * (tUs - windowUs, tUs] and shows grey level clamp(128 + 16 * count, 0, 255) (see
 * render-defaults.ts). Counts change only as events enter and leave the window: the ring
 * keeps the applied events until they age out, so each event is added once and removed
 * once, however often the image is drawn.
 */
export class GreyLook implements Look {
  readonly historyUs: number;
  private readonly counts: Int32Array;
  /** Packed grey for net count c at [c + 128]. */
  private readonly levels = new Uint32Array(256);

  constructor(pixelCount: number, windowUs: number) {
    this.historyUs = windowUs;
    this.counts = new Int32Array(pixelCount);
    for (let k = 0; k < 256; k++) {
      const level = Math.min(255, Math.max(0, GREY_MID_LEVEL + GREY_GAIN_PER_EVENT * (k - TABLE_OFFSET)));
      this.levels[k] = packRgb(level, level, level);
    }
  }

  reset(): void {
    this.counts.fill(0);
  }

  advance(ring: EventRing, tUs: number): void {
    const { t, code, mask } = ring;
    const added = addDue(t, code, mask, ring.first + ring.applied, ring.size - ring.applied, tUs, this.counts);
    const applied = ring.applied + added;
    const removed = removeAged(t, code, mask, ring.first, applied, tUs - this.historyUs, this.counts);
    ring.first = (ring.first + removed) & mask;
    ring.size -= removed;
    ring.applied = applied - removed;
  }

  draw(_tUs: number, pixels: Uint32Array): void {
    const counts = this.counts;
    const levels = this.levels;
    for (let i = 0; i < pixels.length; i++) {
      const k = counts[i]! + TABLE_OFFSET;
      // Counts outside the table are rare, so this branch is well predicted.
      pixels[i] = levels[(k & ~255) === 0 ? k : k < 0 ? 0 : 255]!;
    }
  }
}

// The loops live in plain functions that return a count, so V8 optimizes them whole.

/** Events from ring index `from` on (at most `limit`) with t <= tUs enter the window: ON adds one, OFF takes one away. Returns how many. */
function addDue(t: Float64Array, code: Uint32Array, mask: number, from: number, limit: number, tUs: number, counts: Int32Array): number {
  let n = 0;
  for (; n < limit; n++) {
    const j = (from + n) & mask;
    if (t[j]! > tUs) break;
    const c = code[j]!;
    counts[c >>> 1]! += 2 * (c & 1) - 1;
  }
  return n;
}

/** Events from `from` on (at most `limit`) at or before the window's open start leave it. Returns how many. */
function removeAged(t: Float64Array, code: Uint32Array, mask: number, from: number, limit: number, cutoffUs: number, counts: Int32Array): number {
  let n = 0;
  for (; n < limit; n++) {
    const j = (from + n) & mask;
    if (t[j]! > cutoffUs) break;
    const c = code[j]!;
    counts[c >>> 1]! -= 2 * (c & 1) - 1;
  }
  return n;
}
