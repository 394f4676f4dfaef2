import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { channels, type GazeSourceChoice } from '../../app/contract';
import { createDispatcher } from '../../app/contract/dispatcher';
import type { RunTargetProcedureResponse } from '../../app/contract/schemas/targets';
import { hostNs } from '../../app/core/clock/host-clock';
import { combinedGaze } from '../../app/core/gaze/gaze-sample';
import type { DisplayGeometry } from '../../app/core/geometry';
import { driftRateDegPerMin, meanDriftOffset, pointQuality, samplesInWindow, summarizeValidation, targetOrder, validationLayout } from '../../app/core/quality';
import type { GazeRecord } from '../../app/core/recording/records';
import { liveHandlers } from '../../app/host/handlers/live-handlers';
import { LiveSession, type SessionWriter } from '../../app/host/live/live-session';
import { RecoveredSessions } from '../../app/host/live/recovered-sessions';
import { TargetProcedures } from '../../app/host/live/target-procedure';
import { createHostLog } from '../../app/host/log';
import { createMonotonicClock } from '../../app/host/monotonic-clock';
import { StimulusStore } from '../../app/host/stimuli/stimulus-store';
import { inMemoryLiveSession } from './support/in-memory-live-session';

// A recording from the in-host simulated tracker in simulated time: the tracker looks at
// each target the stage shows (LiveSession.showTarget), with a known accuracy offset,
// noise, latency, loss and drift, and the procedure measures what it sees.
const DISPLAY: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
const log = createHostLog({ file: null, echo: false });

function simulatedRecording(source: Partial<Extract<GazeSourceChoice, { kind: 'simulated' }>>) {
  const { dataDir, clock, live, gaze, messages, stage } = inMemoryLiveSession('gz-targets-');
  /** Simulated time passes in 20 ms steps, the tracker delivering what is due; a yield per step lets a cancel arrive. */
  const advance = (ms: number) => {
    for (let t = 0; t < ms; t += 20) {
      clock.advanceMs(Math.min(20, ms - t));
      live.advanceSimulatedTracker(hostNs(clock.nowNs()));
    }
  };
  const sleep = async (ms: number, signal: AbortSignal) => {
    for (let t = 0; t < ms && !signal.aborted; t += 100) {
      advance(Math.min(100, ms - t));
      await new Promise((resolve) => setImmediate(resolve));
    }
  };
  const targets = new TargetProcedures(live, { sleep });
  const handlers = liveHandlers(live, new RecoveredSessions(join(dataDir, 'recordings')), targets);
  const dispatch = createDispatcher({ runTargetProcedure: channels.runTargetProcedure, cancelTargetProcedure: channels.cancelTargetProcedure }, handlers, log);
  const context = { page: 'console', connectionId: 'console-1' } as const;
  const call = (channel: 'runTargetProcedure' | 'cancelTargetProcedure', payload: unknown) => dispatch(channel, payload, context);
  const start = () => live.startRecording({ kind: 'simulated', seed: 5, rateHz: 500, ...source }, DISPLAY);
  return { clock, live, gaze, messages, stage, call, start, advance, targets };
}

let cleanup: (() => Promise<void>) | null = null;
afterEach(async () => {
  await cleanup?.();
  cleanup = null;
});

