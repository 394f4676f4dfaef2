import { describe, expect, it } from 'vitest';
import { batchFrom } from '../../../../app/core/events/event-batch';
import { DECAY_WEIGHT_MAX_ERROR, DecayTable } from '../../../../app/core/render/decay-table';
import { EventImageRenderer } from '../../../../app/core/render/event-image-renderer';
import { DEFAULT_BACKGROUND_RGB, DEFAULT_OFF_RGB, DEFAULT_ON_RGB, type Rgb } from '../../../../app/core/render/render-defaults';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { imageFor, pixelAt, renderOnce } from './images';

// Time-surface values from /work/shared/REFERENCES.md section 6, computed with numpy 1.24
// by reference-scripts/t6_dvs.py after Lagorce, Orchard, Galluppi, Shi & Benosman (2017),
// "HOTS: A hierarchy of event-based time-surfaces for pattern recognition", IEEE TPAMI
// 39(7):1346-1359: S = exp(-(t - t_last)/tau), tau = 50 ms.
const TAU_US = 50_000;
const DECAY_AT_MS: ReadonlyArray<readonly [dtMs: number, value: number]> = [
  [0, 1],
  [10, 0.8187307530779818],
  [20, 0.6703200460356393],
  [50, 0.3678794411714424],
  [100, 0.1353352832366127],
];
/** Rows are y, columns x; null = the pixel never fired. Surface at t = 100 ms (8 decimals). */
const LAST_MS = [
  [90, 80, null],
  [95, 100, 60],
  [null, 50, 99],
] as const;
const SURFACE = [
  [0.81873075, 0.67032005, 0],
  [0.90483742, 1, 0.44932896],
  [0, 0.36787944, 0.98019867],
];

/** The blend from the background toward a polarity colour, before rounding. */
const blend = (colour: Rgb, weight: number): number[] => DEFAULT_BACKGROUND_RGB.map((b, c) => b + weight * (colour[c]! - b));
/** The table's weight error moves a channel by at most 128 * error (no default channel is further than 128 from the background), plus rounding. */
const CHANNEL_TOLERANCE = 0.5 + 128 * DECAY_WEIGHT_MAX_ERROR;

function expectNear(actual: number[], expected: number[], tolerance: number): void {
  actual.forEach((v, c) => expect(Math.abs(v - expected[c]!)).toBeLessThanOrEqual(tolerance));
}

