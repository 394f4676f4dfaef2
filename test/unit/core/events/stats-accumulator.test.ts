import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { batchFrom, sliceBatch, type EventBatch } from '../../../../app/core/events/event-batch';
import { EventStatsAccumulator } from '../../../../app/core/events/stats';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

type Row = [t: number, x: number, y: number, p: number];

/**
 * The warning beacon's stuck pixel (3, 2) fires every 100 µs from t = 1000 µs, alternating ON
 * and OFF, while three other pixels fire once or twice on a 4 x 3 sensor.
 */
function beaconRows(): Row[] {
  const rows: Row[] = [];
  for (let k = 0; k < 25; k++) rows.push([1000 + 100 * k, 3, 2, k % 2 === 0 ? 1 : 0]);
  rows.push([1500, 0, 0, 1], [2999, 1, 0, 0], [3000, 2, 1, 1], [6000, 2, 1, 1]);
  return rows.sort((a, b) => a[0] - b[0]);
}

const statsOf = (sensor: { width: number; height: number }, ...batches: EventBatch[]) => {
  const acc = new EventStatsAccumulator(sensor);
  for (const b of batches) acc.push(b);
  return acc.finish();
};

/** Parcels on a conveyor crossing a 32 x 24 view, sensor noise everywhere, and two stuck pixels. */
function conveyorStream(seed: number, events: number, meanStepUs: number): EventBatch {
  const g = new Xoshiro128(seed);
  const rows: Row[] = [];
  let t = 1_700_000_000_000_000 + g.nextInt(1000);
  for (let i = 0; i < events; i++) {
    t += g.nextInt(2 * meanStepUs + 1);
    const kind = g.nextInt(20);
    if (kind < 2) rows.push([t, 5, 7, g.nextInt(2)]);
    else if (kind === 2) rows.push([t, 20, 3, g.nextInt(2)]);
    else if (kind < 9) rows.push([t, (Math.floor((t / 20_000) % 32) + g.nextInt(3)) % 32, 10 + g.nextInt(4), g.nextInt(2)]);
    else rows.push([t, g.nextInt(32), g.nextInt(24), g.nextInt(2)]);
  }
  return batchFrom(rows);
}

/** Splits a batch at random points, with empty batches in between. */
function splitRandomly(batch: EventBatch, seed: number, pieces: number): EventBatch[] {
  const g = new Xoshiro128(seed);
  const cuts = Array.from({ length: pieces - 1 }, () => g.nextInt(batch.t.length + 1)).sort((a, b) => a - b);
  const bounds = [0, ...cuts, batch.t.length];
  return bounds.slice(1).map((end, i) => sliceBatch(batch, bounds[i]!, end));
}

describe('EventStatsAccumulator on a hand-computed stream (common practice, no source)', () => {
  it('gives every field', () => {
    const s = statsOf({ width: 4, height: 3 }, batchFrom(beaconRows()));
    expect(s).toEqual({
      count: 29,
      t_start_us: 1000,
      t_end_us: 6000,
      duration_s: 0.005,
      width: 4,
      height: 3,
      on_count: 16, // 13 beacon ON + (0,0) + both (2,1)
      off_count: 13,
      mean_rate_hz: 5800, // 29 events / 0.005 s
      // 1 ms bins from 1000 µs: [1000,2000) beacon 10 + (0,0); [2000,3000) beacon 10 + (1,0) at 2999;
      // [3000,4000) beacon 5 + (2,1) at 3000 (a bin opens at its start); nothing; nothing; (2,1) at 6000.
      peak_rate_hz: 11_000,
      rate_series: { bin_s: 0.001, rate_hz: [11_000, 11_000, 6000, 0, 0, 1000] },
      // Fired counts 1, 1, 2, 25: an even number, median (1 + 2) / 2 = 1.5, threshold 15.
      hot_pixels: { threshold_factor: 10, median_count: 1.5, pixels: [{ x: 3, y: 2, count: 25 }] },
    });
  });

  it('takes the middle count as the median of an odd number of fired pixels', () => {
    const rows = beaconRows();
    rows.push([2000, 0, 2, 0]);
    const s = statsOf({ width: 4, height: 3 }, batchFrom(rows.sort((a, b) => a[0] - b[0])));
    // Fired counts 1, 1, 1, 2, 25: median 1, threshold 10; the new event falls in bin [2000, 3000).
    expect(s.hot_pixels).toEqual({ threshold_factor: 10, median_count: 1, pixels: [{ x: 3, y: 2, count: 25 }] });
    expect(s.rate_series.rate_hz).toEqual([11_000, 12_000, 6000, 0, 0, 1000]);
    expect(s.peak_rate_hz).toBe(12_000);
    expect(s.mean_rate_hz).toBe(6000);
  });
});

