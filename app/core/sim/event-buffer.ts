import { allocateBatch, type EventBatch } from '../events/event-batch';

/** A growable set of event columns that the simulator appends to in time order. */
export class EventBuffer {
  private batch: EventBatch = allocateBatch(4096);
  private count = 0;

  push(tUs: number, x: number, y: number, p: number): void {
    if (this.count === this.batch.t.length) this.grow();
    const i = this.count++;
    this.batch.t[i] = tUs;
    this.batch.x[i] = x;
    this.batch.y[i] = y;
    this.batch.p[i] = p;
  }

  /** The events pushed so far, as a batch of their own; the buffer starts again empty. */
  take(): EventBatch {
    const n = this.count;
    const out = allocateBatch(n);
    out.t.set(this.batch.t.subarray(0, n));
    out.x.set(this.batch.x.subarray(0, n));
    out.y.set(this.batch.y.subarray(0, n));
    out.p.set(this.batch.p.subarray(0, n));
    this.count = 0;
    return out;
  }

  private grow(): void {
    const bigger = allocateBatch(this.batch.t.length * 2);
    bigger.t.set(this.batch.t);
    bigger.x.set(this.batch.x);
    bigger.y.set(this.batch.y);
    bigger.p.set(this.batch.p);
    this.batch = bigger;
  }
}
