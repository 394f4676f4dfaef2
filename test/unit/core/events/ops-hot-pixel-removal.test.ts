import { describe, expect, it } from 'vitest';
import { batchFrom, type EventBatch } from '../../../../app/core/events/event-batch';
import { HotPixelRemoval } from '../../../../app/core/events/ops';
import { EventStatsAccumulator } from '../../../../app/core/events/stats';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

const rows = (b: EventBatch) => Array.from(b.t, (t, i) => [t, b.x[i], b.y[i], b.p[i]]);

describe('HotPixelRemoval (common practice, no source)', () => {
  const sensor = { width: 4, height: 3 };

  it('drops every event of the listed pixels and keeps the rest in order', () => {
    const b = batchFrom([[1, 3, 2, 1], [2, 0, 0, 0], [3, 3, 2, 0], [4, 2, 2, 1], [5, 0, 2, 1], [6, 3, 2, 1]]);
    const removal = new HotPixelRemoval(sensor, [{ x: 3, y: 2 }, { x: 0, y: 2 }]);
    expect(rows(removal.push(b))).toEqual([[2, 0, 0, 0], [4, 2, 2, 1]]);
    expect(rows(new HotPixelRemoval(sensor, []).push(b))).toEqual(rows(b));
  });

  it('refuses pixels outside the sensor and events outside it', () => {
    expect(() => new HotPixelRemoval(sensor, [{ x: 0, y: 0 }, { x: 4, y: 0 }])).toThrow(/pixels\[1\]\.x/);
    expect(() => new HotPixelRemoval(sensor, [{ x: 1, y: -1 }])).toThrow(/pixels\[0\]\.y/);
    // (4, 0) would otherwise alias pixel (0, 1) in a row-major table.
    expect(() => new HotPixelRemoval(sensor, [{ x: 0, y: 1 }]).push(batchFrom([[1, 4, 0, 1]]))).toThrow(/outside the 4x3 sensor/);
  });

  it('takes the hot pixels from the stream statistics and leaves every other pixel count unchanged', () => {
    const g = new Xoshiro128(21);
    const b = batchFrom(Array.from({ length: 6000 }, (_, i) => {
      const stuck = g.nextInt(8);
      return stuck === 0 ? [i, 7, 1, 1] : stuck === 1 ? [i, 2, 9, 0] : [i, g.nextInt(16), g.nextInt(12), g.nextInt(2)];
    }));
    const big = { width: 16, height: 12 };
    const before = new EventStatsAccumulator(big);
    before.push(b);
    const hot = before.finish().hot_pixels.pixels;
    expect(hot.map(({ x, y }) => [x, y])).toEqual(expect.arrayContaining([[7, 1], [2, 9]]));
    const out = new HotPixelRemoval(big, hot).push(b);
    const countsOf = (batch: EventBatch) => {
      const c = new Map<string, number>();
      batch.x.forEach((x, i) => c.set(`${x},${batch.y[i]}`, (c.get(`${x},${batch.y[i]}`) ?? 0) + 1));
      return c;
    };
    const was = countsOf(b);
    const now = countsOf(out);
    for (const { x, y } of hot) {
      expect(now.has(`${x},${y}`)).toBe(false);
      was.delete(`${x},${y}`);
    }
    expect(now).toEqual(was);
  });
});
