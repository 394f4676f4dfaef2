import type { EventBatch, SensorSize } from '../event-batch';
import { checkEventsInSensor, validateSensorSize } from '../ops/sensor-bounds';
import type { EventStats } from './event-stats';
import { findHotPixels } from './hot-pixels';
import { rateSeriesFromMsBins } from './rate-series';

const US_PER_MS = 1000;
/** A count in one 1 ms bin, as a rate in Hz. */
const MS_BINS_PER_S = 1000;

/**
 * Statistics of a stream read batch by batch (batches in time order, as a file is decoded):
 * push(batch) for each, finish() for the EventStats (see there for every definition and the
 * empty and zero-duration policies). Memory is one Uint32 per pixel plus one per millisecond
 * of stream, grown as time goes on. finish() does not change the state, so it can report a
 * stream in progress; reset() starts a new stream.
 */
export class EventStatsAccumulator {
  private readonly sensor: SensorSize;
  private readonly pixelCounts: Uint32Array;
  /** Events per 1 ms bin; bin i covers [tStart + i ms, tStart + (i + 1) ms). */
  private msCounts = new Uint32Array(1024);
  private msBinsUsed = 0;
  private count = 0;
  private onCount = 0;
  private tStartUs = 0;
  private tEndUs = 0;

  constructor(sensor: SensorSize) {
    validateSensorSize(sensor);
    this.sensor = { width: sensor.width, height: sensor.height };
    this.pixelCounts = new Uint32Array(sensor.width * sensor.height);
  }

  /** Adds a batch. Throws RangeError, before counting anything, for events outside the sensor, out of time order, with a NaN or infinite timestamp, or with a polarity other than 0 and 1. */
  push(batch: EventBatch): void {
    const n = batch.t.length;
    if (n === 0) return;
    this.check(batch);
    const { t, x, y, p } = batch;
    if (this.count === 0) this.tStartUs = t[0]!;
    const t0 = this.tStartUs;
    const binsNeeded = Math.floor((t[n - 1]! - t0) / US_PER_MS) + 1;
    this.growBins(binsNeeded);
    const bins = this.msCounts;
    const pixels = this.pixelCounts;
    const width = this.sensor.width;
    let on = 0;
    for (let i = 0; i < n; i++) {
      bins[Math.floor((t[i]! - t0) / US_PER_MS)]!++;
      pixels[y[i]! * width + x[i]!]!++;
      on += p[i]!;
    }
    this.count += n;
    this.onCount += on;
    this.tEndUs = t[n - 1]!;
    this.msBinsUsed = Math.max(this.msBinsUsed, binsNeeded);
  }

  finish(): EventStats {
    const empty = this.count === 0;
    const durationS = empty ? 0 : (this.tEndUs - this.tStartUs) / 1e6;
    let peak = 0;
    for (let i = 0; i < this.msBinsUsed; i++) peak = Math.max(peak, this.msCounts[i]!);
    return {
      count: this.count,
      t_start_us: empty ? null : this.tStartUs,
      t_end_us: empty ? null : this.tEndUs,
      duration_s: durationS,
      width: this.sensor.width,
      height: this.sensor.height,
      on_count: this.onCount,
      off_count: this.count - this.onCount,
      mean_rate_hz: durationS > 0 ? this.count / durationS : null,
      peak_rate_hz: peak * MS_BINS_PER_S,
      rate_series: rateSeriesFromMsBins(this.msCounts, this.msBinsUsed),
      hot_pixels: findHotPixels(this.pixelCounts, this.sensor.width),
    };
  }

  reset(): void {
    this.pixelCounts.fill(0);
    this.msCounts.fill(0);
    this.msBinsUsed = 0;
    this.count = 0;
    this.onCount = 0;
    this.tStartUs = 0;
    this.tEndUs = 0;
  }

  private check(batch: EventBatch): void {
    checkEventsInSensor(batch, this.sensor);
    const { t, p } = batch;
    let previous = this.count === 0 ? -Infinity : this.tEndUs;
    for (let i = 0; i < t.length; i++) {
      const ti = t[i]!;
      if (!Number.isFinite(ti)) throw new RangeError(`batch.t[${i}] must be a finite timestamp, got ${ti}`);
      if (ti < previous) throw new RangeError(`batch.t[${i}] = ${ti} is earlier than the event before it (${previous}); events must be in time order`);
      if (p[i]! > 1) throw new RangeError(`batch.p[${i}] must be 0 (OFF) or 1 (ON), got ${p[i]}`);
      previous = ti;
    }
  }

  private growBins(needed: number): void {
    if (needed <= this.msCounts.length) return;
    const grown = new Uint32Array(Math.max(needed, 2 * this.msCounts.length));
    grown.set(this.msCounts);
    this.msCounts = grown;
  }
}