describe('runTargetProcedure with the simulated tracker in simulated time', () => {
  it('shows a 9-point validation in random order and measures the tracker’s accuracy offset at every point', async () => {
    const rec = simulatedRecording({ noiseDeg: 0.05, accuracyOffsetDeg: 0.6, latencyMs: 20, lossPct: 2 });
    cleanup = () => rec.live.dispose();
    await rec.start();
    rec.advance(500);
    const points = validationLayout(9, DISPLAY);
    // A late window (700..1400 ms): the simulated eye's corrective saccades land after 300 ms.
    const result = await rec.call('runTargetProcedure', { purpose: 'validation', points, order: 'random', seed: 7, fromMs: 700, toMs: 1400 });
    expect(result.ok).toBe(true);
    const value = (result as { value: RunTargetProcedureResponse }).value;

    // Shown in the seed's order, each for 1500 ms, removed before the next.
    const order = targetOrder(9, 7);
    expect(value.points.map((p) => p.index)).toEqual(order);
    expect(value).toMatchObject({ purpose: 'validation', seed: 7, gazeUnits: 'screen_px' });
    const shows = rec.stage.filter((c) => c.type === 'showTarget');
    expect(shows.map((c) => [c.x, c.y])).toEqual(order.map((i) => [points[i]!.x, points[i]!.y]));
    expect(rec.stage.filter((c) => c.type === 'hideTarget').length).toBe(9);
    value.points.forEach((p, k) => expect(p.onsetHostNs - value.startedHostNs).toBe(k * 1500e6));
    expect(rec.messages.filter((m) => m.kind === 'target_shown').map((m) => m.data.purpose)).toEqual(Array(9).fill('validation'));

    // The tracker's constant 0.6° offset comes back at every point (give or take the eye's
    // own fixational movements), with its noise and its losses (2% lost, and blinks). Noise of
    // 0.05° RMS per eye, averaged over two eyes, gives an RMS-S2S of 0.05° (white noise:
    // RMS-S2S = √2 · SD, REFERENCES.md section 3).
    for (const p of value.points) {
      expect(Math.abs(p.accuracyDeg! - 0.6)).toBeLessThan(0.2);
      // Per-axis angles are not exact angles away from the centre, but close.
      expect(Math.abs(Math.hypot(p.dxDeg!, p.dyDeg!) - p.accuracyDeg!)).toBeLessThan(0.06);
      expect(Math.abs(p.precisionRmsS2SDeg! - 0.05)).toBeLessThan(0.01);
      expect(p.precisionSdDeg!).toBeLessThan(0.15);
      expect(p.dataLossPct).toBeGreaterThan(0);
      expect(p.dataLossPct).toBeLessThan(40);
      expect(p.samples).toBeGreaterThan(200);
    }
    const summary = summarizeValidation(value.points, { validationMeanDeg: 1, validationMaxDeg: 1.5 });
    expect(summary.accepted).toBe(true);
    expect(summarizeValidation(value.points, { validationMeanDeg: 0.3, validationMaxDeg: 1.5 }).accepted).toBe(false);

    // The same figures from the recorded gaze: the tap saw exactly the samples that were recorded.
    for (const p of value.points) {
      const recorded = rec.gaze.map((r) => {
        const g = combinedGaze(r);
        return { hostNs: r.hostNs, x: g?.x ?? Number.NaN, y: g?.y ?? Number.NaN, valid: g !== null };
      });
      const again = pointQuality(points[p.index]!, samplesInWindow(recorded, p.onsetHostNs, 700, 1400), 350, DISPLAY);
      expect(again).toEqual({ x: p.x, y: p.y, accuracyDeg: p.accuracyDeg, precisionRmsS2SDeg: p.precisionRmsS2SDeg, precisionSdDeg: p.precisionSdDeg, dataLossPct: p.dataLossPct, samples: p.samples, dxDeg: p.dxDeg, dyDeg: p.dyDeg });
    }
    const end = rec.messages.find((m) => m.kind === 'target_procedure_end')!;
    expect(end.data).toMatchObject({ purpose: 'validation', how: 'completed' });
    expect((end.data.points as unknown[]).length).toBe(9);
  });

  it('measures drift growing over a session of drift checks at the rate the tracker drifts', async () => {
    const rec = simulatedRecording({ noiseDeg: 0.03, driftDegPerMin: 2 });
    cleanup = () => rec.live.dispose();
    await rec.start();
    const times: number[] = [];
    const offsets: number[] = [];
    for (let check = 0; check < 5; check++) {
      rec.advance(30_000); // a clip between checks
      const result = await rec.call('runTargetProcedure', { purpose: 'drift_check', points: [{ x: 960, y: 540 }], order: 'as_given' });
      const value = (result as { value: RunTargetProcedureResponse }).value;
      times.push((value.points[0]!.onsetHostNs - 20e9) / 1e9);
      offsets.push(meanDriftOffset(value.points)!.offsetDeg);
    }
    expect(offsets[4]!).toBeGreaterThan(offsets[0]!);
    expect(Math.abs(driftRateDegPerMin(times, offsets)! - 2)).toBeLessThan(0.2);
  });

  it('answers with typed failures: no recording, a bad window or point, one procedure at a time, and cancel', async () => {
    const rec = simulatedRecording({});
    cleanup = () => rec.live.dispose();
    const request = { purpose: 'calibration', points: [{ x: 960, y: 540 }, { x: 200, y: 200 }], order: 'as_given' };
    expect(await rec.call('runTargetProcedure', request)).toMatchObject({ ok: false, code: 'conflict', message: expect.stringMatching(/no recording is running/) });
    await rec.start();
    expect(await rec.call('runTargetProcedure', { ...request, points: [{ x: 2000, y: 10 }] })).toMatchObject({ ok: false, code: 'bad_input', path: 'request.points[0]' });
    expect(await rec.call('runTargetProcedure', { ...request, holdMs: 1000 })).toMatchObject({ ok: false, code: 'bad_input', path: 'request.toMs' });
    expect(await rec.call('runTargetProcedure', { ...request, fromMs: 900, toMs: 800 })).toMatchObject({ ok: false, code: 'bad_input', path: 'request.fromMs' });
    expect(await rec.call('runTargetProcedure', { ...request, order: 'sideways' })).toMatchObject({ ok: false, code: 'invalid_request' });

    const running = rec.call('runTargetProcedure', request);
    await new Promise((resolve) => setImmediate(resolve));
    expect(rec.targets.running).toBe(true);
    expect(await rec.call('runTargetProcedure', request)).toMatchObject({ ok: false, code: 'conflict', message: expect.stringMatching(/already running/) });
    expect(await rec.call('cancelTargetProcedure', {})).toEqual({ ok: true, value: {} });
    expect(await running).toMatchObject({ ok: false, code: 'conflict', message: 'the target procedure was cancelled' });
    // The target shown when the cancel came was removed, and the second never appeared.
    expect(rec.stage.map((c) => c.type)).toEqual(['showTarget', 'hideTarget']);
    expect(rec.messages.find((m) => m.kind === 'target_procedure_end')?.data).toMatchObject({ how: 'cancelled' });
    expect(rec.targets.running).toBe(false);

    // A recording that stops under a running procedure ends it.
    const orphaned = rec.call('runTargetProcedure', request);
    await new Promise((resolve) => setImmediate(resolve));
    await rec.live.stopRecording();
    expect(await orphaned).toMatchObject({ ok: false, code: 'conflict', message: 'the recording stopped during the target procedure' });
    await rec.start();

    // A random order without a seed draws one and says which.
    const drawn = await rec.call('runTargetProcedure', { ...request, order: 'random', holdMs: 1300 });
    const value = (drawn as { value: RunTargetProcedureResponse }).value;
    expect(Number.isInteger(value.seed)).toBe(true);
    expect(value.points.map((p) => p.index)).toEqual(targetOrder(2, value.seed!));
  });
});