describe('decay look (time surface)', () => {
  it('tabulates exp(-dt/tau) within its stated error at the worked example’s ages', () => {
    const table = new DecayTable(TAU_US, DEFAULT_BACKGROUND_RGB, DEFAULT_OFF_RGB, DEFAULT_ON_RGB);
    for (const [dtMs, value] of DECAY_AT_MS) {
      const weight = table.weights[Math.round(dtMs * 1000 * table.stepsPerUs)]!;
      expect(Math.abs(weight - value)).toBeLessThanOrEqual(DECAY_WEIGHT_MAX_ERROR);
    }
    expect(table.weights[0]).toBe(1);
    expect(DECAY_WEIGHT_MAX_ERROR).toBeCloseTo(Math.log(256) / 8192, 15);
  });

  it('blends the background toward the polarity colour by the worked example’s decay values', () => {
    // Five pixels in a row with ON (top row) and OFF (bottom row) events dt = 0, 10, 20, 50, 100 ms before t = 100 ms.
    const sensor = { width: 5, height: 2 };
    const rows = [1, 0].flatMap((p, y) => DECAY_AT_MS.map(([dtMs], x) => [(100 - dtMs) * 1000, x, y, p] as const));
    const rgba = renderOnce(sensor, { look: 'decay', tauUs: TAU_US }, batchFrom([...rows].sort((a, b) => a[0] - b[0])), 100_000);
    DECAY_AT_MS.forEach(([, value], x) => {
      expectNear(pixelAt(rgba, 5, x, 0).slice(0, 3), blend(DEFAULT_ON_RGB, value), CHANNEL_TOLERANCE);
      expectNear(pixelAt(rgba, 5, x, 1).slice(0, 3), blend(DEFAULT_OFF_RGB, value), CHANNEL_TOLERANCE);
      expect(pixelAt(rgba, 5, x, 0)[3]).toBe(255);
    });
    // Fresh events show their polarity colour exactly.
    expect(pixelAt(rgba, 5, 0, 0)).toEqual([255, 184, 28, 255]);
    expect(pixelAt(rgba, 5, 0, 1)).toEqual([16, 96, 192, 255]);
  });

  it('reproduces the worked example’s 3x3 time surface at t = 0.1 s as colours', () => {
    const sensor = { width: 3, height: 3 };
    const polarityOf = (x: number, y: number): number => (x + y) % 2; // a checkerboard of OFF and ON
    const events = LAST_MS.flatMap((row, y) => row.flatMap((ms, x) => (ms === null ? [] : [[ms * 1000, x, y, polarityOf(x, y)] as const])));
    const rgba = renderOnce(sensor, { look: 'decay', tauUs: TAU_US }, batchFrom(events.sort((a, b) => a[0] - b[0])), 100_000);
    for (let y = 0; y < 3; y++) {
      for (let x = 0; x < 3; x++) {
        const shown = pixelAt(rgba, 3, x, y);
        if (LAST_MS[y]![x] === null) {
          expect(shown).toEqual([128, 128, 128, 255]);
          continue;
        }
        const colour = polarityOf(x, y) === 1 ? DEFAULT_ON_RGB : DEFAULT_OFF_RGB;
        expectNear(shown.slice(0, 3), blend(colour, SURFACE[y]![x]!), CHANNEL_TOLERANCE + 1e-7 * 128);
      }
    }
  });

  it('counts only events up to the rendered time, the latest one restarting the decay', () => {
    const sensor = { width: 2, height: 1 };
    const renderer = new EventImageRenderer(sensor, { look: 'decay', tauUs: TAU_US });
    renderer.push(batchFrom([
      [0, 0, 0, 1],
      [50_000, 0, 0, 0],
      [60_000, 1, 0, 1],
    ]));
    const rgba = imageFor(sensor);
    renderer.render(40_000, rgba);
    expectNear(pixelAt(rgba, 2, 0, 0).slice(0, 3), blend(DEFAULT_ON_RGB, Math.exp(-40 / 50)), CHANNEL_TOLERANCE);
    expect(pixelAt(rgba, 2, 1, 0)).toEqual([128, 128, 128, 255]);
    renderer.render(60_000, rgba);
    expectNear(pixelAt(rgba, 2, 0, 0).slice(0, 3), blend(DEFAULT_OFF_RGB, 0.8187307530779818), CHANNEL_TOLERANCE);
    expect(pixelAt(rgba, 2, 1, 0)).toEqual([255, 184, 28, 255]);
  });

  it('cuts off at tau * ln(256), dropping less than one 8-bit step against the exact blend', () => {
    const renderer = new EventImageRenderer({ width: 1, height: 1 }, { look: 'decay' });
    expect(renderer.historyUs).toBeCloseTo(30_000 * Math.log(256), 9);
    const h = renderer.historyUs;
    // Ages from 0 to twice the cut-off, each rendered against Math.exp without any cut-off.
    const random = new Xoshiro128(6);
    const sensor = { width: 64, height: 32 };
    const tUs = 1_000_000;
    const ages = Array.from({ length: sensor.width * sensor.height }, (_, i) => (i === 0 ? h : i === 1 ? h * (1 - 1e-12) : random.next() * 2 * h));
    const events = ages
      .map((age, i) => [tUs - age, i % sensor.width, Math.floor(i / sensor.width), i % 2] as const)
      .sort((a, b) => a[0] - b[0]);
    const rgba = renderOnce(sensor, { look: 'decay' }, batchFrom(events), tUs);
    let worst = 0;
    let worstInside = 0;
    for (const [t, x, y, p] of events) {
      const age = tUs - t;
      const exact = blend(p === 1 ? DEFAULT_ON_RGB : DEFAULT_OFF_RGB, Math.exp(-age / 30_000));
      const shown = pixelAt(rgba, sensor.width, x, y);
      exact.forEach((v, c) => {
        const error = Math.abs(shown[c]! - v);
        worst = Math.max(worst, error);
        if (age < h) worstInside = Math.max(worstInside, error);
      });
    }
    expect(worst).toBeLessThan(1);
    expect(worstInside).toBeLessThanOrEqual(CHANNEL_TOLERANCE);
    expect(pixelAt(rgba, sensor.width, 0, 0)).toEqual([128, 128, 128, 255]); // exactly historyUs old
  });
});
