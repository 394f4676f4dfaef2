import { allocateBatch, type EventBatch, type SensorSize } from '../../app/core/events/event-batch';
import { Xoshiro128 } from '../../app/core/random/xoshiro128';
import { EventImageRenderer } from '../../app/core/render/event-image-renderer';
import type { LookName } from '../../app/core/render/look-settings';
import { DEFAULT_FRAME_INTERVAL_US } from '../../app/core/render/render-defaults';
import { duration, type Benchmark, type BenchEntry } from './harness';

// The stage's load: 20 M events/s shown at 60 Hz, i.e. 333,333 events pushed and one image
// rendered per frame. Pixels are scattered uniformly, the worst case for the caches.
const EVENTS_PER_FRAME = 333_333;
const WARM_UP_FRAMES = 30;
const MEASURED_FRAMES = 600;
const POOL_FRAMES = 16;
const SENSORS: readonly (SensorSize & { label: string })[] = [
  { label: '640x480', width: 640, height: 480 },
  { label: '1280x720', width: 1280, height: 720 },
];
const LOOKS: readonly LookName[] = ['polarity', 'decay', 'grey'];

/** Event positions for a few frames, reused round robin; their times are set per frame. */
function framePool(sensor: SensorSize): EventBatch[] {
  const random = new Xoshiro128(2024);
  return Array.from({ length: POOL_FRAMES }, () => {
    const batch = allocateBatch(EVENTS_PER_FRAME);
    for (let i = 0; i < EVENTS_PER_FRAME; i++) {
      batch.x[i] = random.nextInt(sensor.width);
      batch.y[i] = random.nextInt(sensor.height);
      batch.p[i] = random.nextInt(2);
    }
    return batch;
  });
}

/** Milliseconds per frame of `frame(f)` over the measured frames; `prepare(f)` runs untimed before each. */
function timeFrames(prepare: (f: number) => void, frame: (f: number) => void): Float64Array {
  const times = new Float64Array(MEASURED_FRAMES);
  for (let f = 0; f < WARM_UP_FRAMES + MEASURED_FRAMES; f++) {
    prepare(f);
    const start = process.hrtime.bigint();
    frame(f);
    const elapsed = Number(process.hrtime.bigint() - start) / 1e6;
    if (f >= WARM_UP_FRAMES) times[f - WARM_UP_FRAMES] = elapsed;
  }
  return times.sort();
}

const percentile = (sorted: Float64Array, q: number): number => sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)]!;

export const benchmark: Benchmark = {
  name: 'event image renderer: push + render per 60 Hz frame at 20 M events/s',
  async run(log) {
    const entries: BenchEntry[] = [];
    for (const sensor of SENSORS) {
      const pool = framePool(sensor);
      const rgba = new Uint8ClampedArray(sensor.width * sensor.height * 4);
      // Peer: copying an image of the same size, the memory traffic a render cannot avoid.
      const source = new Uint8ClampedArray(rgba.length).fill(77);
      const copy = timeFrames(() => undefined, () => rgba.set(source));
      const peer = { p50: percentile(copy, 0.5), p99: percentile(copy, 0.99) };
      log(`${sensor.label} image copy: p50 ${peer.p50.toFixed(3)} ms, p99 ${peer.p99.toFixed(3)} ms`);
      for (const look of LOOKS) {
        const renderer = new EventImageRenderer(sensor, { look });
        // Frame f's events fall evenly in (f, f + 1] frame intervals; set untimed.
        const stamp = (f: number): void => {
          const t = pool[f % POOL_FRAMES]!.t;
          for (let i = 0; i < t.length; i++) t[i] = (f + (i + 1) / EVENTS_PER_FRAME) * DEFAULT_FRAME_INTERVAL_US;
        };
        const times = timeFrames(stamp, (f) => {
          renderer.push(pool[f % POOL_FRAMES]!);
          renderer.render((f + 1) * DEFAULT_FRAME_INTERVAL_US, rgba);
        });
        const p50 = percentile(times, 0.5);
        const p99 = percentile(times, 0.99);
        log(`${sensor.label} ${look}: p50 ${p50.toFixed(3)} ms, p99 ${p99.toFixed(3)} ms per frame`);
        entries.push(
          duration(`render ${look} ${sensor.label}, 333k events/frame, p50`, p50, 'ms/frame', { name: `copy of a ${sensor.label} rgba image, p50`, value: peer.p50 }),
          duration(`render ${look} ${sensor.label}, 333k events/frame, p99`, p99, 'ms/frame', { name: `copy of a ${sensor.label} rgba image, p99`, value: peer.p99 }),
        );
      }
    }
    return entries;
  },
};
