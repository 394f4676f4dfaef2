import type { TimeResolution } from '../event-batch';
import { MAX_TICKS } from './layout';

/**
 * A file's ticks as EventBatch microseconds: integral for µs files, tick / 1000 for ns files
 * (division is correctly rounded, so each tick maps to the nearest float64; the chunk
 * decoder uses the same expression).
 */
export const usFromTicks = (ticks: number, resolution: TimeResolution): number => (resolution === 'ns' ? ticks / 1000 : ticks);

/**
 * The tick count whose microseconds are exactly `tUs`, or NaN when there is none (a
 * fraction of a microsecond in a µs file, of a nanosecond in an ns file, a negative or
 * non-finite time, or one beyond MAX_TICKS). Exactness is what makes conversion lossless.
 */
export function ticksFromUs(tUs: number, resolution: TimeResolution): number {
  if (!(tUs >= 0)) return NaN;
  if (resolution === 'us') return Number.isInteger(tUs) && tUs <= MAX_TICKS.us ? tUs : NaN;
  // tUs * 1000 can round to a neighbour of the true tick, so look one either side.
  const near = Math.round(tUs * 1000);
  for (const ticks of [near, near - 1, near + 1]) {
    if (ticks >= 0 && ticks <= MAX_TICKS.ns && ticks / 1000 === tUs) return ticks;
  }
  return NaN;
}
