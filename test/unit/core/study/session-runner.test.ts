import { describe, expect, it } from 'vitest';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import type { TrialRecord } from '../../../../app/core/study/records';
import { planSession, type PlannedStep } from '../../../../app/core/study/session-plan';
import { resumeRunner, runnerReducer, startRunner, type RunnerAction, type RunnerState } from '../../../../app/core/study/session-runner';
import { protocol, trial } from './study-records';

/** The session's state machine as the issue describes the console (common practice, no source). */
const plan: PlannedStep[] = planSession(
  protocol({
    steps: [{ kind: 'calibrate' }, { kind: 'validate' }, { kind: 'block', name: 'aisle', stimulusIds: ['forklift-crossing', 'conveyor-parcels', 'warning-beacon'] }, { kind: 'message', text: 'Thank you.' }],
    driftCheckEvery: 2,
  }),
  { enrolment: 1, seed: 1 },
).steps;
// 0 calibrate, 1 validate, 2 forklift, 3 conveyor, 4 drift check, 5 beacon, 6 message

const run = (state: RunnerState, ...actions: RunnerAction[]): RunnerState => actions.reduce(runnerReducer, state);
const done: RunnerAction = { type: 'stepDone' };
const kinds = (s: RunnerState): string[] => s.steps.map((x) => `${x.index}:${x.kind}:${x.state}`);
const current = (s: RunnerState) => s.steps[s.cursor];

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object') {
    Object.freeze(value);
    for (const v of Object.values(value)) deepFreeze(v);
  }
  return value;
}

describe('startRunner and the plain path', () => {
  it('starts ready at the first step, every step pending', () => {
    const s = startRunner(plan);
    expect(s.phase).toBe('ready');
    expect(s.cursor).toBe(0);
    expect(s.steps.every((x) => x.state === 'pending' && x.attempts === 0 && x.badReason === null)).toBe(true);
    expect(startRunner([]).phase).toBe('finished');
    expect(() => startRunner([plan[0], plan[0]])).toThrow(/two planned steps have index 0/);
  });

  it('runs every step in order to the end', () => {
    let s = run(startRunner(plan), { type: 'begin' });
    expect(current(s)).toMatchObject({ index: 0, state: 'running', attempts: 1 });
    for (let k = 0; k < plan.length; k++) s = runnerReducer(s, done);
    expect(s.phase).toBe('finished');
    expect(s.cursor).toBe(plan.length);
    expect(s.steps.every((x) => x.state === 'done' && x.attempts === 1)).toBe(true);
  });

  it('ignores actions that do not apply in the phase (the same state comes back)', () => {
    const ready = startRunner(plan);
    for (const a of [done, { type: 'pause' }, { type: 'resume' }, { type: 'dismissPrompt' }, { type: 'qualityResult', accepted: false, reason: 'x' }] as RunnerAction[]) {
      expect(runnerReducer(ready, a)).toBe(ready);
    }
    const running = run(ready, { type: 'begin' });
    expect(runnerReducer(running, { type: 'begin' })).toBe(running);
    expect(runnerReducer(running, { type: 'resume' })).toBe(running);
  });

  it('never mutates the state it is given', () => {
    let s = deepFreeze(startRunner(plan));
    const actions: RunnerAction[] = [{ type: 'begin' }, done, { type: 'qualityResult', accepted: false, reason: 'mean 1.4 deg' }, done, { type: 'recalibrate' }, { type: 'pause' }, { type: 'skip' }, { type: 'resume' }, { type: 'markBad', index: 0, reason: 'blink' }, { type: 'repeatValidation' }, done, done];
    for (const a of actions) s = deepFreeze(runnerReducer(s, a));
    expect(s.steps.find((x) => x.index === 0)?.state).toBe('bad');
  });
});