describe('EventStatsAccumulator edge cases (documented policy)', () => {
  it('reports one event with zero duration and no mean rate', () => {
    const s = statsOf({ width: 8, height: 8 }, batchFrom([[123.5, 2, 3, 1]]));
    expect(s).toEqual({
      count: 1,
      t_start_us: 123.5,
      t_end_us: 123.5,
      duration_s: 0,
      width: 8,
      height: 8,
      on_count: 1,
      off_count: 0,
      mean_rate_hz: null,
      peak_rate_hz: 1000,
      rate_series: { bin_s: 0.001, rate_hz: [1000] },
      hot_pixels: { threshold_factor: 10, median_count: 1, pixels: [] },
    });
  });

  it('reports events all at one timestamp in one 1 ms bin', () => {
    const s = statsOf({ width: 8, height: 8 }, batchFrom([[42, 0, 0, 0], [42, 1, 0, 1], [42, 1, 0, 0], [42, 7, 7, 1], [42, 1, 0, 1]]));
    expect(s.duration_s).toBe(0);
    expect(s.mean_rate_hz).toBeNull();
    expect(s.peak_rate_hz).toBe(5000);
    expect(s.rate_series).toEqual({ bin_s: 0.001, rate_hz: [5000] });
    // Counts 1, 3, 1: median 1, and 3 is not above 10.
    expect(s.hot_pixels).toEqual({ threshold_factor: 10, median_count: 1, pixels: [] });
  });

  it('reports an empty stream without NaN or Infinity', () => {
    const s = statsOf({ width: 8, height: 8 }, batchFrom([]));
    expect(s).toEqual({
      count: 0,
      t_start_us: null,
      t_end_us: null,
      duration_s: 0,
      width: 8,
      height: 8,
      on_count: 0,
      off_count: 0,
      mean_rate_hz: null,
      peak_rate_hz: 0,
      rate_series: { bin_s: 0.001, rate_hz: [] },
      hot_pixels: { threshold_factor: 10, median_count: null, pixels: [] },
    });
  });

  it('refuses bad sensors and bad events before counting them', () => {
    expect(() => new EventStatsAccumulator({ width: 0, height: 4 })).toThrow(/sensor\.width/);
    expect(() => new EventStatsAccumulator({ width: 4, height: 2.5 })).toThrow(/sensor\.height/);
    const acc = new EventStatsAccumulator({ width: 4, height: 3 });
    acc.push(batchFrom([[100, 0, 0, 1]]));
    expect(() => acc.push(batchFrom([[99, 0, 0, 1]]))).toThrow(/batch\.t\[0\] = 99 is earlier/);
    expect(() => acc.push(batchFrom([[200, 4, 0, 1]]))).toThrow(/outside the 4x3 sensor/);
    expect(() => acc.push(batchFrom([[200, 0, 3, 1]]))).toThrow(/outside the 4x3 sensor/);
    expect(() => acc.push(batchFrom([[200, 0, 0, 2]]))).toThrow(/batch\.p\[0\]/);
    expect(() => acc.push(batchFrom([[200, 0, 0, 1], [Number.NaN, 0, 0, 1]]))).toThrow(/batch\.t\[1\]/);
    expect(acc.finish().count).toBe(1);
  });

  it('can report a stream in progress and start again after reset', () => {
    const acc = new EventStatsAccumulator({ width: 4, height: 3 });
    acc.push(batchFrom(beaconRows()));
    const first = acc.finish();
    expect(acc.finish()).toEqual(first);
    acc.reset();
    acc.push(batchFrom([[5, 1, 1, 0]]));
    expect(acc.finish()).toEqual(statsOf({ width: 4, height: 3 }, batchFrom([[5, 1, 1, 0]])));
  });
});