describe('runTargetProcedure on the live clock', () => {
  it('waits on real timers by default and collects the samples the timer-driven tracker delivers', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-targets-live-'));
    const gaze: GazeRecord[] = [];
    const writer: SessionWriter = { appendGaze: (r) => gaze.push(r), appendFrames: () => {}, appendMessage: () => {}, close: async () => {} };
    const live = new LiveSession({
      clock: createMonotonicClock(),
      log,
      store: new StimulusStore(dataDir, log),
      recordingsDir: join(dataDir, 'recordings'),
      openRecorder: async () => writer,
      reopenRecorder: () => Promise.reject(new Error('not used')),
      toStage: { command: () => {}, events: () => {} },
      publish: () => {},
    });
    cleanup = () => live.dispose();
    const handlers = liveHandlers(live, new RecoveredSessions(join(dataDir, 'recordings')));
    await live.startRecording({ kind: 'simulated', seed: 2, rateHz: 250, latencyMs: 10 }, DISPLAY);
    const result = await handlers.runTargetProcedure({ purpose: 'drift_check', points: [{ x: 400, y: 300 }, { x: 1500, y: 800 }], order: 'as_given', fromMs: 0, toMs: 150, holdMs: 200 }, { page: 'console', connectionId: 'c' });
    expect(channels.runTargetProcedure.response.safeParse(result).success).toBe(true);
    const value = result as RunTargetProcedureResponse;
    expect(value.points.map((p) => [p.x, p.y])).toEqual([[400, 300], [1500, 800]]);
    // Every sample of each window was there when the procedure measured it.
    for (const p of value.points) {
      const inWindow = gaze.filter((r) => r.hostNs >= p.onsetHostNs && r.hostNs <= p.onsetHostNs + 150e6 && combinedGaze(r));
      expect(p.samples).toBe(inWindow.length);
      expect(p.samples).toBeGreaterThan(0);
    }
  });
});
