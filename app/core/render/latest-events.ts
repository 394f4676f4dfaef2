import type { EventRing } from './event-ring';

/**
 * The time a pixel that never fired holds: earlier than any event time a stream can carry
 * exactly (float64 integers end at 2^53), yet finite, so the decay look's age arithmetic
 * stays on the fast float-to-integer path (an infinite age would take V8's slow one).
 */
export const NEVER_US = -(2 ** 53);

/**
 * Per pixel, the time and polarity of its latest event: the state behind the polarity and
 * decay looks (the time surface of Lagorce et al. 2017 with both polarities in one map).
 */
export class LatestEvents {
  readonly tUs: Float64Array;
  readonly polarity: Uint8Array;

  constructor(pixelCount: number) {
    this.tUs = new Float64Array(pixelCount).fill(NEVER_US);
    this.polarity = new Uint8Array(pixelCount);
  }

  reset(): void {
    this.tUs.fill(NEVER_US);
    this.polarity.fill(0);
  }

  /**
   * Applies the ring's events with t <= tUs, later ones overwriting earlier ones, and drops
   * them: this state needs no past events, so everything the ring holds is pending.
   */
  takeFrom(ring: EventRing, tUs: number): void {
    const taken = takeDue(ring.t, ring.code, ring.mask, ring.first, ring.size, tUs, this.tUs, this.polarity);
    ring.first = (ring.first + taken) & ring.mask;
    ring.size -= taken;
  }
}

/** Records events from ring index `from` on (at most `limit`) with t <= tUs; returns how many. A plain function, so V8 optimizes the loop whole. */
function takeDue(t: Float64Array, code: Uint32Array, mask: number, from: number, limit: number, tUs: number, lastT: Float64Array, polarity: Uint8Array): number {
  let n = 0;
  for (; n < limit; n++) {
    const j = (from + n) & mask;
    const tj = t[j]!;
    if (tj > tUs) break;
    const c = code[j]!;
    lastT[c >>> 1] = tj;
    polarity[c >>> 1] = c & 1;
  }
  return n;
}
