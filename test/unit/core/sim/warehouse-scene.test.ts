import { describe, expect, it } from 'vitest';
import { shuttlePosition, type ShuttleRun } from '../../../../app/core/sim/shuttle-motion';
import type { TrackRow } from '../../../../app/core/sim/track-rows';
import { WarehouseScene, warehouseFlashingParts, type PixelRect } from '../../../../app/core/sim/warehouse-scene';

const small = { width: 160, height: 120 };
const full = { width: 640, height: 480 };
const frame = (scene: WarehouseScene, tS: number) => {
  const out = new Float32Array(scene.sensor.width * scene.sensor.height);
  scene.render(tS, out);
  return out;
};
const same = (a: Float32Array, b: Float32Array) => a.length === b.length && a.every((v, i) => v === b[i]);
const inside = (rects: PixelRect[], x: number, y: number) => rects.some((r) => x >= r.x0 && x < r.x1 && y >= r.y0 && y < r.y1);

describe('WarehouseScene rendering', () => {
  it('changes between two instants only inside changedRegions, at 1 ms and at 40 ms apart', () => {
    for (const sensor of [small, full]) {
      const scene = new WarehouseScene(sensor);
      for (const [t0, t1] of [[0, 0.001], [1.234, 1.235], [4.5, 4.54], [7.77, 7.771]] as const) {
        const a = frame(scene, t0);
        const b = frame(scene, t1);
        const rects = scene.changedRegions(t0, t1);
        let changed = 0;
        for (let i = 0; i < a.length; i++) {
          if (a[i] === b[i]) continue;
          changed++;
          expect(inside(rects, i % sensor.width, Math.floor(i / sensor.width))).toBe(true);
        }
        expect(changed).toBeGreaterThan(0);
        // The static background is what makes this cheap: far less than the frame needs redrawing.
        const area = rects.reduce((s, r) => s + (r.x1 - r.x0) * (r.y1 - r.y0), 0);
        expect(area).toBeLessThan(0.4 * a.length);
      }
    }
  });

  it('renders a region exactly as the same pixels of the whole image', () => {
    const scene = new WarehouseScene(full);
    const whole = frame(scene, 2.2);
    const rect = { x0: 100, y0: 230, x1: 420, y1: 470 };
    const part = new Float32Array((rect.x1 - rect.x0) * (rect.y1 - rect.y0));
    scene.renderRegion(2.2, rect, part);
    const crop = new Float32Array(part.length);
    for (let y = rect.y0; y < rect.y1; y++) crop.set(whole.subarray(y * full.width + rect.x0, y * full.width + rect.x1), (y - rect.y0) * (rect.x1 - rect.x0));
    expect(same(part, crop)).toBe(true);
  });

  it('is static without moving objects, positive everywhere and the same for every instance', () => {
    const still = new WarehouseScene(small, { objects: [] });
    expect(same(frame(still, 0), frame(still, 3.7))).toBe(true);
    expect(still.changedRegions(0, 3.7)).toEqual([]);
    const image = frame(new WarehouseScene(full), 1);
    expect(image.every((v) => v > 5 && v < 400)).toBe(true);
    expect(same(frame(new WarehouseScene(full), 1), image)).toBe(true);
  });

  it('draws objects with soft edges: the first pixel of a forklift along a row is only partly covered', () => {
    const scene = new WarehouseScene(full, { objects: ['forklift'] });
    const background = frame(new WarehouseScene(full, { objects: [] }), 0);
    let partial = 0;
    for (let k = 0; k < 10; k++) {
      const t = 0.5 + k * 0.0137;
      const image = frame(scene, t);
      const near = scene.objectsAt(t).find((r) => r.objectId === 3)!;
      const row = Math.round(near.y1 - 45) * full.width; // through the near forklift's counterweight and body
      const first = Array.from({ length: full.width }, (_, x) => x).find((x) => image[row + x] !== background[row + x])!;
      const [outside, edge, within] = [background[row + first]!, image[row + first]!, image[row + first + 3]!];
      if ((edge - outside) * (within - edge) > 0) partial++;
    }
    // An outline exactly half a pixel from a pixel centre would leave no partial pixel; that is rare.
    expect(partial).toBeGreaterThanOrEqual(8);
  });

  it('flashes the beacon once per turn, 1.5 times a second', () => {
    const scene = new WarehouseScene(full, { objects: ['beacon'] });
    const [part] = warehouseFlashingParts(full);
    expect(part).toMatchObject({ objectId: 5, kind: 'beacon', flashesPerSecond: 1.5 });
    const row = scene.objectsAt(0)[0]!;
    expect([part!.x0, part!.y0, part!.x1, part!.y1]).toEqual([row.x0, row.y0, row.x1, row.y1]);
    const centre = Math.round(row.cy) * full.width + Math.round(row.cx);
    const brightness = Array.from({ length: 200 }, (_, k) => frame(scene, k / 100)[centre]!);
    // Peaks (facing the camera) at t = n / 1.5 s, dark half a turn later.
    const peaks = brightness.map((v, k) => ({ v, k })).filter(({ v, k }) => k > 0 && k < 199 && v > brightness[k - 1]! && v >= brightness[k + 1]!);
    expect(peaks.map(({ k }) => k)).toEqual([67, 133]);
    expect(Math.max(...brightness) - Math.min(...brightness)).toBeGreaterThan(100);
    expect(warehouseFlashingParts(full, { objects: ['forklift'] })).toEqual([]);
  });

  it('flickers the failing tube on and off 8 times a second, lighting a large part of the aisle', () => {
    const scene = new WarehouseScene(full, { objects: ['flickering-light'] });
    const [part] = warehouseFlashingParts(full, { objects: ['flickering-light', 'person'] });
    expect(part).toMatchObject({ objectId: 6, kind: 'flickering-light', flashesPerSecond: 8 });
    const row = scene.objectsAt(0)[0]!;
    expect(row).toMatchObject({ objectId: 6, kind: 'flickering-light' });
    expect([part!.x0, part!.y0, part!.x1, part!.y1]).toEqual([row.x0, row.y0, row.x1, row.y1]);
    // Lit for the first half of each 125 ms cycle: switched on at t = n / 8 s, off 62.5 ms later.
    const lit = frame(scene, 0.03);
    const dark = frame(scene, 0.09);
    expect(same(frame(scene, 0.155), lit) && same(frame(scene, 0.215), dark)).toBe(true);
    const centre = Math.round(row.cy) * full.width + Math.round(row.cx);
    const brightness = Array.from({ length: 1000 }, (_, k) => frame(scene, k / 1000)[centre]!);
    const switchedOn = brightness.filter((v, k) => k > 0 && v > brightness[k - 1]!).length;
    expect(switchedOn).toBe(7); // at 125, 250, ..., 875 ms; lit from t = 0
    expect(Math.log(brightness[0]! / brightness[100]!)).toBeGreaterThan(0.2); // above the sensor's contrast threshold
    // Brighter by at least 10 % over more than a tenth of the picture.
    const brighter = lit.filter((v, i) => v > 1.1 * dark[i]!).length;
    expect(brighter).toBeGreaterThan(0.1 * lit.length);
  });

  it('shows the flickering light only when asked for', () => {
    expect(new WarehouseScene(full).objectsAt(1).some((r) => r.kind === 'flickering-light')).toBe(false);
    expect(warehouseFlashingParts(full).map((p) => p.kind)).toEqual(['beacon']);
  });

  it('leaves out of changedRegions an object drawn the same at both instants, and still covers every changed pixel', () => {
    const scene = new WarehouseScene(full, { objects: ['flickering-light', 'person'] });
    // Between switchings only the walker moves: one region, the walker's.
    const [only, ...more] = scene.changedRegions(0.01, 0.011);
    const walker = scene.objectsAt(0.011).find((r) => r.kind === 'person')!;
    expect(more).toEqual([]);
    expect(inside([only!], Math.round(walker.cx), Math.round(walker.cy))).toBe(true);
    expect(only!.x1 - only!.x0).toBeLessThan(walker.x1 - walker.x0 + 3);
    for (const [t0, t1] of [[0.062, 0.063], [0.124, 0.125], [0.499, 0.5]] as const) {
      const a = frame(scene, t0);
      const b = frame(scene, t1);
      const rects = scene.changedRegions(t0, t1);
      expect(rects).toHaveLength(2);
      for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) expect(inside(rects, i % full.width, Math.floor(i / full.width))).toBe(true);
    }
  });

  it('rejects unknown object groups and bad times with a RangeError', () => {
    expect(() => new WarehouseScene(small, { objects: ['crane' as never] })).toThrow(/objects must list some of forklift, conveyor, beacon, person, flickering-light, got crane/);
    expect(() => new WarehouseScene(small).objectsAt(-1)).toThrow(/tS must be a finite time >= 0/);
    expect(() => new WarehouseScene(small).render(0, new Float32Array(10))).toThrow(/out must hold 19200 pixels/);
  });
});

