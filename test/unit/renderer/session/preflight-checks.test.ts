import { describe, expect, it } from 'vitest';
import type { LiveStatus, StageStatusEvent } from '../../../../app/contract';
import type { PlannedStep } from '../../../../app/core/study/session-plan';
import { allPassed, evaluatePreflight, expectedSessionSeconds } from '../../../../renderer/console/session/preflight-checks';

const display = { widthMm: 530, heightMm: 298, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
const stage: StageStatusEvent = { connected: true, visible: true, width: 1920, height: 1080, devicePixelRatio: 1, renderer: 'webgl2' };
const disk = { freeBytes: 10 * 2 ** 30, neededBytes: 2 ** 30, recordingsDir: '/data/recordings' };
const live = (source: Partial<NonNullable<LiveStatus['source']>>, measuredRateHz: number | null): LiveStatus =>
  ({
    recording: { sessionId: 's', dir: '/d', samples: 10, frames: 0 },
    source: { kind: 'simulated', description: 'Simulated tracker', connected: true, nominalRateHz: 500, ...source },
    measuredRateHz,
  }) as LiveStatus;
const state = (input: Parameters<typeof evaluatePreflight>[0]) => Object.fromEntries(evaluatePreflight(input).map((c) => [c.id, c.state]));

describe('the pre-flight checks', () => {
  it('pass when the display is set, the stage visible, the disk roomy and the gaze at its nominal rate', () => {
    const checks = evaluatePreflight({ display, stage, disk, live: live({}, 498) });
    expect(checks.map((c) => c.state)).toEqual(['ok', 'ok', 'ok', 'ok']);
    expect(allPassed(checks)).toBe(true);
  });

  it('fail each for its own reason', () => {
    expect(state({ display: { ...display, distanceMm: 0 }, stage, disk, live: null }).display).toBe('failed');
    expect(state({ display, stage: null, disk, live: null }).stage).toBe('failed');
    expect(state({ display, stage: { ...stage, visible: false }, disk, live: null }).stage).toBe('failed');
    expect(state({ display, stage: { ...stage, width: 1280, height: 720 }, disk, live: null }).stage).toBe('failed');
    expect(state({ display, stage, disk: { ...disk, freeBytes: disk.neededBytes - 1 }, live: null }).disk).toBe('failed');
    expect(state({ display, stage, disk: { ok: false, code: 'unavailable', message: 'no statfs' }, live: null }).disk).toBe('failed');
    // 10 % tolerance around the nominal 500 Hz.
    expect(state({ display, stage, disk, live: live({}, 449) }).gaze).toBe('failed');
    expect(state({ display, stage, disk, live: live({}, 551) }).gaze).toBe('failed');
    expect(state({ display, stage, disk, live: live({}, 451) }).gaze).toBe('ok');
  });

  it('wait while there is nothing to judge yet', () => {
    expect(state({ display, stage, disk: null, live: null })).toMatchObject({ disk: 'waiting', gaze: 'waiting' });
    expect(state({ display, stage, disk, live: live({ connected: false }, null) }).gaze).toBe('waiting');
    expect(state({ display, stage, disk, live: live({}, null) }).gaze).toBe('waiting');
    expect(allPassed(evaluatePreflight({ display, stage, disk, live: null }))).toBe(false);
  });

  it('accept a source that never said its rate as long as samples arrive', () => {
    expect(state({ display, stage, disk, live: live({ nominalRateHz: null }, 120) }).gaze).toBe('ok');
    expect(state({ display, stage, disk, live: live({ nominalRateHz: null }, 0) }).gaze).toBe('failed');
  });

  it('expect a session to take its clips at the protocol speed, its rests and its targets, with margin', () => {
    const step = (kind: PlannedStep['kind'], fields: Partial<PlannedStep> = {}): PlannedStep => ({ index: 0, kind, stimulusId: null, seconds: null, text: null, block: null, ...fields });
    const steps = [step('calibrate'), step('validate'), step('clip', { stimulusId: 'a' }), step('drift_check'), step('clip', { stimulusId: 'b' }), step('rest', { seconds: 20 })];
    // 5-point layouts at 1.5 s a target: 7.5 + 7.5; clips 10 s and 4 s at half speed: 28; drift check 1.5; rest 20.
    const raw = 7.5 + 7.5 + 28 + 1.5 + 20;
    expect(expectedSessionSeconds(steps, (id) => (id === 'a' ? 10 : 4), 5, 0.5)).toBe(Math.ceil(raw * 1.5 + 60));
  });
});
