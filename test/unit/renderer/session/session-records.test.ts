import { describe, expect, it } from 'vitest';
import { tables, type TargetResult } from '../../../../app/core/study/records';
import type { PlannedStep } from '../../../../app/core/study/session-plan';
import { resumeRunner, runnerReducer, startRunner, type RunnerState } from '../../../../app/core/study/session-runner';
import { calibrationFromPoints, changedTrials, endedSession, trialFromStep, validationFromPoints, type StepTimes } from '../../../../renderer/console/session/session-records';

const step = (index: number, kind: PlannedStep['kind'], stimulusId: string | null = null): PlannedStep => ({ index, kind, stimulusId, seconds: null, text: null, block: null });
const plan = [step(0, 'calibrate'), step(1, 'validate'), step(2, 'clip', 'aisle'), step(3, 'clip', 'beacon'), step(4, 'drift_check')];
const point: TargetResult = { x: 960, y: 540, accuracyDeg: 0.4, precisionRmsS2SDeg: 0.05, precisionSdDeg: 0.07, dataLossPct: 2, samples: 490, dxDeg: 0.3, dyDeg: -0.2 };

/** Runs actions through the reducer and keeps the trial records as the console writes them. */
function drive(initial: RunnerState, actions: Parameters<typeof runnerReducer>[1][], times: Map<number, StepTimes>) {
  const stored = new Map<string, ReturnType<typeof trialFromStep>>();
  let state = initial;
  for (const t of changedTrials('s1', [], state.steps, times)) stored.set(t.id, t);
  for (const action of actions) {
    const next = runnerReducer(state, action);
    const running = next.steps[next.cursor];
    if (running?.state === 'running') times.set(running.index, { startedHostNs: 1000 * (times.size + 1), endedHostNs: null });
    for (const t of changedTrials('s1', state.steps, next.steps, times)) stored.set(t.id, t);
    state = next;
  }
  return { state, trials: [...stored.values()] };
}

describe('the records a session writes', () => {
  it('are valid lab records', () => {
    const runner = runnerReducer(startRunner(plan), { type: 'begin' });
    const trial = trialFromStep('s1', runner.steps[0]!, { startedHostNs: 5, endedHostNs: null });
    expect(tables.trials.parse(trial)).toEqual(trial);
    expect(trial).toMatchObject({ id: 's1-trial-0', state: 'pending', startedHostNs: 5, endedHostNs: null });
    const validation = validationFromPoints({ sessionId: 's1', step: runner.steps[0]!, kind: 'validation', points: [point], hostNs: 7, meanAccuracyDeg: 0.4, maxAccuracyDeg: 0.4, accepted: true, at: '2026-03-02T10:00:00.000Z' });
    expect(tables.validations.parse(validation)).toEqual(validation);
    const calibration = calibrationFromPoints({ sessionId: 's1', step: runner.steps[0]!, points: [point], hostNs: 7, at: '2026-03-02T10:00:00.000Z' });
    expect(tables.calibrations.parse(calibration)).toEqual(calibration);
    const session = { id: 's1', studyId: 'st', participantId: 'p', protocolId: 'pr', protocolVersion: 1, operatorId: 'o', startedAt: '2026-03-02T10:00:00.000Z', endedAt: null, state: 'running' as const, counterbalance: { kind: 'none' as const, seed: null, row: null }, display: { widthMm: 1, heightMm: 1, widthPx: 1, heightPx: 1, distanceMm: 1 }, gazeSource: 'sim', demo: false };
    expect(endedSession(session, true, '2026-03-02T11:00:00.000Z')).toMatchObject({ state: 'completed', endedAt: '2026-03-02T11:00:00.000Z' });
    expect(endedSession(session, false, '2026-03-02T11:00:00.000Z').state).toBe('aborted');
  });

  it('let a session recovered after a crash go on at the next unfinished trial, with inserted steps kept', () => {
    const times = new Map<number, StepTimes>();
    // Calibrate, validate (rejected: recalibrate), the inserted calibration and validation, one clip; then the crash.
    const { state, trials } = drive(
      startRunner(plan),
      [
        { type: 'begin' },
        { type: 'stepDone' },
        { type: 'qualityResult', accepted: false, reason: 'mean accuracy 1.4° exceeds 1.0°' },
        { type: 'stepDone' },
        { type: 'recalibrate' },
        { type: 'stepDone' },
        { type: 'stepDone' },
        { type: 'stepDone' },
        { type: 'markBad', index: 2, reason: 'participant sneezed' },
      ],
      times,
    );
    expect(state.steps[state.cursor]).toMatchObject({ kind: 'clip', stimulusId: 'beacon', state: 'running' });
    for (const t of trials) expect(tables.trials.safeParse(t).success).toBe(true);
    const resumed = resumeRunner(plan, trials);
    expect(resumed.phase).toBe('ready');
    expect(resumed.steps[resumed.cursor]).toMatchObject({ kind: 'clip', stimulusId: 'beacon', state: 'pending' });
    expect(resumed.steps.map((s) => `${s.kind}:${s.state}`)).toEqual(['calibrate:done', 'validate:done', 'calibrate:done', 'validate:done', 'clip:bad', 'clip:pending', 'drift_check:pending']);
    expect(resumed.steps.find((s) => s.state === 'bad')?.badReason).toBe('participant sneezed');
  });

  it('write only the trials that changed', () => {
    const a = startRunner(plan);
    const b = runnerReducer(a, { type: 'begin' });
    expect(changedTrials('s1', a.steps, b.steps, new Map()).map((t) => t.index)).toEqual([0]);
    expect(changedTrials('s1', b.steps, b.steps, new Map())).toEqual([]);
  });
});
