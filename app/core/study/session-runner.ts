/**
 * The pure state machine of a running session: (state, action) → state, never mutating.
 *
 * - `begin` starts the first step; `stepDone` completes the running step and starts the next.
 * - For a validation or drift check, send `qualityResult` first, then `stepDone`. A rejected
 *   result raises the recalibration prompt: the next step does not start until the operator
 *   answers with `recalibrate`, `repeatValidation` or `dismissPrompt` (an answer also
 *   completes the check if `stepDone` did not come).
 * - `pause` interrupts the running step; `resume` starts it again from its beginning
 *   (`attempts` counts how often a step was started).
 * - `skip` passes over the running step (or, when not running, the step at the cursor).
 * - `repeatValidation` and `recalibrate` insert steps where the session has got to: after
 *   the running step, else before the step at the cursor. Inserted steps take the next free
 *   index, so the index of every earlier trial record stays as it was.
 * - `markBad` (by step index) marks a finished step bad, or the running step once it ends.
 * - `tick` (seconds on a monotonic clock, about once a second) advances the rest clock
 *   (rest-limits.ts): once viewing since the last rest reaches the protocol's limit, a rest
 *   step of the required length is inserted before the next clip, and it cannot be skipped.
 * Actions that do not apply in the current phase leave the state as it is.
 */
import type { TrialRecord } from './records';
import { carriedFromTrials, DEFAULT_REST_LIMITS, restClock, restEnded, tickRest, type RestClock, type RestLimits } from './rest-limits';
import type { PlannedStep } from './session-plan';

export type RunnerPhase = 'ready' | 'running' | 'paused' | 'prompt' | 'finished';

export interface RunnerStep extends PlannedStep {
  state: 'pending' | 'running' | 'done' | 'skipped' | 'bad';
  attempts: number;
  badReason: string | null;
}

export interface RunnerState {
  steps: RunnerStep[];
  cursor: number;
  phase: RunnerPhase;
  prompt: null | { kind: 'recalibrate'; reason: string };
  rest: RestClock;
}

export type RunnerAction =
  | { type: 'begin' }
  | { type: 'stepDone' }
  | { type: 'skip' }
  | { type: 'pause' }
  | { type: 'resume' }
  | { type: 'repeatValidation' }
  | { type: 'recalibrate' }
  | { type: 'markBad'; index: number; reason: string }
  | { type: 'qualityResult'; accepted: boolean; reason: string }
  | { type: 'dismissPrompt' }
  | { type: 'tick'; atS: number };

/** The longest bad-trial reason a trial record keeps. */
const MAX_REASON = 500;

const isFinished = (s: RunnerStep): boolean => s.state === 'done' || s.state === 'skipped' || s.state === 'bad';
const measuresQuality = (s: RunnerStep | undefined): boolean => s?.state === 'running' && (s.kind === 'validate' || s.kind === 'drift_check');

export function startRunner(steps: PlannedStep[], limits: RestLimits = DEFAULT_REST_LIMITS): RunnerState {
  assertUniqueIndexes(steps);
  const runnerSteps = steps.map((s): RunnerStep => ({ ...s, state: 'pending', attempts: 0, badReason: null }));
  return { steps: runnerSteps, cursor: 0, phase: runnerSteps.length > 0 ? 'ready' : 'finished', prompt: null, rest: restClock(limits) };
}

const tickKind = (state: RunnerState): 'clip' | 'rest' | 'other' | null => {
  if (state.phase !== 'running') return null;
  const kind = state.steps[state.cursor]?.kind;
  return kind === 'clip' || kind === 'rest' ? kind : 'other';
};

/** The required rest cannot be skipped, running or waiting at the cursor. */
const isRequiredRest = (state: RunnerState): boolean => state.rest.requiredRestIndex !== null && state.steps[state.cursor]?.index === state.rest.requiredRestIndex;

