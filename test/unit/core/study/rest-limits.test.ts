import { describe, expect, it } from 'vitest';
import { carriedFromTrials, DEFAULT_REST_LIMITS, restClock, restLimitsOf, restWarnings, tickRest } from '../../../../app/core/study/rest-limits';
import { tables } from '../../../../app/core/study/records';
import { planSession } from '../../../../app/core/study/session-plan';
import { resumeRunner, runnerReducer, startRunner, type RunnerAction, type RunnerState } from '../../../../app/core/study/session-runner';
import { protocol, trial } from './study-records';

/**
 * The rest limits (defaults 20 min warning, 2 min rest required after 40 min, 60 min session
 * warning: common practice, no source), driven through the runner in simulated time.
 */
const clips = ['forklift-crossing', 'conveyor-parcels', 'warning-beacon', 'person-walking'];
const plan = planSession(protocol({ steps: [...clips, ...clips, ...clips].map((stimulusId) => ({ kind: 'clip' as const, stimulusId })) }), { enrolment: 1, seed: 1 }).steps;

const run = (state: RunnerState, ...actions: RunnerAction[]): RunnerState => actions.reduce(runnerReducer, state);
const done: RunnerAction = { type: 'stepDone' };
const current = (s: RunnerState) => s.steps[s.cursor]!;
const kinds = (s: RunnerState) => restWarnings(s.rest).map((w) => w.kind);

/** A simulated session clock: ticks once a second of simulated time. */
function driver(initial: RunnerState) {
  let state = initial;
  let nowS = 0;
  state = runnerReducer(state, { type: 'tick', atS: nowS });
  return {
    get state() {
      return state;
    },
    /** Lets `seconds` pass with a tick every second. */
    pass(seconds: number) {
      for (let i = 0; i < seconds; i++) state = runnerReducer(state, { type: 'tick', atS: ++nowS });
    },
    act(...actions: RunnerAction[]) {
      state = run(state, ...actions);
    },
  };
}

describe('the viewing warning', () => {
  it('warns once 20 minutes of clips were shown without a rest, not a second before', () => {
    const d = driver(runnerReducer(startRunner(plan), { type: 'begin' }));
    d.pass(10 * 60);
    d.act(done); // first clip: 10 min
    d.pass(10 * 60 - 1);
    expect(d.state.rest.viewingS).toBe(20 * 60 - 1);
    expect(kinds(d.state)).toEqual([]);
    d.pass(1);
    expect(kinds(d.state)).toEqual(['viewing']);
    expect(restWarnings(d.state.rest)[0]!.message).toMatch(/20 min of viewing without a rest/);
  });

  it('counts only clip time: a pause and other steps are not viewing', () => {
    const d = driver(runnerReducer(startRunner(plan), { type: 'begin' }));
    d.pass(15 * 60);
    d.act({ type: 'pause' });
    d.pass(30 * 60);
    expect(d.state.rest.viewingS).toBe(15 * 60);
    expect(d.state.rest.sessionS).toBe(45 * 60);
    expect(kinds(d.state)).toEqual([]);
  });
});

describe('the required rest', () => {
  /** 40 minutes of viewing: four clips of 10 minutes each, the fourth still running. */
  function fortyMinutes() {
    const d = driver(runnerReducer(startRunner(plan), { type: 'begin' }));
    for (let k = 0; k < 3; k++) {
      d.pass(10 * 60);
      d.act(done);
    }
    d.pass(10 * 60 - 1);
    expect(d.state.rest.restDue).toBe(false);
    d.pass(1);
    return d;
  }

  it('after 40 minutes inserts a rest of 2 minutes before the next clip', () => {
    const d = fortyMinutes();
    expect(d.state.rest.restDue).toBe(true);
    expect(kinds(d.state)).toEqual(['rest_required']);
    expect(current(d.state).kind).toBe('clip'); // the running clip is not cut short
    const before = d.state.steps.length;
    d.act(done);
    expect(d.state.steps).toHaveLength(before + 1);
    expect(current(d.state)).toMatchObject({ kind: 'rest', seconds: 120, state: 'running', index: plan.length });
    expect(d.state.steps[d.state.cursor + 1]!.kind).toBe('clip');
  });

  it('cannot be skipped, running or paused, and a finished rest starts the viewing time again', () => {
    const d = fortyMinutes();
    d.act(done);
    const rest = current(d.state).index;
    d.act({ type: 'skip' });
    expect(current(d.state)).toMatchObject({ index: rest, state: 'running' });
    d.act({ type: 'pause' }, { type: 'skip' });
    expect(current(d.state)).toMatchObject({ index: rest, state: 'pending' });
    expect(d.state.phase).toBe('paused');
    d.act({ type: 'resume' });
    d.pass(120);
    d.act(done);
    expect(d.state.steps.find((s) => s.index === rest)!.state).toBe('done');
    expect(d.state.rest).toMatchObject({ viewingS: 0, restDue: false, requiredRestIndex: null });
    expect(current(d.state).kind).toBe('clip');
    expect(kinds(d.state)).toEqual([]);
  });

  it('a rest cut short does not count: a full one is inserted again before the next clip', () => {
    const d = fortyMinutes();
    d.act(done);
    d.pass(60);
    d.act(done); // the console would not do this; the runner still keeps the rule
    expect(d.state.rest.restDue).toBe(true);
    expect(current(d.state)).toMatchObject({ kind: 'rest', seconds: 120, state: 'running' });
  });

  it("a protocol's own rest of 2 minutes or more also counts as a rest", () => {
    const withRest = planSession(protocol({ steps: [{ kind: 'clip', stimulusId: 'forklift-crossing' }, { kind: 'rest', seconds: 150 }, { kind: 'clip', stimulusId: 'warning-beacon' }] }), { enrolment: 1, seed: 1 }).steps;
    const d = driver(runnerReducer(startRunner(withRest), { type: 'begin' }));
    d.pass(25 * 60);
    expect(kinds(d.state)).toEqual(['viewing']);
    d.act(done);
    d.pass(150);
    d.act(done);
    expect(d.state.rest.viewingS).toBe(0);
    expect(kinds(d.state)).toEqual([]);
  });
});

