import { describe, expect, it } from 'vitest';
import { concatBatches, type EventBatch } from '../../../../app/core/events/event-batch';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { DvsPixelModel } from '../../../../app/core/sim/dvs-pixel-model';
import { EventBuffer } from '../../../../app/core/sim/event-buffer';
import { toLogIntensity } from '../../../../app/core/sim/log-intensity';
import {
  flashingParts,
  formatTracksTsv,
  simulateEvents,
  TRACKS_TSV_HEADER,
  type SimulationOptions,
  type SimulationSlice,
  type TrackRow,
} from '../../../../app/core/sim/simulate';
import { WarehouseScene } from '../../../../app/core/sim/warehouse-scene';

const sensor = { width: 160, height: 120 };
const run = (options: Partial<SimulationOptions>) => [...simulateEvents({ scene: 'warehouse', sensor, durationS: 0.3, seed: 7, ...options })];
const eventsOf = (slices: SimulationSlice[]): EventBatch => concatBatches(slices.map((s) => s.events));
const tracksOf = (slices: SimulationSlice[]): TrackRow[] => slices.flatMap((s) => s.tracks);
const quiet = { noiseRateHz: 0, hotPixelCount: 0 };

describe('simulateEvents', () => {
  it('is deterministic: the same seed gives identical events and tracks, another seed other events on the same tracks', () => {
    const a = run({});
    const b = run({});
    const c = run({ seed: 8 });
    expect(eventsOf(b)).toEqual(eventsOf(a));
    expect(tracksOf(b)).toEqual(tracksOf(a));
    expect(eventsOf(c)).not.toEqual(eventsOf(a));
    expect(tracksOf(c)).toEqual(tracksOf(a));
  });

  it('yields contiguous 10 ms slices whose events are in time order within and across slices', () => {
    const slices = run({});
    expect(slices.map((s) => [s.tStartUs, s.tEndUs])).toEqual(Array.from({ length: 30 }, (_, k) => [k * 10000, (k + 1) * 10000]));
    for (const s of slices) {
      expect(s.events.t.every((t) => t >= s.tStartUs && t < s.tEndUs && Number.isInteger(t))).toBe(true);
    }
    const e = eventsOf(slices);
    expect(e.t.length).toBeGreaterThan(1000);
    for (let i = 1; i < e.t.length; i++) {
      // Ties keep pixel order (row-major index).
      const order = e.t[i]! - e.t[i - 1]! || e.y[i]! * sensor.width + e.x[i]! - (e.y[i - 1]! * sensor.width + e.x[i - 1]!);
      expect(order).toBeGreaterThanOrEqual(0);
    }
    expect(e.x.every((x) => x < sensor.width) && e.y.every((y) => y < sensor.height)).toBe(true);
    expect(new Set(e.p)).toEqual(new Set([0, 1]));
  });

  it('gives the same events as rendering and checking every pixel of every frame', () => {
    const small = { width: 80, height: 60 };
    const fast = eventsOf([...simulateEvents({ scene: 'warehouse', sensor: small, durationS: 0.1, seed: 3 })]);
    // Brute force: the whole image each millisecond, every pixel through the model.
    const scene = new WarehouseScene(small);
    const model = new DvsPixelModel(small, {}, new Xoshiro128(3));
    const image = new Float32Array(80 * 60);
    const log = new Float32Array(80 * 60);
    const toLog = (tS: number) => {
      scene.render(tS, image);
      image.forEach((v, i) => (log[i] = toLogIntensity(v)));
      return log;
    };
    model.reset(toLog(0));
    const out = new EventBuffer();
    for (let k = 1; k <= 100; k++) model.step(toLog(k / 1000), (k - 1) * 1000, k * 1000, out);
    expect(fast.t.length).toBeGreaterThan(100);
    expect(fast).toEqual(out.take());
  });

  it('writes one track row per object per millisecond, boxes inside the sensor', () => {
    const tracks = tracksOf(run({ durationS: 0.5 }));
    const scene = new WarehouseScene(sensor);
    for (let ms = 0; ms < 500; ms++) {
      const rows = tracks.filter((r) => r.tS === ms / 1000);
      expect(rows).toEqual(scene.objectsAt(ms / 1000));
      expect(new Set(rows.map((r) => r.objectId)).size).toBe(rows.length);
      expect(rows.filter((r) => r.kind !== 'parcel').length).toBe(5);
    }
    expect(tracks.length).toBe(new Set(tracks.map((r) => `${r.tS} ${r.objectId}`)).size);
    expect(tracks.every((r) => r.x0 >= 0 && r.y0 >= 0 && r.x1 <= sensor.width - 1 && r.y1 <= sensor.height - 1)).toBe(true);
  });

  it('puts every event of a noiseless sensor on a tracked object: inside its box at the frame before or after', () => {
    const slices = run({ ...quiet, durationS: 0.5 });
    const e = eventsOf(slices);
    const scene = new WarehouseScene(sensor);
    const boxesAt = new Map<number, TrackRow[]>();
    const around = (ms: number) => {
      if (!boxesAt.has(ms)) boxesAt.set(ms, [...scene.objectsAt(ms / 1000), ...scene.objectsAt((ms + 1) / 1000)]);
      return boxesAt.get(ms)!;
    };
    let onObjects = 0;
    for (let i = 0; i < e.t.length; i++) {
      const boxes = around(Math.floor(e.t[i]! / 1000));
      if (boxes.some((b) => e.x[i]! >= b.x0 - 1 && e.x[i]! <= b.x1 + 1 && e.y[i]! >= b.y0 - 1 && e.y[i]! <= b.y1 + 1)) onObjects++;
    }
    expect(e.t.length).toBeGreaterThan(1000);
    expect(onObjects).toBe(e.t.length);
  });

  it('adds background noise at the configured rate: noise events are the difference from a noiseless run (Poisson counts)', () => {
    // The seed draws the same thresholds either way and the signal uses no random numbers, so the signal events agree.
    const durationS = 1;
    const noisy = eventsOf(run({ durationS, noiseRateHz: 1, hotPixelCount: 0 })).t.length;
    const clean = eventsOf(run({ durationS, ...quiet })).t.length;
    const expected = sensor.width * sensor.height * 1 * durationS;
    expect(Math.abs(noisy - clean - expected)).toBeLessThan(5 * Math.sqrt(expected));
  });

  it('has hot pixels: exactly hotPixelCount pixels fire far more than the rest, nearly all ON', () => {
    const e = eventsOf(run({ durationS: 1, hotPixelCount: 4, hotPixelRateHz: 300 }));
    const on = new Map<number, number>();
    const all = new Map<number, number>();
    e.x.forEach((x, i) => {
      const pixel = e.y[i]! * sensor.width + x;
      all.set(pixel, (all.get(pixel) ?? 0) + 1);
      if (e.p[i]) on.set(pixel, (on.get(pixel) ?? 0) + 1);
    });
    const hot = [...all].filter(([, n]) => n > 150);
    expect(hot.length).toBe(4);
    for (const [pixel, n] of hot) expect(on.get(pixel)! / n).toBeGreaterThan(0.9);
  });

  it('simulates the full 640x480 scene by default', () => {
    const slices = [...simulateEvents({ scene: 'warehouse', durationS: 0.02, seed: 1 })];
    expect(slices.length).toBe(2);
    const e = eventsOf(slices);
    expect(Math.max(...e.x)).toBeGreaterThan(160);
    expect(Math.max(...e.y)).toBeGreaterThan(120);
    expect(slices[0]!.tracks.filter((r) => r.tS === 0).length).toBeGreaterThanOrEqual(8);
  });

  it('shows only the chosen groups, and a lower threshold gives more events', () => {
    const beacon = run({ ...quiet, objects: ['beacon'] });
    expect(tracksOf(beacon).every((r) => r.kind === 'beacon')).toBe(true);
    const box = tracksOf(beacon)[0]!;
    const e = eventsOf(beacon);
    expect(e.t.length).toBeGreaterThan(0);
    expect(e.x.every((x, i) => x >= box.x0 && x <= box.x1 && e.y[i]! >= box.y0 && e.y[i]! <= box.y1)).toBe(true);
    const fine = eventsOf(run({ ...quiet, contrastThreshold: 0.1 })).t.length;
    const coarse = eventsOf(run({ ...quiet, contrastThreshold: 0.3 })).t.length;
    expect(fine).toBeGreaterThan(2 * coarse);
  });

  it('simulates the flickering light: bursts of ON events when it switches on and OFF when it goes out, inside its box', () => {
    const slices = run({ ...quiet, objects: ['flickering-light'], durationS: 0.5 });
    const box = tracksOf(slices)[0]!;
    expect(tracksOf(slices).every((r) => r.kind === 'flickering-light' && r.objectId === 6)).toBe(true);
    const e = eventsOf(slices);
    expect(e.t.length).toBeGreaterThan(0.05 * sensor.width * sensor.height * 8);
    // Switchings at n / 16 s (on for even n), 8 of them up to 0.5 s, each seen between the two frames around it.
    const counts = Array.from({ length: 9 }, () => 0);
    for (let i = 0; i < e.t.length; i++) {
      const n = Math.round(e.t[i]! / 62_500);
      expect(Math.abs(e.t[i]! - n * 62_500)).toBeLessThan(1000);
      expect(e.p[i]).toBe(n % 2 === 0 ? 1 : 0);
      expect(e.x[i]! >= box.x0 && e.x[i]! <= box.x1 && e.y[i]! >= box.y0 && e.y[i]! <= box.y1).toBe(true);
      counts[n]!++;
    }
    expect(counts[0]).toBe(0);
    expect(counts.slice(1).every((c) => c > 0)).toBe(true);
  });

  it('lists the beacon as the scene flashing part', () => {
    expect(flashingParts({ scene: 'warehouse' })).toEqual([expect.objectContaining({ kind: 'beacon', objectId: 5, flashesPerSecond: 1.5 })]);
    expect(flashingParts({ scene: 'warehouse', objects: ['person'] })).toEqual([]);
    expect(flashingParts({ scene: 'warehouse', objects: ['beacon', 'flickering-light'] })).toEqual([
      expect.objectContaining({ kind: 'beacon', objectId: 5, flashesPerSecond: 1.5 }),
      expect.objectContaining({ kind: 'flickering-light', objectId: 6, flashesPerSecond: 8 }),
    ]);
  });

  it('checks its options at once, naming the bad one', () => {
    const bad = (options: Partial<SimulationOptions>) => () => simulateEvents({ scene: 'warehouse', sensor, durationS: 1, seed: 1, ...options });
    expect(bad({ scene: 'harbour' as never })).toThrow(/scene must be 'warehouse'/);
    expect(bad({ durationS: 0 })).toThrow(/durationS/);
    expect(bad({ durationS: 0.0105 })).toThrow(/durationS must be a positive whole number of 1000 µs frames/);
    expect(bad({ internalRateHz: 3000 })).toThrow(/internalRateHz/);
    expect(bad({ sliceS: Number.NaN })).toThrow(/sliceS/);
    expect(bad({ seed: 1.5 })).toThrow(/seed/);
    expect(bad({ contrastThreshold: -0.2 })).toThrow(/contrastThresholdOn/);
    expect(bad({ objects: ['drone' as never] })).toThrow(/objects/);
    expect(bad({ sensor: { width: 70000, height: 10 } })).toThrow(/sensor.width/);
  });

  it('runs at other internal rates and slice lengths, keeping one track row per object per ms', () => {
    const slices = run({ internalRateHz: 2000, sliceS: 0.025, durationS: 0.1 });
    expect(slices.map((s) => s.tStartUs)).toEqual([0, 25000, 50000, 75000]);
    expect(new Set(tracksOf(slices).map((r) => r.tS)).size).toBe(100);
  });
});

describe('TRACKS.tsv', () => {
  it('has the header t_s object_id kind cx cy x0 y0 x1 y1 and fixed decimals', () => {
    expect(TRACKS_TSV_HEADER).toBe('t_s\tobject_id\tkind\tcx\tcy\tx0\ty0\tx1\ty1');
    const row: TrackRow = { tS: 0.012, objectId: 3, kind: 'forklift', cx: 50.125, cy: 7, x0: 0, y0: 1.5, x1: 100.25, y1: 12.5 };
    expect(formatTracksTsv([row, { ...row, tS: 0.013, objectId: 104, kind: 'parcel' }])).toBe(
      `${TRACKS_TSV_HEADER}\n0.012000\t3\tforklift\t50.13\t7.00\t0.00\t1.50\t100.25\t12.50\n0.013000\t104\tparcel\t50.13\t7.00\t0.00\t1.50\t100.25\t12.50\n`,
    );
  });
});
