import { crc32 } from '../../checksum/crc32';
import type { EventBatch, SensorSize, TimeResolution } from '../event-batch';
import { encodeIndex, type ChunkEntry } from './chunk-index';
import { encodeHeader } from './header';
import { CHUNK_HEAD_BYTES, chunkByteLength, HEADER_BYTES, MAX_CHUNK_EVENTS, MAX_CHUNK_SPAN_TICKS, MAX_HEIGHT, MAX_TICKS, MAX_WIDTH, writeU64 } from './layout';
import { ticksFromUs } from './ticks';

export interface GlevWriterOptions {
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
  /** Events per chunk, 1..65536 (default 65536); smaller chunks make seeking read less. */
  readonly chunkEvents?: number;
}

function checkInteger(name: string, value: number, min: number, max: number, why = ''): void {
  if (!Number.isInteger(value) || value < min || value > max) throw new RangeError(`${name} must be an integer in ${min}..${max}${why}, got ${value}`);
}

/**
 * Writes a .glev file as a stream: the sink receives the file's bytes in order, starting
 * with a blank header (zeros, which no reader accepts) as a placeholder. finish() writes
 * the index through the sink and returns the real header, which the caller writes over
 * the placeholder at offset 0. The sink may keep the arrays it is given.
 *
 * Events must be in time order across pushes, on the sensor, and their times exactly
 * representable in the chosen resolution; anything else is a RangeError naming the event
 * (counted from the first event pushed). Events before a rejected one stay written.
 */
export class GlevWriter {
  private readonly resolution: TimeResolution;
  private readonly sensor: SensorSize;
  private readonly dt: Uint32Array;
  private readonly x: Uint16Array;
  private readonly yp: Uint16Array;
  private readonly entries: ChunkEntry[] = [];
  private filled = 0;
  private chunkFirstTick = 0;
  private lastTick = 0;
  private lastUs = 0;
  private events = 0;
  private offset = HEADER_BYTES;
  private finished = false;

  constructor(
    options: GlevWriterOptions,
    private readonly sink: (bytes: Uint8Array) => void,
  ) {
    const { sensor, resolution, chunkEvents = MAX_CHUNK_EVENTS } = options;
    checkInteger('sensor.width', sensor.width, 1, MAX_WIDTH, ' (x is stored in 16 bits)');
    checkInteger('sensor.height', sensor.height, 1, MAX_HEIGHT, ' (y is stored in 15 bits beside the polarity)');
    if (resolution !== 'us' && resolution !== 'ns') throw new RangeError(`resolution must be 'us' or 'ns', got ${String(resolution)}`);
    checkInteger('chunkEvents', chunkEvents, 1, MAX_CHUNK_EVENTS);
    this.sensor = { width: sensor.width, height: sensor.height };
    this.resolution = resolution;
    this.dt = new Uint32Array(chunkEvents);
    this.x = new Uint16Array(chunkEvents);
    this.yp = new Uint16Array(chunkEvents);
    sink(new Uint8Array(HEADER_BYTES));
  }

  get eventCount(): number {
    return this.events;
  }

  get chunkCount(): number {
    return this.entries.length;
  }

  /** Bytes given to the sink so far, the placeholder header included. */
  get bytesWritten(): number {
    return this.offset;
  }

  push(batch: EventBatch): void {
    if (this.finished) throw new Error('GlevWriter.push after finish()');
    const { t, x, y, p } = batch;
    const n = t.length;
    if (x.length !== n || y.length !== n || p.length !== n) {
      throw new RangeError(`batch columns must have equal lengths, got t ${n}, x ${x.length}, y ${y.length}, p ${p.length}`);
    }
    const { width, height } = this.sensor;
    const capacity = this.dt.length;
    for (let i = 0; i < n; i++) {
      const tUs = t[i]!;
      const tick = ticksFromUs(tUs, this.resolution);
      if (Number.isNaN(tick)) throw new RangeError(`event ${this.events}: ${this.describeBadTime(tUs)}`);
      if (tick < this.lastTick) {
        throw new RangeError(`event ${this.events}: t = ${tUs} µs is earlier than ${this.lastUs} µs of event ${this.events - 1}; events must be in time order`);
      }
      const xi = x[i]!;
      const yi = y[i]!;
      const pi = p[i]!;
      if (xi >= width) throw new RangeError(`event ${this.events}: x = ${xi} is outside the sensor width ${width} (0..${width - 1}; at most 65535)`);
      if (yi >= height) throw new RangeError(`event ${this.events}: y = ${yi} is outside the sensor height ${height} (0..${height - 1}; at most 32767)`);
      if (pi > 1) throw new RangeError(`event ${this.events}: polarity ${pi} is neither 0 (OFF) nor 1 (ON)`);
      if (this.filled === capacity || (this.filled > 0 && tick - this.chunkFirstTick > MAX_CHUNK_SPAN_TICKS)) this.flushChunk();
      if (this.filled === 0) this.chunkFirstTick = tick;
      const j = this.filled++;
      this.dt[j] = tick - this.chunkFirstTick;
      this.x[j] = xi;
      this.yp[j] = (yi << 1) | pi;
      this.lastTick = tick;
      this.lastUs = tUs;
      this.events++;
    }
  }

  /** Writes the last chunk and the index through the sink; returns the header for offset 0. */
  finish(): Uint8Array {
    if (this.finished) throw new Error('GlevWriter.finish() called twice');
    if (this.filled > 0) this.flushChunk();
    this.finished = true;
    const indexOffset = this.offset;
    const index = encodeIndex(this.entries);
    this.offset += index.length;
    this.sink(index);
    return encodeHeader({ sensor: this.sensor, resolution: this.resolution, eventCount: this.events, chunkCount: this.entries.length, indexOffset });
  }

  private describeBadTime(tUs: number): string {
    if (!(tUs >= 0) || !Number.isFinite(tUs)) return `t = ${tUs} µs is not a finite time >= 0`;
    const maxUs = this.resolution === 'ns' ? MAX_TICKS.ns / 1000 : MAX_TICKS.us;
    if (tUs > maxUs) return `t = ${tUs} µs is beyond ${maxUs} µs, the latest time a ${this.resolution} file holds exactly`;
    return this.resolution === 'us'
      ? `t = ${tUs} µs is not a whole number of microseconds (write it with resolution 'ns', or round it)`
      : `t = ${tUs} µs is not a whole number of nanoseconds`;
  }

  private flushChunk(): void {
    const n = this.filled;
    const bytes = new Uint8Array(chunkByteLength(n));
    const view = new DataView(bytes.buffer);
    writeU64(view, 0, this.chunkFirstTick);
    view.setUint32(8, n, true);
    bytes.set(new Uint8Array(this.dt.buffer, 0, 4 * n), CHUNK_HEAD_BYTES);
    bytes.set(new Uint8Array(this.x.buffer, 0, 2 * n), CHUNK_HEAD_BYTES + 4 * n);
    bytes.set(new Uint8Array(this.yp.buffer, 0, 2 * n), CHUNK_HEAD_BYTES + 6 * n);
    const crcAt = CHUNK_HEAD_BYTES + 8 * n;
    view.setUint32(crcAt, crc32(bytes.subarray(0, crcAt)), true);
    this.entries.push({ firstTick: this.chunkFirstTick, lastTick: this.lastTick, byteOffset: this.offset, count: n, firstEvent: this.events - n });
    this.offset += bytes.length;
    this.filled = 0;
    this.sink(bytes);
  }
}
