/**
 * Data loss: invalid over expected samples, in % (Holmqvist, Nyström and Mulvey 2012, ETRA).
 * Samples that never arrived count as invalid, which is why the count is taken against the
 * number expected rather than the number received. More valid samples than expected (a
 * window edge catching one extra sample, a tracker running fast) count as no loss.
 */
export function dataLossPct(valid: number, expected: number): number {
  if (!(Number.isInteger(valid) && valid >= 0)) throw new RangeError(`valid must be an integer >= 0, got ${valid}`);
  if (!(Number.isFinite(expected) && expected > 0)) throw new RangeError(`expected must be a number > 0, got ${expected}`);
  return Math.max(0, ((expected - valid) / expected) * 100);
}

/**
 * Samples a tracker at `rateHz` takes in a window from fromMs to toMs: the duration times
 * the rate, rounded (a closed window on the sample grid holds that many or one more,
 * depending on where the grid falls), and at least 1.
 */
export function expectedSampleCount(fromMs: number, toMs: number, rateHz: number): number {
  if (!(Number.isFinite(rateHz) && rateHz > 0)) throw new RangeError(`rateHz must be a number > 0, got ${rateHz}`);
  if (!(Number.isFinite(fromMs) && Number.isFinite(toMs) && toMs > fromMs)) throw new RangeError(`the window must run forwards, got ${fromMs} to ${toMs} ms`);
  return Math.max(1, Math.round(((toMs - fromMs) / 1000) * rateHz));
}
