import { allocateBatch, type EventBatch } from '../event-batch';

/** A new batch holding the events i with keep[i] = 1, in their order; `kept` is how many there are. */
export function selectEvents(batch: EventBatch, keep: Uint8Array, kept: number): EventBatch {
  const out = allocateBatch(kept);
  const { t, x, y, p } = batch;
  let j = 0;
  for (let i = 0; i < t.length; i++) {
    if (keep[i] === 0) continue;
    out.t[j] = t[i]!;
    out.x[j] = x[i]!;
    out.y[j] = y[i]!;
    out.p[j] = p[i]!;
    j++;
  }
  return out;
}

/** A reusable 0/1 mask with room for at least `length` events (grows, never shrinks). */
export function maskWithRoom(mask: Uint8Array, length: number): Uint8Array {
  return mask.length >= length ? mask : new Uint8Array(Math.max(length, 2 * mask.length));
}
