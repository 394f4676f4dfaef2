import type { RecordOf, SessionRecord, TargetResult, TrialRecord, ValidationRecord } from '../../../app/core/study/records';
import type { RunnerStep } from '../../../app/core/study/session-runner';

/** Host times of one step's latest attempt, kept by the console while it runs the step. */
export interface StepTimes {
  startedHostNs: number | null;
  endedHostNs: number | null;
}

export const trialId = (sessionId: string, index: number): string => `${sessionId}-trial-${index}`;

/**
 * The trial record of a runner step. A step that is running is stored as 'pending' with its
 * start time, so a session recovered after a crash repeats it from its beginning.
 */
export function trialFromStep(sessionId: string, step: RunnerStep, times: StepTimes | undefined): TrialRecord {
  return {
    id: trialId(sessionId, step.index),
    sessionId,
    index: step.index,
    kind: step.kind,
    stimulusId: step.stimulusId,
    state: step.state === 'running' ? 'pending' : step.state,
    startedHostNs: times?.startedHostNs ?? null,
    endedHostNs: step.state === 'running' || step.state === 'pending' ? null : (times?.endedHostNs ?? null),
    badReason: step.state === 'bad' ? step.badReason : null,
  };
}

/** The trial records whose stored form changed between two runner states. */
export function changedTrials(sessionId: string, before: readonly RunnerStep[], after: readonly RunnerStep[], times: ReadonlyMap<number, StepTimes>): TrialRecord[] {
  const old = new Map(before.map((s) => [s.index, s]));
  return after
    .filter((s) => {
      const o = old.get(s.index);
      return !o || o.state !== s.state || o.badReason !== s.badReason || o.attempts !== s.attempts;
    })
    .map((s) => trialFromStep(sessionId, s, times.get(s.index)));
}

export function validationFromPoints(input: {
  sessionId: string;
  step: RunnerStep;
  kind: ValidationRecord['kind'];
  points: TargetResult[];
  hostNs: number;
  meanAccuracyDeg: number | null;
  maxAccuracyDeg: number | null;
  accepted: boolean;
  at: string;
}): ValidationRecord {
  const trial = trialId(input.sessionId, input.step.index);
  return {
    id: `${trial}-${input.kind}-${input.step.attempts}`,
    sessionId: input.sessionId,
    trialId: trial,
    kind: input.kind,
    at: input.at,
    hostNs: input.hostNs,
    points: input.points,
    meanAccuracyDeg: input.meanAccuracyDeg,
    maxAccuracyDeg: input.maxAccuracyDeg,
    accepted: input.accepted,
  };
}

/**
 * Trackers that calibrate themselves get the targets on the feed's control channel
 * ('tracker', the default); sources that send raw coordinates are calibrated by Gazeloom
 * ('polynomial2', each point's accuracy then its residual).
 */
export function calibrationFromPoints(input: { sessionId: string; step: RunnerStep; points: TargetResult[]; hostNs: number; at: string; method?: RecordOf<'calibrations'>['method'] }): RecordOf<'calibrations'> {
  const trial = trialId(input.sessionId, input.step.index);
  return { id: `${trial}-calibration-${input.step.attempts}`, sessionId: input.sessionId, trialId: trial, at: input.at, hostNs: input.hostNs, method: input.method ?? 'tracker', points: input.points };
}

/** The session record when the session ends: completed when every step was run, otherwise aborted. */
export function endedSession(session: SessionRecord, finished: boolean, at: string): SessionRecord {
  return { ...session, state: finished ? 'completed' : 'aborted', endedAt: at };
}