describe('validation and drift-check results', () => {
  const atValidate = run(startRunner(plan), { type: 'begin' }, done);

  it('lets an accepted result through and raises the recalibration prompt on a rejected one', () => {
    expect(current(atValidate).kind).toBe('validate');
    expect(runnerReducer(atValidate, { type: 'qualityResult', accepted: true, reason: '' })).toBe(atValidate);
    const prompted = runnerReducer(atValidate, { type: 'qualityResult', accepted: false, reason: 'mean accuracy 1.4 deg > 1.0 deg' });
    expect(prompted.phase).toBe('prompt');
    expect(prompted.prompt).toEqual({ kind: 'recalibrate', reason: 'mean accuracy 1.4 deg > 1.0 deg' });
    // The check completes, but the next clip waits for the operator's answer.
    const settled = runnerReducer(prompted, done);
    expect(settled.phase).toBe('prompt');
    expect(settled.steps[1].state).toBe('done');
    expect(current(settled)).toMatchObject({ index: 2, state: 'pending' });
    for (const a of [done, { type: 'skip' }, { type: 'pause' }, { type: 'begin' }] as RunnerAction[]) expect(runnerReducer(settled, a)).toBe(settled);
    const dismissed = runnerReducer(settled, { type: 'dismissPrompt' });
    expect(dismissed).toMatchObject({ phase: 'running', prompt: null, cursor: 2 });
    expect(current(dismissed).state).toBe('running');
  });

  it('ignores a result while no validation or drift check runs', () => {
    const atClip = run(atValidate, done);
    expect(current(atClip).kind).toBe('clip');
    expect(runnerReducer(atClip, { type: 'qualityResult', accepted: false, reason: 'x' })).toBe(atClip);
  });

  it('recalibrates in answer to the prompt: calibrate and validate with fresh indexes, started at once', () => {
    const prompted = run(atValidate, { type: 'qualityResult', accepted: false, reason: 'drift' });
    // Answered without a stepDone: the answer completes the check itself.
    const s = runnerReducer(prompted, { type: 'recalibrate' });
    expect(kinds(s).slice(0, 5)).toEqual(['0:calibrate:done', '1:validate:done', '7:calibrate:running', '8:validate:pending', '2:clip:pending']);
    expect(s).toMatchObject({ phase: 'running', prompt: null, cursor: 2 });
    const finished = run(s, ...Array<RunnerAction>(7).fill(done));
    expect(finished.phase).toBe('finished');
    expect(finished.steps.map((x) => x.index)).toEqual([0, 1, 7, 8, 2, 3, 4, 5, 6]);
  });

  it('repeats the validation in answer to the prompt', () => {
    const s = run(atValidate, { type: 'qualityResult', accepted: false, reason: 'max 2.1 deg' }, done, { type: 'repeatValidation' });
    expect(kinds(s).slice(1, 4)).toEqual(['1:validate:done', '7:validate:running', '2:clip:pending']);
    expect(s.phase).toBe('running');
  });

  it('raises the prompt for a failed drift check too', () => {
    const atDrift = run(atValidate, done, done, done);
    expect(current(atDrift).kind).toBe('drift_check');
    expect(runnerReducer(atDrift, { type: 'qualityResult', accepted: false, reason: 'offset 1.8 deg' }).phase).toBe('prompt');
  });

  it('dismissing a prompt after the last step finishes the session; recalibrating runs the new steps first', () => {
    const last = run(startRunner([{ index: 0, kind: 'validate', stimulusId: null, seconds: null, text: null, block: null }]), { type: 'begin' }, { type: 'qualityResult', accepted: false, reason: 'x' });
    expect(run(last, done, { type: 'dismissPrompt' }).phase).toBe('finished');
    const recal = run(last, done, { type: 'recalibrate' });
    expect(kinds(recal)).toEqual(['0:validate:done', '1:calibrate:running', '2:validate:pending']);
    expect(run(recal, done, done).phase).toBe('finished');
  });
});