describe('the session-length warning', () => {
  it('warns at 60 minutes of session, pauses included', () => {
    const d = driver(runnerReducer(startRunner(plan), { type: 'begin' }));
    d.pass(5 * 60);
    d.act({ type: 'pause' });
    d.pass(55 * 60 - 1);
    expect(kinds(d.state)).toEqual([]);
    d.pass(1);
    expect(kinds(d.state)).toEqual(['session']);
    expect(restWarnings(d.state.rest)[0]!.message).toMatch(/run 60 min/);
  });
});

describe("a protocol's own limits", () => {
  it('uses the defaults when the protocol has none, and its own when it has them', () => {
    expect(restLimitsOf(protocol())).toEqual({ warnAfterMin: 20, requireRestAfterMin: 40, requiredRestMin: 2, sessionWarnAfterMin: 60 });
    const limits = { warnAfterMin: 1, requireRestAfterMin: 2, requiredRestMin: 0.5, sessionWarnAfterMin: 3 };
    const d = driver(runnerReducer(startRunner(plan, restLimitsOf(protocol({ restLimits: limits }))), { type: 'begin' }));
    d.pass(60);
    expect(kinds(d.state)).toEqual(['viewing']);
    d.pass(60);
    d.act(done);
    expect(current(d.state)).toMatchObject({ kind: 'rest', seconds: 30 });
    d.pass(60);
    expect(kinds(d.state)).toEqual(['rest_required', 'session']);
  });

  it('refuses limits that contradict each other or are not positive', () => {
    const base = tables.protocols.parse(protocol());
    expect(tables.protocols.safeParse({ ...base, restLimits: { warnAfterMin: 50, requireRestAfterMin: 40, requiredRestMin: 2, sessionWarnAfterMin: 60 } }).success).toBe(false);
    expect(tables.protocols.safeParse({ ...base, restLimits: { ...DEFAULT_REST_LIMITS, requiredRestMin: 0 } }).success).toBe(false);
    expect(() => restClock({ ...DEFAULT_REST_LIMITS, sessionWarnAfterMin: Number.NaN })).toThrow(/sessionWarnAfterMin/);
    expect(() => tickRest(restClock(), Number.POSITIVE_INFINITY, null)).toThrow(RangeError);
  });
});

describe('a resumed session', () => {
  const s = 1e9;
  it('carries the session length and the clip time since the last rest that counted', () => {
    const trials = [
      trial(0, 'clip', 'done', { stimulusId: plan[0]!.stimulusId, startedHostNs: 0, endedHostNs: 600 * s }),
      trial(1, 'clip', 'done', { stimulusId: plan[1]!.stimulusId, startedHostNs: 600 * s, endedHostNs: 1500 * s }),
      trial(2, 'clip', 'done', { stimulusId: plan[2]!.stimulusId, startedHostNs: 1500 * s, endedHostNs: 2500 * s }),
    ];
    expect(carriedFromTrials(trials, DEFAULT_REST_LIMITS)).toEqual({ sessionS: 2500, viewingS: 2500 });
    const resumed = resumeRunner(plan, trials);
    expect(resumed.rest).toMatchObject({ sessionS: 2500, viewingS: 2500, restDue: true });
    // The next clip is preceded by the required rest.
    const begun = runnerReducer(resumed, { type: 'begin' });
    expect(current(begun)).toMatchObject({ kind: 'rest', seconds: 120 });
    const rested = [...trials, trial(12, 'rest', 'done', { startedHostNs: 2600 * s, endedHostNs: 2720 * s })];
    expect(carriedFromTrials(rested, DEFAULT_REST_LIMITS)).toEqual({ sessionS: 2720, viewingS: 0 });
  });
});
