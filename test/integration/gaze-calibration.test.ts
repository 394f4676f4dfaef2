import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { channels } from '../../app/contract';
import { createDispatcher } from '../../app/contract/dispatcher';
import { ManualClock, hostNs } from '../../app/core/clock/host-clock';
import type { GazeHello, GazeSample } from '../../app/core/gaze/gaze-sample';
import { applyRawCalibration, fitRawCalibration } from '../../app/core/quality/correction';
import { validationLayout } from '../../app/core/quality';
import type { GazeRecord, MessageRecord } from '../../app/core/recording/records';
import { liveHandlers } from '../../app/host/handlers/live-handlers';
import { displayGeometry, gazeSourceChoice } from '../../app/contract/schemas/live';
import { GazeIntake } from '../../app/host/live/gaze-intake';
import { lastGazeCalibration } from '../../app/host/live/last-gaze-calibration';
import { LiveSession } from '../../app/host/live/live-session';
import { RecoveredSessions } from '../../app/host/live/recovered-sessions';
import { createHostLog } from '../../app/host/log';
import { readSession } from '../../app/host/recording/read-session';
import { SessionRecorder } from '../../app/host/recording/session-recorder';
import { StimulusStore } from '../../app/host/stimuli/stimulus-store';
import { inMemoryLiveSession } from './support/in-memory-live-session';

// A tracker that sends raw coordinates (a pupil-to-glint vector of no fixed unit) and relies
// on Gazeloom's calibration: a known smooth map from the screen to its raw space.
const display = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 };
const toRaw = (x: number, y: number) => {
  const u = (x - 960) / 960;
  const v = (y - 540) / 540;
  return { x: 0.12 * u + 0.01 * u * v - 0.02, y: 0.08 * v + 0.006 * u * u + 0.01 };
};
const rawHello: GazeHello = { protocol: 'gazeloom-feed', version: 1, units: 'raw', rateHz: 250, eyes: 'both', screen: null, pupilUnit: 'arbitrary', source: 'raw bridge' };
const sampleAt = (seq: number, raw: { x: number; y: number }, valid = true): GazeSample => ({
  seq,
  trackerTimeS: seq / 250,
  left: { x: raw.x, y: raw.y, valid, pupil: 3 },
  right: valid ? { x: raw.x, y: raw.y, valid, pupil: 3 } : null,
});
const calibration = () => fitRawCalibration(validationLayout(9, display).map((t) => ({ raw: toRaw(t.x, t.y), target: t })), display).params;

function intake() {
  const gaze: GazeRecord[] = [];
  const messages: MessageRecord[] = [];
  const clock = new ManualClock(1e9);
  const i = new GazeIntake({ appendGaze: (r) => gaze.push(r), appendMessage: (r) => messages.push(r) }, () => clock.nowNs());
  return { i, gaze, messages, clock };
}

describe('Gazeloom’s calibration applied live to a raw-coordinate source (GazeIntake)', () => {
  it('records, monitors and taps raw samples as they come until a calibration is set, then in screen px', () => {
    const { i, gaze, clock } = intake();
    const tapped: GazeRecord[] = [];
    i.tap((r) => tapped.push(r));
    i.hello(rawHello, 'udp://127.0.0.1:1');
    const raw = toRaw(1500, 300);
    i.sample(sampleAt(0, raw), hostNs(clock.nowNs()));
    expect(gaze[0]!.left).toMatchObject({ x: raw.x, y: raw.y });
    i.setCalibration(calibration());
    expect(i.mapping).toBe(true);
    clock.advanceMs(4);
    i.sample(sampleAt(1, raw), hostNs(clock.nowNs()));
    // The quadratic fitted on the 9 layout points inverts the tracker's map to within a few px.
    expect(Math.hypot(gaze[1]!.left!.x - 1500, gaze[1]!.left!.y - 300)).toBeLessThan(3);
    expect(gaze[1]!.right).toEqual({ ...gaze[1]!.left, pupil: 3 });
    expect(tapped[1]).toEqual(gaze[1]);
    expect(i.monitor.figures(clock.nowNs(), true).trail.at(-1)).toEqual({ x: gaze[1]!.left!.x, y: gaze[1]!.left!.y });
    // An invalid sample stays invalid, with its eye as sent; a missing eye stays missing.
    clock.advanceMs(4);
    i.sample(sampleAt(2, { x: Number.NaN, y: Number.NaN }, false), hostNs(clock.nowNs()));
    expect(gaze[2]!.left).toMatchObject({ valid: false });
    expect(Number.isNaN(gaze[2]!.left!.x)).toBe(true);
    expect(gaze[2]!.right).toBeNull();
    i.setCalibration(null);
    i.sample(sampleAt(3, raw), hostNs(clock.nowNs()));
    expect(gaze[3]!.left).toMatchObject({ x: raw.x, y: raw.y });
  });

  it('maps with exactly the fitted polynomial, and only while the hello says raw', () => {
    const { i, gaze, clock } = intake();
    const params = calibration();
    i.hello(rawHello, 'p');
    i.setCalibration(params);
    i.sample(sampleAt(0, { x: 0.05, y: -0.03 }), hostNs(clock.nowNs()));
    expect(gaze[0]!.left).toMatchObject(applyRawCalibration(params, 0.05, -0.03));
    i.hello({ ...rawHello, units: 'screen_px', screen: { widthPx: 1920, heightPx: 1080 } }, 'p');
    expect(i.mapping).toBe(false);
    i.sample(sampleAt(1, { x: 700, y: 400 }), hostNs(clock.nowNs()));
    expect(gaze[1]!.left).toMatchObject({ x: 700, y: 400 });
  });
});

