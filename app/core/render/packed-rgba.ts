import type { Rgb } from './render-defaults';

const bytes = new Uint8ClampedArray(4);
const word = new Uint32Array(bytes.buffer);

/**
 * An opaque colour as the 32-bit word whose bytes in memory are r, g, b, 255 on any byte
 * order, so a Uint32Array view over an rgba image writes a whole pixel in one store.
 * Channels are rounded half up (Math.round) and clamped to 0-255.
 */
export function packRgb(r: number, g: number, b: number): number {
  bytes[0] = Math.round(r);
  bytes[1] = Math.round(g);
  bytes[2] = Math.round(b);
  bytes[3] = 255;
  return word[0]!;
}

/** The colour `weight` of the way from `from` to `to` (0 gives `from`, 1 gives `to`). */
export function packBlend(from: Rgb, to: Rgb, weight: number): number {
  return packRgb(from[0] + weight * (to[0] - from[0]), from[1] + weight * (to[1] - from[1]), from[2] + weight * (to[2] - from[2]));
}
