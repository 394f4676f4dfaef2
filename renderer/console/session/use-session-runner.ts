import { useEffect, useReducer, useRef, useState } from 'react';
import type { GazeloomApi } from '../../../app/contract';
import type { ProtocolRecord, SessionRecord } from '../../../app/core/study/records';
import { runnerReducer, type RunnerAction, type RunnerState, type RunnerStep } from '../../../app/core/study/session-runner';
import type { LabStore } from '../../db/lab-store';
import { calibrationFromPoints, changedTrials, validationFromPoints, type StepTimes } from './session-records';
import { describeCalibration, runCalibration, type RawCalibrationResult } from './calibration-step';
import { describeOutcome, hostNow, playbackEnded, runTargets, wait } from './step-actions';

export interface RunContext {
  readonly api: GazeloomApi;
  readonly store: LabStore;
  readonly operatorId: string | null;
  readonly session: SessionRecord;
  readonly protocol: ProtocolRecord;
  /** Clips that may flash: each is preceded by a warning the operator must answer. */
  readonly flashing?: ReadonlySet<string>;
}

/** What the running step shows the operator. */
export type Activity =
  | { kind: 'targets'; label: string }
  | { kind: 'clip'; stimulusId: string }
  | { kind: 'flashWarning'; stimulusId: string }
  | { kind: 'rest'; endsAtMs: number }
  | { kind: 'message'; text: string }
  | null;

/**
 * Runs a session's steps with the pure runner (app/core/study/session-runner): the step at
 * the cursor is carried out on the host when it starts, and stopped on the host when the
 * operator pauses, skips or ends. Every change of a step is written to the lab database as
 * it happens, so a crash loses nothing that was finished.
 */