describe('WarehouseScene tracks', () => {
  const scene = new WarehouseScene(full);
  const rows = (tS: number) => scene.objectsAt(tS);

  it('lists forklifts, a person, a beacon and parcels, each inside the sensor with its box centre', () => {
    for (const t of [0, 0.5, 2.25, 5, 9.999]) {
      const r = rows(t);
      expect(r.filter((o) => o.kind === 'forklift').map((o) => o.objectId)).toEqual([1, 2, 3]);
      expect(r.filter((o) => o.kind === 'person').map((o) => o.objectId)).toEqual([4]);
      expect(r.filter((o) => o.kind === 'beacon').map((o) => o.objectId)).toEqual([5]);
      expect(r.filter((o) => o.kind === 'parcel').length).toBeGreaterThanOrEqual(3);
      for (const o of r) {
        expect(o.tS).toBe(t);
        expect(0 <= o.x0 && o.x0 <= o.x1 && o.x1 <= full.width - 1).toBe(true);
        expect(0 <= o.y0 && o.y0 <= o.y1 && o.y1 <= full.height - 1).toBe(true);
        expect(o.cx).toBe((o.x0 + o.x1) / 2);
        expect(o.cy).toBe((o.y0 + o.y1) / 2);
      }
    }
  });

  it('shows one group at a time when asked, with the same ids and boxes', () => {
    const parcels = new WarehouseScene(full, { objects: ['conveyor'] }).objectsAt(3);
    expect(parcels.every((o) => o.kind === 'parcel')).toBe(true);
    expect(parcels).toEqual(rows(3).filter((o) => o.kind === 'parcel'));
  });

  it('has forklifts at different depths and speeds: nearer is lower, larger and faster', () => {
    const forklift = (id: number, t: number) => rows(t).find((o) => o.objectId === id)!;
    const heights = [1, 2, 3].map((id) => forklift(id, 4).y1 - forklift(id, 4).y0);
    const bottoms = [1, 2, 3].map((id) => forklift(id, 4).y1);
    expect(heights[0]).toBeLessThan(heights[1]!);
    expect(heights[1]).toBeLessThan(heights[2]!);
    expect(bottoms[0]).toBeLessThan(bottoms[1]!);
    expect(bottoms[1]).toBeLessThan(bottoms[2]!);
    // Mid-leg speeds (px/s) from the box centres, where no box is clipped by the sensor's edge.
    const speed = (id: number, t: number) => Math.abs(forklift(id, t + 0.01).cx - forklift(id, t).cx) / 0.01;
    expect(speed(1, 3)).toBeCloseTo(0.14 * 640, 6);
    expect(speed(2, 1.5)).toBeCloseTo(0.2 * 640, 6);
    expect(speed(3, 1.5)).toBeCloseTo(0.34 * 640, 6);
  });

  it('crosses each forklift from side to side within a 10 s clip and walks the person along the walkway', () => {
    const path = (id: number) => Array.from({ length: 1001 }, (_, k) => rows(k / 100).find((o) => o.objectId === id)!.cx);
    for (const id of [1, 2, 3]) {
      const cx = path(id);
      expect(Math.min(...cx)).toBeLessThan(0.15 * full.width);
      expect(Math.max(...cx)).toBeGreaterThan(0.85 * full.width);
    }
    const walker = path(4);
    expect(Math.max(...walker) - Math.min(...walker)).toBeGreaterThan(0.6 * full.width);
  });

  it('carries parcels right to left, each a new id, entering at the right edge and leaving at the left', () => {
    const seen = new Map<number, TrackRow[]>();
    for (let k = 0; k <= 2000; k++) for (const o of rows(k / 100)) if (o.kind === 'parcel') seen.set(o.objectId, [...(seen.get(o.objectId) ?? []), o]);
    const ids = [...seen.keys()].sort((a, b) => a - b);
    expect(ids[0]).toBe(100);
    expect(ids).toEqual(ids.map((_, i) => 100 + i));
    for (const track of seen.values()) {
      for (let i = 1; i < track.length; i++) expect(track[i]!.x0).toBeLessThanOrEqual(track[i - 1]!.x0);
    }
    const entered = seen.get(ids.at(-2)!)!;
    expect(entered[0]!.tS).toBeGreaterThan(0);
    expect(entered[0]!.x1).toBe(full.width - 1);
    expect(seen.get(100)!.at(-1)!.x0).toBe(0);
  });
});

describe('shuttlePosition', () => {
  const run: ShuttleRun = { from: 10, to: 110, speed: 20, rampS: 1, startS: -0.5 };
  // One leg: 100 / 20 s at cruise plus half of each 1 s ramp, 6 s.

  it('starts at rest at `from`, reaches `to` after one leg and comes back after two (trapezoidal profile, common practice)', () => {
    expect(shuttlePosition(run, -0.5)).toBe(10);
    expect(shuttlePosition(run, 5.5)).toBeCloseTo(110, 10);
    expect(shuttlePosition(run, 11.5)).toBeCloseTo(10, 10);
    expect(shuttlePosition(run, 0.5)).toBeCloseTo(10 + 0.5 * 20 * 1, 10);
    expect(shuttlePosition(run, 2.5)).toBeCloseTo(10 + 10 + 20 * 2, 10);
  });

  it('moves continuously, never faster than the cruising speed', () => {
    const dt = 0.001;
    for (let t = 0; t < 12; t += dt) expect(Math.abs(shuttlePosition(run, t + dt) - shuttlePosition(run, t))).toBeLessThanOrEqual(20 * dt + 1e-9);
  });
});
