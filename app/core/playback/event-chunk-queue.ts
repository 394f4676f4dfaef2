import { allocateBatch, sliceBatch, type EventBatch } from '../events/event-batch';

/** A clip's events as they travel to the stage: .glev chunk columns, 8 bytes per event. */
export interface CompactEventChunk {
  readonly baseUs: number;
  /** 1 for microsecond files, 1000 for nanosecond files. */
  readonly ticksPerUs: number;
  readonly dt: Uint32Array;
  readonly x: Uint16Array;
  readonly yp: Uint16Array;
}

/**
 * Events waiting to be shown, kept compact until their frame comes: take(untilUs) decodes
 * just the events due by then into one reused batch, so the stage holds the look-ahead at
 * 8 bytes per event and decodes each event once.
 */
export class EventChunkQueue {
  private readonly chunks: CompactEventChunk[] = [];
  private head = 0; // events of chunks[0] already taken
  private scratch: EventBatch;
  private waitingEvents = 0;

  constructor(capacity = 1 << 16) {
    this.scratch = allocateBatch(capacity);
  }

  get waiting(): number {
    return this.waitingEvents;
  }

  /** The time of the last event received, or -Infinity. */
  lastUs(): number {
    const c = this.chunks.at(-1);
    return c ? c.baseUs + c.dt[c.dt.length - 1]! / c.ticksPerUs : -Infinity;
  }

  push(chunk: CompactEventChunk): void {
    if (chunk.dt.length !== chunk.x.length || chunk.dt.length !== chunk.yp.length) throw new RangeError('chunk columns must have the same length');
    if (chunk.dt.length === 0) return;
    this.chunks.push(chunk);
    this.waitingEvents += chunk.dt.length;
  }

  /** Decodes and removes every waiting event with t <= untilUs; the result is valid until the next call. */
  take(untilUs: number): EventBatch {
    let n = 0;
    while (this.chunks.length > 0) {
      const chunk = this.chunks[0]!;
      const { dt, x, yp, baseUs, ticksPerUs } = chunk;
      const limitTicks = (untilUs - baseUs) * ticksPerUs;
      let end = this.head;
      while (end < dt.length && dt[end]! <= limitTicks) end++;
      const count = end - this.head;
      if (count > 0) {
        this.reserve(n + count);
        const { t, x: ox, y: oy, p: op } = this.scratch;
        for (let i = this.head, j = n; i < end; i++, j++) {
          t[j] = baseUs + dt[i]! / ticksPerUs;
          ox[j] = x[i]!;
          const v = yp[i]!;
          oy[j] = v >> 1;
          op[j] = v & 1;
        }
        n += count;
        this.waitingEvents -= count;
      }
      if (end < dt.length) {
        this.head = end;
        break;
      }
      this.chunks.shift();
      this.head = 0;
    }
    return sliceBatch(this.scratch, 0, n);
  }

  clear(): void {
    this.chunks.length = 0;
    this.head = 0;
    this.waitingEvents = 0;
  }

  private reserve(size: number): void {
    if (size <= this.scratch.t.length) return;
    let capacity = this.scratch.t.length;
    while (capacity < size) capacity *= 2;
    const bigger = allocateBatch(capacity);
    bigger.t.set(this.scratch.t);
    bigger.x.set(this.scratch.x);
    bigger.y.set(this.scratch.y);
    bigger.p.set(this.scratch.p);
    this.scratch = bigger;
  }
}