export function runnerReducer(state: RunnerState, action: RunnerAction): RunnerState {
  const current = state.steps[state.cursor];
  switch (action.type) {
    case 'begin':
      return state.phase === 'ready' ? startFrom(state, state.cursor) : state;
    case 'stepDone':
      if (state.phase === 'running') {
        const finished = finishCurrent(state, 'done');
        return startFrom(current.kind === 'rest' ? { ...finished, rest: restEnded(finished.rest) } : finished, state.cursor + 1);
      }
      return state.phase === 'prompt' ? settlePrompt(state) : state;
    case 'skip':
      if (isRequiredRest(state)) return state;
      if (state.phase === 'running') return startFrom(finishCurrent(state, 'skipped'), state.cursor + 1);
      if (state.phase === 'ready' || state.phase === 'paused') return skipAtCursor(state);
      return state;
    case 'pause':
      // The interrupted step will be shown again from its start, so a bad mark on it lapses.
      return state.phase === 'running' ? { ...replaceStep(state, state.cursor, { state: 'pending', badReason: null }), phase: 'paused' } : state;
    case 'resume':
      return state.phase === 'paused' ? startFrom(state, state.cursor) : state;
    case 'repeatValidation':
      return insertSteps(state, ['validate']);
    case 'recalibrate':
      return insertSteps(state, ['calibrate', 'validate']);
    case 'markBad':
      return markBad(state, action.index, action.reason);
    case 'qualityResult':
      if (state.phase !== 'running' || !measuresQuality(current) || action.accepted) return state;
      return { ...state, phase: 'prompt', prompt: { kind: 'recalibrate', reason: action.reason } };
    case 'dismissPrompt':
      return state.phase === 'prompt' ? answerPrompt(settlePrompt(state), state.cursor) : state;
    case 'tick':
      return { ...state, rest: tickRest(state.rest, action.atS, tickKind(state)) };
  }
}

function assertUniqueIndexes(steps: readonly PlannedStep[]): void {
  const seen = new Set<number>();
  for (const s of steps) {
    if (seen.has(s.index)) throw new Error(`two planned steps have index ${s.index}`);
    seen.add(s.index);
  }
}

function replaceStep(state: RunnerState, position: number, patch: Partial<RunnerStep>): RunnerState {
  return { ...state, steps: state.steps.map((s, i) => (i === position ? { ...s, ...patch } : s)) };
}

const nextPending = (steps: readonly RunnerStep[], from: number): number => {
  const found = steps.findIndex((s, i) => i >= from && s.state === 'pending');
  return found < 0 ? steps.length : found;
};

/** Starts the first pending step at or after `from` (a due rest first, if it is a clip), or finishes the session. */
function startFrom(state: RunnerState, from: number): RunnerState {
  const position = nextPending(state.steps, from);
  if (position >= state.steps.length) return { ...state, cursor: state.steps.length, phase: 'finished', prompt: null };
  const base = state.rest.restDue && state.rest.requiredRestIndex === null && state.steps[position].kind === 'clip' ? insertRequiredRest(state, position) : state;
  const started = replaceStep(base, position, { state: 'running', attempts: base.steps[position].attempts + 1 });
  return { ...started, cursor: position, phase: 'running', rest: { ...base.rest, restRunS: 0 } };
}

function insertRequiredRest(state: RunnerState, at: number): RunnerState {
  const index = Math.max(-1, ...state.steps.map((s) => s.index)) + 1;
  const rest: RunnerStep = { index, kind: 'rest', stimulusId: null, seconds: state.rest.limits.requiredRestMin * 60, text: null, block: null, state: 'pending', attempts: 0, badReason: null };
  return { ...state, steps: [...state.steps.slice(0, at), rest, ...state.steps.slice(at)], rest: { ...state.rest, requiredRestIndex: index } };
}

/** Ends the running step; one marked bad while it ran ends as bad. */
function finishCurrent(state: RunnerState, outcome: 'done' | 'skipped'): RunnerState {
  const current = state.steps[state.cursor];
  return replaceStep(state, state.cursor, { state: outcome === 'done' && current.badReason !== null ? 'bad' : outcome });
}

/** In the prompt, completes a check still running and moves the cursor on without starting anything. */
function settlePrompt(state: RunnerState): RunnerState {
  if (state.steps[state.cursor]?.state !== 'running') return state;
  const finished = finishCurrent(state, 'done');
  return { ...finished, cursor: nextPending(finished.steps, state.cursor + 1) };
}

function answerPrompt(state: RunnerState, from: number): RunnerState {
  return startFrom({ ...state, prompt: null }, from);
}

function skipAtCursor(state: RunnerState): RunnerState {
  if (state.steps[state.cursor]?.state !== 'pending') return state;
  const skipped = replaceStep(state, state.cursor, { state: 'skipped' });
  const cursor = nextPending(skipped.steps, state.cursor + 1);
  return cursor >= skipped.steps.length ? { ...skipped, cursor, phase: 'finished' } : { ...skipped, cursor };
}

