import { lowerBound, sliceBatch, type EventBatch } from '../event-batch';

/**
 * The events of a time-ordered batch with fromUs <= t < toUs (half-open, so consecutive ranges
 * [a, b) and [b, c) split a stream without losing or repeating an event). Timestamps stay
 * absolute: a trimmed clip keeps the times of the recording it came from.
 *
 * Stateless, so a stream is trimmed batch by batch with the same range. Either end may be
 * infinite (an open end); NaN is refused. The result is a view sharing the batch's memory.
 */
export function trimToTimeRange(batch: EventBatch, fromUs: number, toUs: number): EventBatch {
  if (Number.isNaN(fromUs)) throw new RangeError('fromUs must be a number, got NaN');
  if (Number.isNaN(toUs)) throw new RangeError('toUs must be a number, got NaN');
  if (toUs < fromUs) throw new RangeError(`toUs (${toUs}) must not be earlier than fromUs (${fromUs})`);
  const start = lowerBound(batch.t, fromUs);
  const end = lowerBound(batch.t, toUs, start);
  return sliceBatch(batch, start, end);
}