describe('operator actions', () => {
  const atClip = run(startRunner(plan), { type: 'begin' }, done, done);

  it('pause interrupts the running step and resume starts it again from its beginning', () => {
    const paused = runnerReducer(atClip, { type: 'pause' });
    expect(paused.phase).toBe('paused');
    expect(current(paused)).toMatchObject({ index: 2, state: 'pending', attempts: 1 });
    const resumed = runnerReducer(paused, { type: 'resume' });
    expect(current(resumed)).toMatchObject({ index: 2, state: 'running', attempts: 2 });
  });

  it('skip passes over the running step, or over the cursor step while paused or ready', () => {
    const skipped = runnerReducer(atClip, { type: 'skip' });
    expect(skipped.steps[2].state).toBe('skipped');
    expect(current(skipped)).toMatchObject({ index: 3, state: 'running' });
    const pausedSkip = run(atClip, { type: 'pause' }, { type: 'skip' });
    expect(pausedSkip).toMatchObject({ phase: 'paused', cursor: 3 });
    expect(pausedSkip.steps[2].state).toBe('skipped');
    expect(current(run(pausedSkip, { type: 'resume' }))).toMatchObject({ index: 3, state: 'running', attempts: 1 });
    const readySkip = runnerReducer(startRunner(plan), { type: 'skip' });
    expect(readySkip).toMatchObject({ phase: 'ready', cursor: 1 });
    const one = startRunner([plan[6]]);
    expect(runnerReducer(one, { type: 'skip' }).phase).toBe('finished');
  });

  it('repeatValidation puts a validation right after the running step, or before the cursor step when not running', () => {
    const s = runnerReducer(atClip, { type: 'repeatValidation' });
    expect(kinds(s).slice(2, 5)).toEqual(['2:clip:running', '7:validate:pending', '3:clip:pending']);
    expect(current(runnerReducer(s, done)).index).toBe(7);
    const paused = run(atClip, { type: 'pause' }, { type: 'repeatValidation' });
    expect(kinds(paused).slice(2, 4)).toEqual(['7:validate:pending', '2:clip:pending']);
    expect(current(run(paused, { type: 'resume' })).index).toBe(7);
  });

  it('recalibrate puts calibrate and validate before the next clip', () => {
    const s = runnerReducer(atClip, { type: 'recalibrate' });
    expect(kinds(s).slice(2, 6)).toEqual(['2:clip:running', '7:calibrate:pending', '8:validate:pending', '3:clip:pending']);
    const ready = runnerReducer(startRunner(plan), { type: 'recalibrate' });
    expect(kinds(ready).slice(0, 3)).toEqual(['7:calibrate:pending', '8:validate:pending', '0:calibrate:pending']);
    expect(runnerReducer(run(atClip, ...Array<RunnerAction>(5).fill(done)), { type: 'recalibrate' }).steps).toHaveLength(plan.length);
  });

  it('markBad marks a finished step, or the running step when it ends; a pause lifts the mark', () => {
    const s = runnerReducer(atClip, { type: 'markBad', index: 1, reason: 'participant looked away' });
    expect(s.steps[1]).toMatchObject({ state: 'bad', badReason: 'participant looked away' });
    const running = runnerReducer(atClip, { type: 'markBad', index: 2, reason: 'forklift clip stuttered' });
    expect(running.steps[2]).toMatchObject({ state: 'running', badReason: 'forklift clip stuttered' });
    expect(runnerReducer(running, done).steps[2].state).toBe('bad');
    expect(run(running, { type: 'pause' }).steps[2].badReason).toBeNull();
    expect(runnerReducer(atClip, { type: 'markBad', index: 5, reason: 'x' })).toBe(atClip);
    expect(runnerReducer(atClip, { type: 'markBad', index: 0, reason: '  ' }).steps[0].badReason).toBe('marked bad');
    expect(runnerReducer(atClip, { type: 'markBad', index: 0, reason: 'x'.repeat(900) }).steps[0].badReason).toHaveLength(500);
    expect(() => runnerReducer(atClip, { type: 'markBad', index: 99, reason: 'x' })).toThrow(RangeError);
  });

  it('after the end only markBad still applies', () => {
    const end = run(startRunner(plan), { type: 'begin' }, ...Array<RunnerAction>(plan.length).fill(done));
    for (const a of [{ type: 'begin' }, done, { type: 'skip' }, { type: 'repeatValidation' }, { type: 'recalibrate' }, { type: 'pause' }] as RunnerAction[]) expect(runnerReducer(end, a)).toBe(end);
    expect(runnerReducer(end, { type: 'markBad', index: 3, reason: 'blinks' }).steps[3].state).toBe('bad');
  });
});