describe('setGazeCalibration on the live session', () => {
  function session() {
    const { dataDir, log, clock, live, messages } = inMemoryLiveSession('gz-gazecal-');
    const dispatch = createDispatcher({ setGazeCalibration: channels.setGazeCalibration }, liveHandlers(live, new RecoveredSessions(join(dataDir, 'recordings'))), log);
    const call = (payload: unknown) => dispatch('setGazeCalibration', payload, { page: 'console', connectionId: 'c' });
    return { live, clock, messages, call };
  }

  it('refuses without a recording, and refuses params for a source already on the screen', async () => {
    const s = session();
    expect(await s.call({ params: null, calibrationId: null })).toMatchObject({ ok: false, code: 'conflict', message: expect.stringMatching(/no recording is running/) });
    await s.live.startRecording({ kind: 'simulated', seed: 1, rateHz: 250 }, display);
    s.clock.advanceMs(100);
    s.live.advanceSimulatedTracker(hostNs(s.clock.nowNs()));
    expect(await s.call({ params: calibration(), calibrationId: 'cal-1' })).toMatchObject({ ok: false, code: 'conflict', message: expect.stringMatching(/sends screen_px, not raw coordinates/) });
    // Clearing is always allowed; when nothing was set it records nothing.
    expect(await s.call({ params: null, calibrationId: null })).toEqual({ ok: true, value: { sourceUnits: 'screen_px', mapping: false } });
    expect(s.messages.filter((m) => m.kind === 'gaze_calibration_set')).toEqual([]);
    expect(s.live.gazeContext()?.units).toBe('screen_px');
    await s.live.dispose();
  });

  it('validates the params at the boundary', async () => {
    const s = session();
    const bad = { ...calibration(), ax: [1, 2, 3] };
    expect(await s.call({ params: bad, calibrationId: null })).toMatchObject({ ok: false, code: 'invalid_request' });
    await s.live.dispose();
  });
});

describe('a resumed recording maps with the calibration it had', () => {
  async function messagesOf(dir: string): Promise<MessageRecord[]> {
    const out: MessageRecord[] = [];
    for await (const m of (await readSession(dir)).messages()) out.push(m);
    return out;
  }

  it('reads the last gaze_calibration_set of a session folder, and applies it again when the recording is resumed', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-gazecal-resume-'));
    const log = createHostLog({ file: null, echo: false });
    const clock = new ManualClock(20e9);
    const options = { clock, syncEveryFlushes: 0 };
    const live = new LiveSession({
      clock,
      log,
      store: new StimulusStore(dataDir, log),
      recordingsDir: join(dataDir, 'recordings'),
      openRecorder: (dir, meta) => SessionRecorder.create(dir, { sessionId: String(meta.sessionId), display: meta.display as never, metadata: meta }, options),
      reopenRecorder: async (dir) => {
        const recorder = await SessionRecorder.reopen(dir, options);
        const { sessionId, display, metadata } = recorder.info;
        return { recorder, sessionId, display: displayGeometry.parse(display), source: gazeSourceChoice.parse(metadata.source) };
      },
      toStage: { command: () => {}, events: () => {} },
      publish: () => {},
      simulatedDrive: 'manual',
    });
    const { dir } = await live.startRecording({ kind: 'simulated', seed: 1, rateHz: 250 }, display);
    const params = calibration();
    live.recordMessage('gaze_calibration_set', { params, calibrationId: 'cal-1', sourceUnits: 'raw' });
    await live.stopRecording();
    expect(await lastGazeCalibration(dir)).toEqual(params);

    await live.resumeRecording(dir);
    // The restored calibration is in force: clearing it is a change, and is recorded.
    expect(live.setGazeCalibration(null, null)).toEqual({ sourceUnits: 'screen_px', mapping: false });
    await live.stopRecording();
    const kinds = (await messagesOf(dir)).filter((m) => m.kind === 'gaze_calibration_set').map((m) => m.data);
    expect(kinds).toEqual([
      { params, calibrationId: 'cal-1', sourceUnits: 'raw' },
      { params, calibrationId: null, sourceUnits: null, resumed: true },
      { params: null, calibrationId: null, sourceUnits: 'screen_px' },
    ]);
    // Cleared last: a later resume maps nothing.
    expect(await lastGazeCalibration(dir)).toBeNull();
    await live.dispose();
  });
});