describe('EventStatsAccumulator invariants (common practice, no source)', () => {
  const sensor = { width: 32, height: 24 };

  it('gives the same statistics for a stream in many batches as in one', () => {
    const whole = conveyorStream(7, 30_000, 90);
    const expected = statsOf(sensor, whole);
    for (const seed of [1, 2, 3]) expect(statsOf(sensor, ...splitRandomly(whole, seed, 40))).toEqual(expected);
    expect(statsOf(sensor, ...splitRandomly(whole, 4, whole.t.length))).toEqual(expected);
  });

  it('counts every event once as ON or OFF, and once in the rate series', () => {
    for (const [events, stepUs] of [[200, 3], [5000, 250], [20_000, 700]] as const) {
      const s = statsOf(sensor, conveyorStream(events, events, stepUs));
      expect(s.on_count + s.off_count).toBe(s.count);
      expect(s.rate_series.rate_hz.length).toBeLessThanOrEqual(1000);
      const total = s.rate_series.rate_hz.reduce((sum, r) => sum + r * s.rate_series.bin_s, 0);
      expect(total).toBeCloseTo(s.count, 6);
    }
  });
});

/** The same statistics computed independently with numpy (Debian python3-numpy). */
const NUMPY_STATS = String.raw`
import json, sys
import numpy as np
d = json.load(sys.stdin)
t = np.array(d['t'], dtype=np.float64); x = np.array(d['x']); y = np.array(d['y']); p = np.array(d['p'])
w, h = d['width'], d['height']
ms = np.bincount(np.floor((t - t[0]) / 1000).astype(np.int64))
k = next(s * 10**e for e in range(20) for s in (1, 2, 5) if -(-len(ms) // (s * 10**e)) <= 1000)
padded = np.zeros(-(-len(ms) // k) * k, dtype=np.int64); padded[:len(ms)] = ms
counts = np.bincount(y * w + x, minlength=w * h)
median = float(np.median(counts[counts > 0]))
hot = [int(i) for i in np.nonzero(counts > 10 * median)[0]]
hot.sort(key=lambda i: (-int(counts[i]), i))
duration = (t[-1] - t[0]) / 1e6
print(json.dumps({
  'count': int(len(t)), 'on_count': int(p.sum()), 'duration_s': float(duration), 'mean_rate_hz': float(len(t) / duration),
  'peak_rate_hz': float(ms.max() * 1000), 'bin_s': k / 1000,
  'rate_hz': [float(v) for v in padded.reshape(-1, k).sum(axis=1) * 1000 / k],
  'median_count': median, 'hot': [[i % w, i // w, int(counts[i])] for i in hot],
}))
`;

/** What NUMPY_STATS printed for conveyorStream(11, 30_000, 90) with numpy 1.24.2, kept for machines without python3-numpy. */
const RECORDED = { count: 30_000, on_count: 14_864, bin_s: 0.005, points: 542, peak: 19_000, median: 22, hot: [[5, 7, 3000], [20, 3, 1510]] };

function numpyStats(batch: EventBatch, width: number, height: number): unknown {
  const input = JSON.stringify({ t: Array.from(batch.t), x: Array.from(batch.x), y: Array.from(batch.y), p: Array.from(batch.p), width, height });
  try {
    return JSON.parse(execFileSync('/usr/bin/python3', ['-c', NUMPY_STATS], { input, encoding: 'utf8' }));
  } catch {
    return null;
  }
}

describe('EventStatsAccumulator against numpy (bincount, median; Harris et al. 2020, "Array programming with NumPy", Nature 585)', () => {
  it('agrees on a 2.7 s conveyor stream (5 ms plot bins)', () => {
    const sensor = { width: 32, height: 24 };
    const batch = conveyorStream(11, 30_000, 90);
    const s = statsOf(sensor, ...splitRandomly(batch, 5, 25));
    const ours = {
      count: s.count,
      on_count: s.on_count,
      duration_s: s.duration_s,
      mean_rate_hz: s.mean_rate_hz,
      peak_rate_hz: s.peak_rate_hz,
      bin_s: s.rate_series.bin_s,
      rate_hz: s.rate_series.rate_hz,
      median_count: s.hot_pixels.median_count,
      hot: s.hot_pixels.pixels.map((px) => [px.x, px.y, px.count]),
    };
    expect({ count: ours.count, on_count: ours.on_count, bin_s: ours.bin_s, points: ours.rate_hz.length, peak: ours.peak_rate_hz, median: ours.median_count, hot: ours.hot }).toEqual(RECORDED);
    const reference = numpyStats(batch, sensor.width, sensor.height);
    if (reference !== null) expect(ours).toEqual(reference);
  });
});