describe('resumeRunner', () => {
  const clip = (index: number, state: TrialRecord['state'], fields: Partial<TrialRecord> = {}) => trial(index, 'clip', state, { stimulusId: plan[index].stimulusId, ...fields });

  it('continues at the first unfinished trial and keeps done, skipped and bad ones', () => {
    const trials = [trial(0, 'calibrate', 'done'), trial(1, 'validate', 'done'), clip(2, 'bad', { badReason: 'sneeze' }), clip(3, 'pending', { startedHostNs: 4e9 })];
    const s = resumeRunner(plan, trials);
    expect(s).toMatchObject({ phase: 'ready', cursor: 3, prompt: null });
    expect(s.steps[2]).toMatchObject({ state: 'bad', badReason: 'sneeze', attempts: 1 });
    expect(s.steps[3]).toMatchObject({ state: 'pending', attempts: 1 });
    expect(current(runnerReducer(s, { type: 'begin' }))).toMatchObject({ index: 3, state: 'running', attempts: 2 });
    expect(resumeRunner(plan, [])).toEqual(startRunner(plan));
  });

  it('puts back steps inserted during the session: finished ones by end time, open ones at the resume point', () => {
    const trials = [
      trial(0, 'calibrate', 'done', { startedHostNs: 1e9 }),
      trial(1, 'validate', 'done', { startedHostNs: 2e9 }),
      trial(7, 'validate', 'done', { startedHostNs: 2.2e9, endedHostNs: 2.8e9 }),
      clip(2, 'done', { startedHostNs: 3e9 }),
      trial(8, 'calibrate', 'pending'),
      trial(9, 'validate', 'pending'),
    ];
    const s = resumeRunner(plan, trials);
    expect(s.steps.map((x) => x.index)).toEqual([0, 1, 7, 2, 8, 9, 3, 4, 5, 6]);
    expect(current(s).index).toBe(8);
  });

  it('finishes a session whose every trial is finished', () => {
    const trials = plan.map((p) => trial(p.index, p.kind, 'done', { stimulusId: p.stimulusId }));
    expect(resumeRunner(plan, trials)).toMatchObject({ phase: 'finished', cursor: plan.length });
  });

  it('refuses trial records that do not belong to the plan', () => {
    expect(() => resumeRunner(plan, [trial(2, 'clip', 'done', { stimulusId: 'person-walking' })])).toThrow(/trial 2 is a clip \(person-walking\) but the plan has a clip \(forklift-crossing\)/);
    expect(() => resumeRunner(plan, [trial(0, 'calibrate', 'done'), trial(0, 'calibrate', 'done')])).toThrow(/two trial records have index 0/);
  });

  it('rebuilds what a crashed session had done, at any point of random operator sessions', () => {
    const random = new Xoshiro128(2026);
    const menu: RunnerAction[] = [done, done, done, { type: 'skip' }, { type: 'pause' }, { type: 'resume' }, { type: 'repeatValidation' }, { type: 'recalibrate' }, { type: 'qualityResult', accepted: false, reason: 'x' }, { type: 'dismissPrompt' }];
    const seen = { insertedFinished: 0, insertedOpen: 0, crashedIn: new Set<string>() };
    for (let session = 0; session < 300; session++) {
      let s = run(startRunner(plan), { type: 'begin' });
      const times = new Map<number, { started: number | null; ended: number | null }>();
      const length = random.nextInt(40);
      for (let t = 1; t <= length; t++) {
        let action = menu[random.nextInt(menu.length)];
        if (random.nextInt(8) === 0 && s.cursor > 0) action = { type: 'markBad', index: s.steps[random.nextInt(s.cursor)].index, reason: 'noise' };
        const before = s;
        s = runnerReducer(s, action);
        s.steps.forEach((x) => {
          const was = before.steps.find((b) => b.index === x.index);
          const entry = times.get(x.index) ?? { started: null, ended: null };
          // Each start and end rewrites the step's trial record with the host time.
          if (x.attempts > (was?.attempts ?? 0)) entry.started = t * 1e6;
          const ended = x.state === 'done' || x.state === 'skipped' || (x.state === 'bad' && was?.state === 'running');
          if (ended && x.state !== was?.state) entry.ended = t * 1e6;
          times.set(x.index, entry);
        });
      }
      // The console writes a trial record for every step it has started, finished or inserted.
      const trials = s.steps.map((x) =>
        trial(x.index, x.kind, x.state === 'running' ? 'pending' : x.state, { stimulusId: x.stimulusId, badReason: x.badReason, startedHostNs: times.get(x.index)?.started ?? null, endedHostNs: times.get(x.index)?.ended ?? null }),
      );
      const resumed = resumeRunner(plan, trials);
      seen.crashedIn.add(s.phase);
      if (s.steps.some((x) => x.index >= plan.length && ['done', 'skipped', 'bad'].includes(x.state))) seen.insertedFinished++;
      if (s.steps.some((x) => x.index >= plan.length && x.state === 'pending')) seen.insertedOpen++;
      const finishedLive = s.steps.filter((x) => ['done', 'skipped', 'bad'].includes(x.state));
      const finishedResumed = resumed.steps.slice(0, finishedLive.length);
      expect(finishedResumed.map((x) => [x.index, x.state, x.badReason]), `session ${session}`).toEqual(finishedLive.map((x) => [x.index, x.state, x.badReason]));
      expect(resumed.steps.map((x) => x.index).sort((a, b) => a - b)).toEqual(s.steps.map((x) => x.index).sort((a, b) => a - b));
      expect(resumed.cursor).toBe(finishedLive.length);
      expect(resumed.phase).toBe(finishedLive.length === s.steps.length ? 'finished' : 'ready');
      const openPlanned = (steps: RunnerState['steps']) => steps.filter((x) => x.index < plan.length && !['done', 'skipped', 'bad'].includes(x.state)).map((x) => x.index);
      expect(openPlanned(resumed.steps)).toEqual(openPlanned(s.steps));
    }
    // The random sessions did reach the cases that matter.
    expect([...seen.crashedIn].sort()).toEqual(['finished', 'paused', 'prompt', 'running']);
    expect(seen.insertedFinished).toBeGreaterThan(30);
    expect(seen.insertedOpen).toBeGreaterThan(30);
  });
});
