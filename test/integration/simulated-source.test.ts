import { describe, expect, it } from 'vitest';
import { ManualClock, type HostNs } from '../../app/core/clock/host-clock';
import type { GazeHello, GazeSample } from '../../app/core/gaze/gaze-sample';
import { angleBetween, screenPoint, type DisplayGeometry } from '../../app/core/geometry';
import { SimulatedTracker } from '../../app/core/tracker-sim';
import type { GazeSink } from '../../app/host/gaze/gaze-source';
import { SimulatedTrackerSource } from '../../app/host/gaze/simulated-source';
import { createMonotonicClock } from '../../app/host/monotonic-clock';

const DISPLAY: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };

/** A sink that keeps everything, with the clock's time at each delivery. */
function recordingSink(clock: { nowNs(): HostNs }) {
  const log: string[] = [];
  const samples: { sample: GazeSample; arrivalNs: number; deliveredAtNs: number }[] = [];
  let hello: GazeHello | null = null;
  const sink: GazeSink = {
    hello: (h, peer) => {
      hello = h;
      log.push(`hello ${peer}`);
    },
    sample: (sample, arrivalNs) => samples.push({ sample, arrivalNs, deliveredAtNs: clock.nowNs() }),
    garbage: (reason) => log.push(`garbage ${reason}`),
    connection: (state, peer) => log.push(`${state} ${peer}`),
  };
  return { sink, log, samples, hello: () => hello };
}

describe('SimulatedTrackerSource in simulated time (ManualClock)', () => {
  const tracker = { rateHz: 500, seed: 11, display: DISPLAY, latencyMs: 20, lossPct: 5, offsetS: 3.5, skewPpm: 20 } as const;

  it('says hello, then delivers every sample latencyMs after it was taken, and exactly the samples the model delivers', async () => {
    const clock = new ManualClock(5e9);
    const source = new SimulatedTrackerSource({ clock, tracker, drive: 'manual' });
    expect(source.kind).toBe('simulated');
    const got = recordingSink(clock);
    await source.start(got.sink);
    expect(got.log).toEqual(['connected simulated', 'hello simulated']);
    expect(got.hello()).toMatchObject({ units: 'screen_px', rateHz: 500, eyes: 'both', screen: { widthPx: 1920, heightPx: 1080 }, pupilUnit: 'mm' });

    while (clock.nowNs() < 15e9) {
      clock.advanceMs(7);
      source.advanceTo(clock.nowNs());
    }
    const h0 = 5;
    for (const { sample, arrivalNs, deliveredAtNs } of got.samples) {
      // Invert the tracker clock: h = h0 + (t − h0 − offset)/(1 + skew).
      const takenS = h0 + (sample.trackerTimeS - h0 - 3.5) / (1 + 20e-6);
      expect(Math.abs(arrivalNs - (takenS * 1e9 + 20e6))).toBeLessThan(2);
      expect(arrivalNs).toBeLessThanOrEqual(deliveredAtNs);
    }

    const model = new SimulatedTracker({ ...tracker, startHostS: h0 }).samplesUntil((clock.nowNs() + 0.5) / 1e9 - 0.02);
    const expected = model.filter((r) => r.delivered);
    expect(got.samples.map((s) => s.sample)).toEqual(expected.map((r) => r.sample));
    // The sequence numbers let a receiver count the losses.
    const seqs = got.samples.map((s) => s.sample.seq!);
    expect(seqs.at(-1)! + 1 - seqs.length).toBe(model.filter((r) => !r.delivered).length);
    expect(model.filter((r) => !r.delivered).length).toBeGreaterThan(0);

    await source.stop();
    expect(got.log.at(-1)).toBe('disconnected simulated');
    expect(() => source.advanceTo(clock.nowNs())).toThrow(/not started/);
  });

  it('looks where the host points it, from the moment it is told, and from the start when told before', async () => {
    const clock = new ManualClock(2e9);
    const source = new SimulatedTrackerSource({ clock, tracker: { rateHz: 250, seed: 4, display: DISPLAY, eyeMotion: { blinkIntervalMinS: 1e6, blinkIntervalMaxS: 1e6 } }, drive: 'manual' });
    source.setLook({ kind: 'point', x: 300, y: 200 });
    const got = recordingSink(clock);
    await source.start(got.sink);
    clock.advanceMs(1000);
    source.advanceTo(clock.nowNs());
    source.setLook({ kind: 'point', x: 1600, y: 900 });
    clock.advanceMs(1000);
    source.advanceTo(clock.nowNs());
    const gazeAt = (s: number) => {
      const { sample } = got.samples.find((x) => x.sample.trackerTimeS >= s)!;
      return screenPoint(sample.left!.x, sample.left!.y);
    };
    expect(angleBetween(DISPLAY, gazeAt(2.9), screenPoint(300, 200))).toBeLessThan(1);
    expect(angleBetween(DISPLAY, gazeAt(3.05), screenPoint(300, 200))).toBeLessThan(1);
    expect(angleBetween(DISPLAY, gazeAt(3.9), screenPoint(1600, 900))).toBeLessThan(1);
    expect(() => source.setLook({ kind: 'point', x: 0, y: 0 }, (2.5e9) as HostNs)).toThrow(RangeError);
    await source.stop();
  });

  it('refuses bad options when it is made', () => {
    const clock = new ManualClock();
    expect(() => new SimulatedTrackerSource({ clock, tracker: { ...tracker, rateHz: -1 } })).toThrow(/rateHz/);
    expect(() => new SimulatedTrackerSource({ clock, tracker, tickMs: 0 })).toThrow(/tickMs must be a number >= 1/);
  });
});

describe('SimulatedTrackerSource on the live clock', () => {
  it('delivers in real time, each sample no earlier than latencyMs after it was taken, in order, until stopped', async () => {
    const clock = createMonotonicClock();
    const source = new SimulatedTrackerSource({ clock, tracker: { rateHz: 200, seed: 2, display: DISPLAY, latencyMs: 15 }, tickMs: 5 });
    const got = recordingSink(clock);
    await source.start(got.sink);
    await new Promise((resolve) => setTimeout(resolve, 300));
    await source.stop();
    const count = got.samples.length;
    expect(count).toBeGreaterThan(0);
    expect(got.samples.map((s) => s.sample.seq)).toEqual(got.samples.map((_, k) => k));
    let previous = -Infinity;
    for (const { sample, arrivalNs } of got.samples) {
      // Offset and skew 0: the timestamp is the host time it was taken at.
      expect(arrivalNs).toBeGreaterThanOrEqual(sample.trackerTimeS * 1e9 + 15e6 - 1);
      expect(arrivalNs).toBeGreaterThanOrEqual(previous);
      previous = arrivalNs;
    }
    expect(got.log).toEqual(['connected simulated', 'hello simulated', 'disconnected simulated']);
    await new Promise((resolve) => setTimeout(resolve, 30));
    expect(got.samples.length).toBe(count);
  });
});
