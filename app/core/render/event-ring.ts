import type { EventBatch, SensorSize } from '../events/event-batch';

const INITIAL_CAPACITY = 1 << 16;
/** Ring indices are combined with `& mask`, which works on 31-bit integers. */
const MAX_CAPACITY = 1 << 30;

/**
 * The renderer's events in time order, oldest first, in a ring buffer: first the events a
 * look has already applied but still needs (the grey look removes them again when they
 * leave its window), then the pending ones, pushed ahead of the time they are due.
 * Each event is kept as its time and one code, pixel * 2 + polarity, with
 * pixel = y * width + x. The ring doubles when full, so after warm-up push allocates nothing.
 */
export class EventRing {
  t = new Float64Array(INITIAL_CAPACITY);
  code = new Uint32Array(INITIAL_CAPACITY);
  mask = INITIAL_CAPACITY - 1;
  /** Ring index of the oldest event held. */
  first = 0;
  /** Events held, applied and pending. */
  size = 0;
  /** How many of the held events, from the oldest, a look has applied. */
  applied = 0;
  private lastT = -Infinity;

  constructor(private readonly sensor: SensorSize) {}

  clear(): void {
    this.first = 0;
    this.size = 0;
    this.applied = 0;
    this.lastT = -Infinity;
  }

  /**
   * Appends events after checking time order (also against earlier pushes), coordinates
   * and polarity. A batch that fails changes nothing: its events are written past the end
   * but not counted.
   */
  push(batch: EventBatch): void {
    const n = batch.t.length;
    if (batch.x.length !== n || batch.y.length !== n || batch.p.length !== n) {
      throw new RangeError(`batch columns must have equal lengths, got t ${n}, x ${batch.x.length}, y ${batch.y.length}, p ${batch.p.length}`);
    }
    if (n === 0) return;
    if (this.size + n > this.mask + 1) this.grow(this.size + n);
    const failed = copyEvents(batch, this.sensor.width, this.sensor.height, this.lastT, this.t, this.code, this.mask, this.first + this.size);
    // Monotone times between two finite ends are all finite.
    if (failed || !Number.isFinite(batch.t[0]!) || !Number.isFinite(batch.t[n - 1]!)) this.reject(batch);
    this.lastT = batch.t[n - 1]!;
    this.size += n;
  }

  /** Names the first event of a batch that failed the checks. */
  private reject(batch: EventBatch): never {
    const { width, height } = this.sensor;
    let previous = this.lastT;
    for (let i = 0; i < batch.t.length; i++) {
      const t = batch.t[i]!;
      if (!Number.isFinite(t) || t < previous) throw new RangeError(`batch.t[${i}] = ${t} must be finite and not earlier than the event before it (${previous})`);
      if (batch.x[i]! >= width || batch.y[i]! >= height) throw new RangeError(`batch event ${i} at (${batch.x[i]}, ${batch.y[i]}) is outside the ${width}x${height} sensor`);
      if (batch.p[i]! > 1) throw new RangeError(`batch.p[${i}] = ${batch.p[i]} must be 0 (OFF) or 1 (ON)`);
      previous = t;
    }
    throw new Error('EventRing.reject found no bad event');
  }

  private grow(needed: number): void {
    let capacity = this.mask + 1;
    while (capacity < needed) capacity *= 2;
    if (capacity > MAX_CAPACITY) throw new RangeError(`cannot hold ${needed} events before rendering (at most ${MAX_CAPACITY}); render or reset() first`);
    const t = new Float64Array(capacity);
    const code = new Uint32Array(capacity);
    for (let k = 0; k < this.size; k++) {
      const j = (this.first + k) & this.mask;
      t[k] = this.t[j]!;
      code[k] = this.code[j]!;
    }
    this.t = t;
    this.code = code;
    this.mask = capacity - 1;
    this.first = 0;
  }
}

/**
 * Copies a batch into the ring from index `at` on and reports whether any event was out
 * of order, off the sensor or not a polarity. The checks are summed without branches:
 * at tens of millions of events a second, mispredicted branches cost more than the copy.
 */
function copyEvents(batch: EventBatch, width: number, height: number, previous: number, ringT: Float64Array, ringCode: Uint32Array, mask: number, at: number): boolean {
  const { t, x, y, p } = batch;
  let bad = 0;
  for (let i = 0, j = at; i < t.length; i++, j++) {
    const ti = t[i]!;
    const xi = x[i]!;
    const yi = y[i]!;
    const pi = p[i]!;
    bad |= Number(!(ti >= previous)) | Number(xi >= width) | Number(yi >= height) | (pi >> 1);
    ringT[j & mask] = ti;
    ringCode[j & mask] = (yi * width + xi) * 2 + pi;
    previous = ti;
  }
  return bad !== 0;
}