export function useSessionRunner(ctx: RunContext, initial: RunnerState) {
  const { api, store, session, protocol, operatorId } = ctx;
  const [state, dispatch] = useReducer(runnerReducer, initial);
  const [activity, setActivity] = useState<Activity>(null);
  const [lastResult, setLastResult] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  /** The residuals of Gazeloom's latest raw-coordinate calibration, for the operator to judge. */
  const [calibrationFit, setCalibrationFit] = useState<RawCalibrationResult | null>(null);
  const times = useRef(new Map<number, StepTimes>());
  const stored = useRef<RunnerStep[]>(initial.steps);
  const proceed = useRef<(() => void) | null>(null);
  const audit = (action: string, summary: string) => ({ operatorId, action, summary });
  /** Waits for Enter (proceedNow) or the step's end. */
  const untilProceed = (signal: AbortSignal) =>
    new Promise<void>((resolve) => {
      proceed.current = resolve;
      signal.addEventListener('abort', () => resolve(), { once: true });
    }).finally(() => {
      proceed.current = null;
    });

  // Write each trial whose state changed.
  useEffect(() => {
    const changed = changedTrials(session.id, stored.current, state.steps, times.current);
    stored.current = state.steps;
    if (changed.length === 0) return;
    store.putMany(changed.map((record) => ({ table: 'trials' as const, record })), audit('session_step', `trials ${changed.map((t) => `${t.index}:${t.state}`).join(', ')}`)).catch((error: Error) => setFailure(`Could not save the trials: ${error.message}`));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state.steps]);

  const current = state.phase === 'running' ? state.steps[state.cursor] : undefined;
  const runKey = current ? `${current.index}:${current.attempts}` : null;

  useEffect(() => {
    if (!current) return;
    const step = current;
    const abort = new AbortController();
    let settled = false;
    const finish = (actions: RunnerAction[], endedHostNs: number | null) => {
      if (abort.signal.aborted) return;
      settled = true;
      const t = times.current.get(step.index);
      times.current.set(step.index, { startedHostNs: t?.startedHostNs ?? null, endedHostNs });
      setActivity(null);
      actions.forEach(dispatch);
    };
    const stopHere = (message: string) => {
      if (abort.signal.aborted) return;
      settled = true;
      setActivity(null);
      setFailure(message);
      dispatch({ type: 'pause' });
    };
    void (async () => {
      setFailure(null);
      const startedHostNs = await hostNow(api);
      times.current.set(step.index, { startedHostNs, endedHostNs: null });
      if (step.kind === 'calibrate') {
        setActivity({ kind: 'targets', label: 'Calibrating' });
        const r = await runCalibration(api, protocol, session);
        if (abort.signal.aborted) return;
        if (!r.ok) return stopHere(`calibrate stopped: ${r.message}`);
        const { points, startedHostNs: calibratedFromNs, endedHostNs, method, raw } = r.value;
        times.current.set(step.index, { startedHostNs: calibratedFromNs, endedHostNs });
        setLastResult(describeCalibration(r.value));
        setCalibrationFit(raw);
        const record = calibrationFromPoints({ sessionId: session.id, step, points, hostNs: calibratedFromNs, at: new Date().toISOString(), method });
        try {
          await store.put('calibrations', record, audit('calibrate', `trial ${step.index}: ${method}`));
        } catch (error) {
          return stopHere(`Could not save the result: ${(error as Error).message}`);
        }
        if (raw) {
          // Applied live only once its record is stored: the session's messages name it.
          const applied = await api.setGazeCalibration({ params: raw.params, calibrationId: record.id });
          if (!applied.ok) return stopHere(`The calibration was not applied: ${applied.message}`);
        }
        return finish([{ type: 'stepDone' }], endedHostNs);
      }
      if (step.kind === 'validate' || step.kind === 'drift_check') {
        setActivity({ kind: 'targets', label: step.kind === 'validate' ? 'Validating' : 'Drift check' });
        const r = await runTargets(api, step.kind, protocol, session.display);
        if (abort.signal.aborted) return;
        if (!r.ok) return stopHere(`${step.kind.replace('_', ' ')} stopped: ${r.message}`);
        const { points, endedHostNs, quality } = r.value;
        times.current.set(step.index, { startedHostNs: r.value.startedHostNs, endedHostNs });
        const at = new Date().toISOString();
        setLastResult(describeOutcome(step, r.value));
        try {
          const q = quality;
          const kind = step.kind === 'validate' ? 'validation' : 'drift_check';
          const record = validationFromPoints({ sessionId: session.id, step, kind, points, hostNs: r.value.startedHostNs, meanAccuracyDeg: q.meanAccuracyDeg, maxAccuracyDeg: q.maxAccuracyDeg, accepted: q.accepted, at });
          await store.put('validations', record, audit(kind, `trial ${step.index}: ${q.accepted ? 'accepted' : 'not accepted'}`));
          return finish([{ type: 'qualityResult', accepted: q.accepted, reason: q.reasons.join('; ') }, { type: 'stepDone' }], endedHostNs);
        } catch (error) {
          return stopHere(`Could not save the result: ${(error as Error).message}`);
        }
      }
      if (step.kind === 'clip') {
        if (ctx.flashing?.has(step.stimulusId ?? '')) {
          // Always a warning before a clip that may flash: it plays only when the operator says so.
          setActivity({ kind: 'flashWarning', stimulusId: step.stimulusId ?? '' });
          await untilProceed(abort.signal);
          if (abort.signal.aborted) return;
        }
        setActivity({ kind: 'clip', stimulusId: step.stimulusId ?? '' });
        const r = await api.playClip({ stimulusId: step.stimulusId ?? '', speed: protocol.speed, look: protocol.look, placement: 'fit', photodiode: false });
        if (abort.signal.aborted) return;
        if (!r.ok) return stopHere(`The clip did not start: ${r.message}`);
        await playbackEnded(api, r.value.playbackId, abort.signal);
        return finish([{ type: 'stepDone' }], await hostNow(api));
      }
      if (step.kind === 'rest') {
        const ms = (step.seconds ?? 0) * 1000;
        setActivity({ kind: 'rest', endsAtMs: Date.now() + ms });
        await wait(ms, abort.signal);
        // The rest clock hears the rest's end before the step ends, so the whole rest counts.
        return finish([{ type: 'tick', atS: performance.now() / 1000 }, { type: 'stepDone' }], await hostNow(api));
      }
      setActivity({ kind: 'message', text: step.text ?? '' });
      await untilProceed(abort.signal);
      return finish([{ type: 'stepDone' }], await hostNow(api));
    })();
    return () => {
      abort.abort();
      if (settled) return;
      // Interrupted (pause, skip or end): stop what the step had started on the stage.
      setActivity(null);
      if (step.kind === 'clip') void api.stopPlayback({});
      else if (step.kind === 'calibrate' || step.kind === 'validate' || step.kind === 'drift_check') void api.cancelTargetProcedure({});
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [runKey]);

  // The rest limits' clock (app/core/study/rest-limits.ts), once a second while the session runs.
  const live = state.phase !== 'finished';
  useEffect(() => {
    if (!live) return;
    const tick = () => dispatch({ type: 'tick', atS: performance.now() / 1000 });
    tick();
    const timer = setInterval(tick, 1000);
    return () => clearInterval(timer);
  }, [live]);

  /** Enter: begin, go on after a message screen, or continue without recalibrating. */
  const proceedNow = () => {
    if (state.phase === 'ready') dispatch({ type: 'begin' });
    else if (state.phase === 'prompt') dispatch({ type: 'dismissPrompt' });
    else proceed.current?.();
  };
  return { state, dispatch, activity, lastResult, failure, proceedNow, times: times.current, calibrationFit };
}
