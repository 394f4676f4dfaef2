/**
 * Rest limits of a session: how long a participant may watch clips without a rest, and how
 * long a session may run before the operator is warned. Defaults are common practice, no
 * source: a warning after 20 minutes of viewing without a rest, a required rest of at least
 * 2 minutes after 40 minutes, a session-length warning at 60 minutes.
 *
 * The clock is advanced by the session runner's `tick` actions (seconds on any monotonic
 * clock). Viewing time is the time a clip step was running; a rest step that ran for at least
 * the required rest (within one second, the console's tick) counts as a rest and starts the
 * viewing time again. Pauses and other steps are neither viewing nor rest.
 */
import type { TrialRecord } from './records';

export interface RestLimits {
  readonly warnAfterMin: number;
  readonly requireRestAfterMin: number;
  readonly requiredRestMin: number;
  readonly sessionWarnAfterMin: number;
}

export const DEFAULT_REST_LIMITS: RestLimits = { warnAfterMin: 20, requireRestAfterMin: 40, requiredRestMin: 2, sessionWarnAfterMin: 60 };

/** How much shorter than required a rest may be and still count: one console tick. */
export const REST_TOLERANCE_S = 1;

export interface RestClock {
  readonly limits: RestLimits;
  /** The time of the last tick, or null before the first. */
  readonly lastS: number | null;
  /** Seconds since the first tick (or carried over from the trials of a resumed session). */
  readonly sessionS: number;
  /** Seconds of clips shown since the last rest that counted. */
  readonly viewingS: number;
  /** Seconds the rest step running now has lasted. */
  readonly restRunS: number;
  /** Viewing reached requireRestAfterMin: a rest comes before the next clip. */
  readonly restDue: boolean;
  /** The index of the rest step inserted because one was due: it cannot be skipped. */
  readonly requiredRestIndex: number | null;
}

export type RestWarning = { kind: 'viewing' | 'rest_required' | 'session'; message: string };

export function restClock(limits: RestLimits = DEFAULT_REST_LIMITS, carried: { sessionS: number; viewingS: number } = { sessionS: 0, viewingS: 0 }): RestClock {
  const { warnAfterMin, requireRestAfterMin, requiredRestMin, sessionWarnAfterMin } = limits;
  for (const [name, v] of Object.entries({ warnAfterMin, requireRestAfterMin, requiredRestMin, sessionWarnAfterMin })) {
    if (!Number.isFinite(v) || v <= 0) throw new RangeError(`${name} must be a positive number of minutes, got ${v}`);
  }
  const viewingS = carried.viewingS;
  return { limits, lastS: null, sessionS: carried.sessionS, viewingS, restRunS: 0, restDue: viewingS >= requireRestAfterMin * 60, requiredRestIndex: null };
}

/** Advances the clock to `atS`; the time since the last tick was spent in a step of `running` kind (null: none running). */
export function tickRest(clock: RestClock, atS: number, running: 'clip' | 'rest' | 'other' | null): RestClock {
  if (!Number.isFinite(atS)) throw new RangeError(`tick time must be finite, got ${atS}`);
  const delta = clock.lastS === null ? 0 : Math.max(0, atS - clock.lastS);
  const viewingS = clock.viewingS + (running === 'clip' ? delta : 0);
  return {
    ...clock,
    lastS: Math.max(atS, clock.lastS ?? atS),
    sessionS: clock.sessionS + delta,
    viewingS,
    restRunS: clock.restRunS + (running === 'rest' ? delta : 0),
    restDue: clock.restDue || viewingS >= clock.limits.requireRestAfterMin * 60,
  };
}

/** A rest step ended: it counts as a rest when it lasted long enough. */
export function restEnded(clock: RestClock): RestClock {
  // Too short to count: a rest that was due stays due, and a full one is inserted again.
  if (clock.restRunS + REST_TOLERANCE_S < clock.limits.requiredRestMin * 60) return { ...clock, restRunS: 0, requiredRestIndex: null };
  return { ...clock, restRunS: 0, viewingS: 0, restDue: false, requiredRestIndex: null };
}

const minutes = (s: number): string => `${Math.floor(s / 60)} min`;

/** What the console shows now. */
export function restWarnings(clock: RestClock): RestWarning[] {
  const { limits } = clock;
  const warnings: RestWarning[] = [];
  if (clock.restDue) {
    warnings.push({ kind: 'rest_required', message: `${minutes(clock.viewingS)} of viewing without a rest: a rest of at least ${limits.requiredRestMin} min comes before the next clip and cannot be skipped.` });
  } else if (clock.viewingS >= limits.warnAfterMin * 60) {
    warnings.push({ kind: 'viewing', message: `${minutes(clock.viewingS)} of viewing without a rest: offer a rest (one is required after ${limits.requireRestAfterMin} min).` });
  }
  if (clock.sessionS >= limits.sessionWarnAfterMin * 60) {
    warnings.push({ kind: 'session', message: `The session has run ${minutes(clock.sessionS)} (limit ${limits.sessionWarnAfterMin} min): consider ending it.` });
  }
  return warnings;
}

/**
 * What a resumed session carries over from its trial records: the session's length so far
 * (first start to last end) and the clip time since the last rest that counted.
 */
export function carriedFromTrials(trials: readonly TrialRecord[], limits: RestLimits): { sessionS: number; viewingS: number } {
  const timed = trials.filter((t) => t.startedHostNs !== null && t.endedHostNs !== null).sort((a, b) => a.startedHostNs! - b.startedHostNs!);
  if (timed.length === 0) return { sessionS: 0, viewingS: 0 };
  const sessionS = (Math.max(...timed.map((t) => t.endedHostNs!)) - timed[0]!.startedHostNs!) / 1e9;
  let viewingS = 0;
  for (const t of timed) {
    const s = (t.endedHostNs! - t.startedHostNs!) / 1e9;
    if (t.kind === 'rest' && t.state === 'done' && s + REST_TOLERANCE_S >= limits.requiredRestMin * 60) viewingS = 0;
    else if (t.kind === 'clip') viewingS += s;
  }
  return { sessionS: Math.max(0, sessionS), viewingS };
}

/** A protocol's rest limits, the defaults when it has none. */
export const restLimitsOf = (protocol: { readonly restLimits?: RestLimits | undefined }): RestLimits => protocol.restLimits ?? DEFAULT_REST_LIMITS;
