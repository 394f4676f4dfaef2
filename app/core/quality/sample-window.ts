/** A gaze sample on the host clock: screen pixels (origin top-left, y down) and whether it is valid. */
export interface TimedSample {
  readonly hostNs: number;
  readonly x: number;
  readonly y: number;
  readonly valid: boolean;
}

/** The default window after a target's onset, ms (common practice, no source). */
export const DEFAULT_WINDOW_MS = { fromMs: 300, toMs: 1300 } as const;

/**
 * The samples taken from fromMs to toMs after the target's onset, both ends included, in
 * the order given: the stretch where the eye has reached the target and settled.
 */
export function samplesInWindow(samples: readonly TimedSample[], onsetNs: number, fromMs: number = DEFAULT_WINDOW_MS.fromMs, toMs: number = DEFAULT_WINDOW_MS.toMs): TimedSample[] {
  if (!Number.isFinite(onsetNs)) throw new RangeError(`onsetNs must be finite, got ${onsetNs}`);
  if (!(Number.isFinite(fromMs) && Number.isFinite(toMs) && fromMs >= 0 && toMs > fromMs)) {
    throw new RangeError(`the window must satisfy 0 <= fromMs < toMs, got fromMs ${fromMs}, toMs ${toMs}`);
  }
  const start = onsetNs + fromMs * 1e6;
  const end = onsetNs + toMs * 1e6;
  return samples.filter((s) => s.hostNs >= start && s.hostNs <= end);
}
