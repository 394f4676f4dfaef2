import { describe, expect, it } from 'vitest';
import { batchFrom, concatBatches, sliceBatch, type EventBatch } from '../../../../app/core/events/event-batch';
import { RegionCrop } from '../../../../app/core/events/ops';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const rows = (b: EventBatch) => Array.from(b.t, (t, i) => [t, b.x[i], b.y[i], b.p[i]]);

/** Forklift and noise events anywhere on a 64 x 48 sensor. */
function aisleStream(seed: number, events: number): EventBatch {
  const g = new Xoshiro128(seed);
  return batchFrom(Array.from({ length: events }, (_, i) => [i * 3, g.nextInt(64), g.nextInt(48), g.nextInt(2)] as const));
}

describe('RegionCrop (common practice, no source)', () => {
  const sensor = { width: 6, height: 4 };
  const region = { x0: 2, y0: 1, width: 3, height: 2 };

  it('keeps events inside the region, moved so its top-left is (0, 0)', () => {
    const crop = new RegionCrop(sensor, region);
    const b = batchFrom([[1, 2, 1, 1], [2, 4, 2, 0], [3, 5, 2, 1], [4, 1, 1, 1], [5, 3, 3, 0], [6, 2, 0, 1], [7, 3, 2, 1]]);
    expect(rows(crop.push(b))).toEqual([[1, 0, 0, 1], [2, 2, 1, 0], [7, 1, 1, 1]]);
    expect(crop.outputSensor).toEqual({ width: 3, height: 2 });
  });

  it('accepts the whole sensor and keeps everything', () => {
    const b = aisleStream(1, 500);
    expect(rows(new RegionCrop({ width: 64, height: 48 }, { x0: 0, y0: 0, width: 64, height: 48 }).push(b))).toEqual(rows(b));
  });

  it('refuses a region outside the sensor, naming the parameter', () => {
    expect(() => new RegionCrop(sensor, { ...region, x0: 4 })).toThrow(/region\.width: x0 \+ width = 7 exceeds the sensor width 6/);
    expect(() => new RegionCrop(sensor, { ...region, height: 4 })).toThrow(/region\.height: y0 \+ height = 5 exceeds the sensor height 4/);
    expect(() => new RegionCrop(sensor, { ...region, x0: -1 })).toThrow(/region\.x0/);
    expect(() => new RegionCrop(sensor, { ...region, y0: 0.5 })).toThrow(/region\.y0/);
    expect(() => new RegionCrop(sensor, { ...region, width: 0 })).toThrow(/region\.width/);
    expect(() => new RegionCrop({ width: 6, height: 0 }, region)).toThrow(/sensor\.height/);
  });

  it('never yields coordinates outside the region, and maps back to exactly the events inside it', () => {
    const b = aisleStream(2, 5000);
    const g = new Xoshiro128(5);
    for (let k = 0; k < 20; k++) {
      const width = 1 + g.nextInt(64);
      const height = 1 + g.nextInt(48);
      const r = { x0: g.nextInt(64 - width + 1), y0: g.nextInt(48 - height + 1), width, height };
      const out = new RegionCrop({ width: 64, height: 48 }, r).push(b);
      expect(out.x.every((x) => x < width) && out.y.every((y) => y < height)).toBe(true);
      const inside = rows(b).filter(([, x, y]) => x! >= r.x0 && x! < r.x0 + width && y! >= r.y0 && y! < r.y0 + height);
      expect(rows(out).map(([t, x, y, p]) => [t, x! + r.x0, y! + r.y0, p])).toEqual(inside);
    }
  });

  it('gives the same events batch by batch as on the whole stream', () => {
    const b = aisleStream(3, 3000);
    const crop = new RegionCrop({ width: 64, height: 48 }, { x0: 10, y0: 5, width: 30, height: 20 });
    const pieces = [0, 1, 1000, 1001, 2999, 3000].map((end, i, all) => sliceBatch(b, i === 0 ? 0 : all[i - 1]!, end));
    expect(rows(concatBatches(pieces.map((piece) => crop.push(piece))))).toEqual(rows(crop.push(b)));
  });
});
