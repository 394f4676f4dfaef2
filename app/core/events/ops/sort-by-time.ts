import { allocateBatch, type EventBatch } from '../event-batch';

/** Which 32-bit half of a float64 holds the sign and exponent on this machine. */
const HIGH_WORD = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1 ? 1 : 0;
const LOW_WORD = 1 - HIGH_WORD;
const RADIX_BITS = 8;
const BUCKETS = 1 << RADIX_BITS;
/** Digits per float64, half of them in each 32-bit word. */
const DIGITS = 64 / RADIX_BITS;
const WORD_DIGITS = DIGITS / 2;

/**
 * A new batch with the events in time order; events with equal timestamps keep their order
 * in the input (stable), as `--sort` promises. NaN timestamps are refused (RangeError); -0 and
 * +0 are the same time. An already ordered batch is copied as it is.
 */
export function sortByTime(batch: EventBatch): EventBatch {
  const { t } = batch;
  let ordered = true;
  for (let i = 0; i < t.length; i++) {
    if (Number.isNaN(t[i]!)) throw new RangeError(`batch.t[${i}] is NaN; events need a timestamp to be sorted`);
    if (i > 0 && t[i]! < t[i - 1]!) ordered = false;
  }
  const out = allocateBatch(t.length);
  if (ordered) {
    out.t.set(t);
    out.x.set(batch.x);
    out.y.set(batch.y);
    out.p.set(batch.p);
    return out;
  }
  const order = stableTimeOrder(t);
  for (let i = 0; i < order.length; i++) {
    const k = order[i]!;
    out.t[i] = t[k]!;
    out.x[i] = batch.x[k]!;
    out.y[i] = batch.y[k]!;
    out.p[i] = batch.p[k]!;
  }
  return out;
}

/**
 * The permutation that orders t, by least-significant-digit radix sort on the float64 bit
 * patterns (common practice, no source): each pass is a stable counting sort on one digit, so
 * ties keep their input order. Flipping the sign bit of non-negative values and every bit of
 * negative ones makes the unsigned order of the patterns the numeric order. Passes whose
 * digit is the same for every event (most of the exponent and high mantissa of a recording's
 * timestamps) are skipped.
 */
function stableTimeOrder(t: Float64Array): Uint32Array {
  const n = t.length;
  const words = new Uint32Array(t.buffer, t.byteOffset, 2 * n);
  let lo = new Uint32Array(n);
  let hi = new Uint32Array(n);
  let index = new Uint32Array(n);
  const counts = new Uint32Array(DIGITS * BUCKETS);
  for (let i = 0; i < n; i++) {
    let h = words[2 * i + HIGH_WORD]!;
    let l = words[2 * i + LOW_WORD]!;
    if (h === 0x80000000 && l === 0) h = 0; // -0 sorts with +0
    if (h & 0x80000000) {
      h = ~h >>> 0;
      l = ~l >>> 0;
    } else {
      h = (h | 0x80000000) >>> 0;
    }
    hi[i] = h;
    lo[i] = l;
    index[i] = i;
    for (let d = 0; d < WORD_DIGITS; d++) {
      counts[d * BUCKETS + ((l >>> (d * RADIX_BITS)) & (BUCKETS - 1))]!++;
      counts[(d + WORD_DIGITS) * BUCKETS + ((h >>> (d * RADIX_BITS)) & (BUCKETS - 1))]!++;
    }
  }
  let lo2 = new Uint32Array(n);
  let hi2 = new Uint32Array(n);
  let index2 = new Uint32Array(n);
  for (let d = 0; d < DIGITS; d++) {
    const digitCounts = counts.subarray(d * BUCKETS, (d + 1) * BUCKETS);
    if (digitCounts.includes(n)) continue; // one digit value for all: order unchanged
    let start = 0;
    for (let b = 0; b < BUCKETS; b++) {
      const c = digitCounts[b]!;
      digitCounts[b] = start;
      start += c;
    }
    const inLow = d < WORD_DIGITS;
    const source = inLow ? lo : hi;
    const shift = (d % WORD_DIGITS) * RADIX_BITS;
    for (let i = 0; i < n; i++) {
      const slot = digitCounts[(source[i]! >>> shift) & (BUCKETS - 1)]!++;
      if (inLow) lo2[slot] = lo[i]!; // the low words are not read after the low passes
      hi2[slot] = hi[i]!;
      index2[slot] = index[i]!;
    }
    [lo, lo2] = [lo2, lo];
    [hi, hi2] = [hi2, hi];
    [index, index2] = [index2, index];
  }
  return index;
}