function insertSteps(state: RunnerState, kinds: ('calibrate' | 'validate')[]): RunnerState {
  if (state.phase === 'finished') return state;
  const base = state.phase === 'prompt' ? settlePrompt(state) : state;
  const at = base.cursor + (base.phase === 'running' ? 1 : 0);
  let nextIndex = Math.max(-1, ...base.steps.map((s) => s.index)) + 1;
  const inserted = kinds.map((kind): RunnerStep => ({ index: nextIndex++, kind, stimulusId: null, seconds: null, text: null, block: null, state: 'pending', attempts: 0, badReason: null }));
  const withInserted = { ...base, steps: [...base.steps.slice(0, at), ...inserted, ...base.steps.slice(at)] };
  // Answering the prompt this way resolves it: the inserted steps start at once.
  return state.phase === 'prompt' ? answerPrompt(withInserted, at) : withInserted;
}

function markBad(state: RunnerState, index: number, reason: string): RunnerState {
  const position = state.steps.findIndex((s) => s.index === index);
  if (position < 0) throw new RangeError(`no step has index ${index}`);
  const target = state.steps[position];
  const badReason = reason.trim().slice(0, MAX_REASON) || 'marked bad';
  if (target.state === 'running') return replaceStep(state, position, { badReason });
  if (target.state === 'done' || target.state === 'bad') return replaceStep(state, position, { state: 'bad', badReason });
  return state;
}

/**
 * The runner of a session recovered after a crash: states from its trial records (matched by
 * index), the cursor at the first unfinished step, phase 'ready' (or 'finished'). Steps
 * inserted during the session are put back: finished ones among the history by the time they
 * ended (steps end in their order), unfinished ones just before the step the session resumes at.
 */
export function resumeRunner(steps: PlannedStep[], trials: TrialRecord[], limits: RestLimits = DEFAULT_REST_LIMITS): RunnerState {
  assertUniqueIndexes(steps);
  const byIndex = new Map<number, TrialRecord>();
  for (const t of trials) {
    if (byIndex.has(t.index)) throw new Error(`two trial records have index ${t.index}`);
    byIndex.set(t.index, t);
  }
  const planned = steps.map((s) => {
    const t = byIndex.get(s.index);
    if (t && (t.kind !== s.kind || t.stimulusId !== s.stimulusId)) {
      throw new Error(`trial ${s.index} is a ${t.kind} (${t.stimulusId ?? 'no stimulus'}) but the plan has a ${s.kind} (${s.stimulusId ?? 'no stimulus'}) there: the plan does not belong to this session`);
    }
    return fromTrial(s, t);
  });
  const plannedIndexes = new Set(steps.map((s) => s.index));
  const insertedTrials = trials.filter((t) => !plannedIndexes.has(t.index));
  const inserted = insertedTrials.map((t) => fromTrial({ index: t.index, kind: t.kind, stimulusId: t.stimulusId, seconds: null, text: null, block: null }, t));
  const byTime = (a: { time: number; step: RunnerStep }, b: { time: number; step: RunnerStep }): number => a.time - b.time || a.step.index - b.step.index;
  const timeOf = (step: RunnerStep): number => {
    const t = byIndex.get(step.index);
    return t?.endedHostNs ?? t?.startedHostNs ?? Number.POSITIVE_INFINITY;
  };
  const finishedInserted = inserted.filter(isFinished).map((step) => ({ time: timeOf(step), step })).sort(byTime);
  const open = inserted.filter((s) => !isFinished(s)).sort((a, b) => a.index - b.index);

  const split = planned.findIndex((s) => !isFinished(s));
  const history = split < 0 ? planned : planned.slice(0, split);
  const rest = split < 0 ? [] : planned.slice(split);
  const merged: RunnerStep[] = [];
  for (const step of history) {
    const time = timeOf(step);
    while (finishedInserted.length > 0 && Number.isFinite(time) && finishedInserted[0].time < time) merged.push(finishedInserted.shift()!.step);
    merged.push(step);
  }
  const all = [...merged, ...finishedInserted.map((f) => f.step), ...open, ...rest];
  const cursor = all.findIndex((s) => !isFinished(s));
  const clock = restClock(limits, carriedFromTrials(trials, limits));
  // A rest inserted because one was due and not yet taken stays required.
  const dueRest = clock.restDue ? open.find((s) => s.kind === 'rest') : undefined;
  const restState = { ...clock, requiredRestIndex: dueRest?.index ?? null };
  return cursor < 0 ? { steps: all, cursor: all.length, phase: 'finished', prompt: null, rest: restState } : { steps: all, cursor, phase: 'ready', prompt: null, rest: restState };
}

function fromTrial(s: PlannedStep, t: TrialRecord | undefined): RunnerStep {
  if (!t) return { ...s, state: 'pending', attempts: 0, badReason: null };
  const started = t.startedHostNs !== null || t.state === 'done' || t.state === 'bad';
  return { ...s, state: t.state, attempts: started ? 1 : 0, badReason: t.badReason };
}
