import type { SensorSize } from '../../core/events/event-batch';
import type { CompactEventChunk } from '../../core/playback/event-chunk-queue';
import { Xoshiro128 } from '../../core/random/xoshiro128';
import type { ChunkSource } from './chunk-source';

export interface TestPatternOptions {
  readonly sensor: SensorSize;
  readonly eventsPerSecond: number;
  readonly durationS: number;
  readonly seed?: number;
}

const CHUNK_EVENTS = 65_536;

/**
 * A stage capacity test: a vertical band sweeping across the sensor at a chosen event
 * rate, with ON events on its leading edge and OFF on its trailing edge, generated chunk by
 * chunk as playback needs it (never held whole), so a display machine can be checked at
 * 1 to 50 million events per second without a file of that size. Events are uniform in time.
 */
export class TestPatternSource implements ChunkSource {
  readonly name: string;
  readonly sensor: SensorSize;
  readonly resolution = 'us' as const;
  readonly eventCount: number;
  readonly tStartUs = 0;
  readonly tEndUs: number;
  readonly chunkCount: number;
  /** Random rows, polarities and column jitter, drawn once and reused so generation keeps up with 50 M events/s. */
  private readonly rows: Uint16Array;
  private readonly on: Uint8Array;
  private readonly jitter: Uint8Array;

  constructor(private readonly options: TestPatternOptions) {
    const { sensor, eventsPerSecond, durationS } = options;
    if (!(eventsPerSecond >= 1 && eventsPerSecond <= 1e9)) throw new RangeError(`eventsPerSecond must be from 1 to 1e9, got ${eventsPerSecond}`);
    if (!(durationS > 0 && durationS <= 3600)) throw new RangeError(`durationS must be from 0 to 3600 s, got ${durationS}`);
    this.sensor = sensor;
    this.eventCount = Math.round(eventsPerSecond * durationS);
    this.tEndUs = Math.floor((this.eventCount - 1) * (1e6 / eventsPerSecond));
    this.chunkCount = Math.ceil(this.eventCount / CHUNK_EVENTS);
    this.name = `test pattern, ${(eventsPerSecond / 1e6).toLocaleString('en-GB')} M events/s on ${sensor.width}x${sensor.height}`;
    const rng = new Xoshiro128(options.seed ?? 1);
    this.rows = new Uint16Array(CHUNK_EVENTS);
    this.on = new Uint8Array(CHUNK_EVENTS);
    this.jitter = new Uint8Array(CHUNK_EVENTS);
    for (let i = 0; i < CHUNK_EVENTS; i++) {
      const r = rng.nextUint32();
      this.on[i] = r & 1;
      this.jitter[i] = (r >>> 1) % 3;
      this.rows[i] = (r >>> 3) % sensor.height;
    }
  }

  chunkStartUs(k: number): number {
    return Math.floor(k * CHUNK_EVENTS * (1e6 / this.options.eventsPerSecond)); // the same arithmetic as each event's time
  }

  async read(k: number): Promise<CompactEventChunk> {
    if (!(k >= 0 && k < this.chunkCount)) throw new RangeError(`chunk ${k} does not exist (the pattern has ${this.chunkCount})`);
    const first = k * CHUNK_EVENTS;
    const n = Math.min(CHUNK_EVENTS, this.eventCount - first);
    const { width } = this.sensor;
    const usPerEvent = 1e6 / this.options.eventsPerSecond;
    const baseUs = this.chunkStartUs(k);
    const dt = new Uint32Array(n);
    const x = new Uint16Array(n);
    const yp = new Uint16Array(n);
    const band = Math.max(2, Math.round(width / 16));
    const { rows, on, jitter } = this;
    for (let i = 0; i < n; i++) {
      const tUs = Math.floor((first + i) * usPerEvent);
      dt[i] = tUs - baseUs;
      const edge = Math.floor(tUs * width * 5e-7) % width; // one sweep every 2 s
      x[i] = (edge + (on[i] ? 0 : width - band) + jitter[i]!) % width;
      yp[i] = (rows[i]! << 1) | on[i]!;
    }
    return { baseUs, ticksPerUs: 1, dt, x, yp };
  }

  async close(): Promise<void> {}
}
