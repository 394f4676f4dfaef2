/**
 * Events as four typed columns of equal length, in time order:
 *   t  absolute timestamp in microseconds (float64; integral for microsecond sources,
 *      fractional for nanosecond sources, which stay exact to the nanosecond up to ~52 days)
 *   x  column, 0 = left;  y  row, 0 = top (sensor pixels)
 *   p  polarity, OFF = 0, ON = 1
 */
export interface EventBatch {
  readonly t: Float64Array;
  readonly x: Uint16Array;
  readonly y: Uint16Array;
  readonly p: Uint8Array;
}

export interface SensorSize {
  readonly width: number;
  readonly height: number;
}

/** The finest time step a stream's source can express; decides the .glev time unit. */
export type TimeResolution = 'us' | 'ns';

export const OFF = 0;
export const ON = 1;

export function emptyBatch(): EventBatch {
  return { t: new Float64Array(0), x: new Uint16Array(0), y: new Uint16Array(0), p: new Uint8Array(0) };
}

export function allocateBatch(length: number): EventBatch {
  return { t: new Float64Array(length), x: new Uint16Array(length), y: new Uint16Array(length), p: new Uint8Array(length) };
}

export const batchLength = (batch: EventBatch): number => batch.t.length;

/** A view of events [start, end) sharing the batch's memory. */
export function sliceBatch(batch: EventBatch, start: number, end: number): EventBatch {
  return { t: batch.t.subarray(start, end), x: batch.x.subarray(start, end), y: batch.y.subarray(start, end), p: batch.p.subarray(start, end) };
}

export function concatBatches(batches: readonly EventBatch[]): EventBatch {
  if (batches.length === 1) return batches[0]!;
  const total = batches.reduce((sum, b) => sum + b.t.length, 0);
  const out = allocateBatch(total);
  let offset = 0;
  for (const b of batches) {
    out.t.set(b.t, offset);
    out.x.set(b.x, offset);
    out.y.set(b.y, offset);
    out.p.set(b.p, offset);
    offset += b.t.length;
  }
  return out;
}

/** Builds a batch from plain arrays (tests, small fixtures). */
export function batchFrom(events: ReadonlyArray<readonly [t: number, x: number, y: number, p: number]>): EventBatch {
  const out = allocateBatch(events.length);
  events.forEach(([t, x, y, p], i) => {
    out.t[i] = t;
    out.x[i] = x;
    out.y[i] = y;
    out.p[i] = p;
  });
  return out;
}

/** Index of the first event with t >= time (binary search; events are in time order). */
export function lowerBound(t: Float64Array, time: number, from = 0, to = t.length): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid]! < time) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
