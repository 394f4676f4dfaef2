import type { TimeResolution } from '../events/event-batch';
import type { EventBuffer } from './event-buffer';

const TICKS_PER_US: Record<TimeResolution, number> = { us: 1, ns: 1000 };
const MAX_EXACT_KEY = 2 ** 53;

/**
 * Collects the events of one interval (tPrevUs, tNowUs] in any order, truncates their
 * timestamps to the clock tick, and hands them on sorted by time, then pixel index, then
 * polarity (OFF first). With a clock tick the three are packed into one float64 key, exact
 * below 2^53, so the sort is a plain numeric one; exact times use a comparator.
 */
export class IntervalEvents {
  private t = new Float64Array(1024);
  private pixel = new Uint32Array(1024);
  private polarity = new Uint8Array(1024);
  private count = 0;
  private readonly ticksPerUs: number;
  private keys = new Float64Array(1024);
  private tickLo = 0;
  private tickHi = 0;

  constructor(
    private readonly width: number,
    private readonly pixelCount: number,
    timeResolution: TimeResolution | null,
  ) {
    this.ticksPerUs = timeResolution === null ? 0 : TICKS_PER_US[timeResolution];
  }

  begin(tPrevUs: number, tNowUs: number): void {
    this.count = 0;
    if (this.ticksPerUs === 0) return;
    // (tPrev, tNow] truncates to ticks in [tPrev, tNow): a crossing at exactly tNow keeps to this interval.
    this.tickLo = Math.floor(tPrevUs * this.ticksPerUs);
    this.tickHi = Math.max(this.tickLo, Math.ceil(tNowUs * this.ticksPerUs) - 1);
  }

  add(tUs: number, pixel: number, polarity: number): void {
    if (this.count === this.t.length) this.grow();
    const i = this.count++;
    this.t[i] = this.ticksPerUs === 0 ? tUs : Math.min(this.tickHi, Math.max(this.tickLo, Math.floor(tUs * this.ticksPerUs)));
    this.pixel[i] = pixel;
    this.polarity[i] = polarity;
  }

  /** Appends the interval's events to `out` in order and returns how many there were. */
  flush(out: EventBuffer): number {
    const span = this.tickHi - this.tickLo + 1;
    if (this.ticksPerUs > 0 && span * this.pixelCount * 2 < MAX_EXACT_KEY) this.flushByKey(out);
    else this.flushByComparator(out);
    return this.count;
  }

  private flushByKey(out: EventBuffer): void {
    const n = this.count;
    if (this.keys.length < n) this.keys = new Float64Array(this.t.length);
    const keys = this.keys.subarray(0, n);
    for (let i = 0; i < n; i++) keys[i] = ((this.t[i]! - this.tickLo) * this.pixelCount + this.pixel[i]!) * 2 + this.polarity[i]!;
    keys.sort();
    for (let i = 0; i < n; i++) {
      const key = keys[i]!;
      const p = key % 2;
      const rest = (key - p) / 2;
      const pixel = rest % this.pixelCount;
      const tick = this.tickLo + (rest - pixel) / this.pixelCount;
      out.push(tick / this.ticksPerUs, pixel % this.width, (pixel - (pixel % this.width)) / this.width, p);
    }
  }

  private flushByComparator(out: EventBuffer): void {
    const { t, pixel, polarity } = this;
    const order = Uint32Array.from({ length: this.count }, (_, i) => i);
    order.sort((a, b) => t[a]! - t[b]! || pixel[a]! - pixel[b]! || polarity[a]! - polarity[b]!);
    const scale = this.ticksPerUs === 0 ? 1 : this.ticksPerUs;
    for (const i of order) out.push(t[i]! / scale, pixel[i]! % this.width, Math.floor(pixel[i]! / this.width), polarity[i]!);
  }

  private grow(): void {
    const size = this.t.length * 2;
    const t = new Float64Array(size);
    const pixel = new Uint32Array(size);
    const polarity = new Uint8Array(size);
    t.set(this.t);
    pixel.set(this.pixel);
    polarity.set(this.polarity);
    this.t = t;
    this.pixel = pixel;
    this.polarity = polarity;
  }
}
