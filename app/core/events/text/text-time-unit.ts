import type { TimeResolution } from '../event-batch';

export type TextTimeUnit = 'us' | 'ns' | 'ms' | 's';

export interface TimeUnitRule {
  /** The resolution a stream in this unit gets: the finest step the unit can carry exactly. */
  readonly resolution: TimeResolution;
  /** Decimals a timestamp may have: integer ticks of the resolution, never finer. */
  readonly decimals: number;
  /** Ticks (of the resolution) per microsecond of the output column. */
  readonly ticksPerUs: number;
  /**
   * The largest tick count accepted. Microsecond ticks stay exact in float64 up to 2^53;
   * nanosecond times are stored as ticks / 1000 µs, which round-trips through
   * Math.round(t * 1000) only up to 2^52 ns (about 52 days).
   */
  readonly tickLimit: number;
}

const US_LIMIT = Number.MAX_SAFE_INTEGER;
const NS_LIMIT = 2 ** 52;

export const TIME_UNITS: Readonly<Record<TextTimeUnit, TimeUnitRule>> = {
  us: { resolution: 'us', decimals: 0, ticksPerUs: 1, tickLimit: US_LIMIT },
  ms: { resolution: 'us', decimals: 3, ticksPerUs: 1, tickLimit: US_LIMIT },
  ns: { resolution: 'ns', decimals: 0, ticksPerUs: 1000, tickLimit: NS_LIMIT },
  s: { resolution: 'ns', decimals: 9, ticksPerUs: 1000, tickLimit: NS_LIMIT },
};

export const isTextTimeUnit = (value: unknown): value is TextTimeUnit => typeof value === 'string' && Object.hasOwn(TIME_UNITS, value);

/** Ticks of a unit's resolution written back in the unit itself, exactly ("1.5" for 1500000000 ns in s). */
export function formatTicks(ticks: number, unit: TextTimeUnit): string {
  const shift = { us: 0, ns: 0, ms: 3, s: 9 }[unit];
  if (shift === 0) return String(ticks);
  const digits = String(ticks).padStart(shift + 1, '0');
  const whole = digits.slice(0, -shift);
  const fraction = digits.slice(-shift).replace(/0+$/, '');
  return fraction ? `${whole}.${fraction}` : whole;
}
