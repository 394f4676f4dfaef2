import { randomInt } from 'node:crypto';
import { fail, type Failure } from '../../contract/result';
import type { RunTargetProcedureRequest, RunTargetProcedureResponse, ShownTargetResult } from '../../contract/schemas/targets';
import type { HostClock } from '../../core/clock/host-clock';
import { combinedGaze } from '../../core/gaze/gaze-sample';
import { DEFAULT_WINDOW_MS, expectedSampleCount, pointQuality, pointWithoutAngles, samplesInWindow, targetOrder, windowGaze, type TimedSample } from '../../core/quality';
import type { GazeRecord } from '../../core/recording/records';
import type { GazeContext } from './live-session';

/** What a target procedure uses of the live session (LiveSession implements it). */
export interface TargetStage {
  readonly clock: HostClock;
  gazeContext(): GazeContext | null;
  tapGaze(listener: (record: GazeRecord) => void): () => void;
  showTarget(x: number, y: number, purpose: RunTargetProcedureRequest['purpose']): string;
  hideTarget(id: string): void;
  recordMessage(kind: string, data: Record<string, unknown>): void;
}

/** Waits ms on the host clock, or less when the signal aborts. */
export type Sleep = (ms: number, signal: AbortSignal) => Promise<void>;

export interface TargetProcedureOptions {
  /** Real timers by default; simulated time passes one that advances its ManualClock. */
  readonly sleep?: Sleep;
  /** How long to wait after the last target for samples still on their way (tracker latency), ms. */
  readonly lateSampleGraceMs?: number;
}

export const DEFAULT_HOLD_MS = 1500;

const realSleep: Sleep = (ms, signal) =>
  new Promise((resolve) => {
    const timer = setTimeout(resolve, ms);
    signal.addEventListener('abort', () => (clearTimeout(timer), resolve()), { once: true });
  });

function timedSample(record: GazeRecord): TimedSample {
  const gaze = combinedGaze(record);
  return gaze ? { hostNs: record.hostNs, x: gaze.x, y: gaze.y, valid: true } : { hostNs: record.hostNs, x: Number.NaN, y: Number.NaN, valid: false };
}

interface Shown {
  readonly index: number;
  readonly targetId: string;
  readonly onsetHostNs: number;
}

/**
 * Calibration, validation and drift-check targets on the stage during a recording: each
 * target is shown (LiveSession.showTarget: drawn, recorded, sent to a tracker bridge,
 * looked at by the simulated tracker) for holdMs, then removed; meanwhile every gaze
 * sample is collected with its mapped host time, and each target's window (fromMs..toMs
 * after its onset) is measured with pointQuality. One procedure at a time; cancel() ends
 * the running one. The procedure's start and end, with the results, are recorded.
 */
export class TargetProcedures {
  private current: AbortController | null = null;
  private readonly sleep: Sleep;
  private readonly graceMs: number;

  constructor(
    private readonly stage: TargetStage,
    options: TargetProcedureOptions = {},
  ) {
    this.sleep = options.sleep ?? realSleep;
    this.graceMs = options.lateSampleGraceMs ?? 500;
  }

  get running(): boolean {
    return this.current !== null;
  }

  /** Ends the running procedure (it resolves with a 'conflict' failure); false when none runs. */
  cancel(): boolean {
    if (!this.current) return false;
    this.current.abort();
    return true;
  }

  async run(request: RunTargetProcedureRequest): Promise<RunTargetProcedureResponse | Failure> {
    if (this.current) return fail('conflict', 'a target procedure is already running; cancel it first');
    const context = this.stage.gazeContext();
    if (!context) return fail('conflict', 'no recording is running: start one before calibrating, validating or checking drift');
    const fromMs = request.fromMs ?? DEFAULT_WINDOW_MS.fromMs;
    const toMs = request.toMs ?? DEFAULT_WINDOW_MS.toMs;
    const holdMs = request.holdMs ?? DEFAULT_HOLD_MS;
    const problem = checkRequest(request, context, { fromMs, toMs, holdMs });
    if (problem) return problem;
    const seed = request.order === 'random' ? (request.seed ?? randomInt(0, 2 ** 31)) : null;
    const order = seed === null ? request.points.map((_, i) => i) : targetOrder(request.points.length, seed);

    const abort = new AbortController();
    this.current = abort;
    const samples: TimedSample[] = [];
    let latestNs = -Infinity;
    const untap = this.stage.tapGaze((record) => {
      samples.push(timedSample(record));
      latestNs = Math.max(latestNs, record.hostNs);
    });
    const startedHostNs = this.stage.clock.nowNs();
    this.stage.recordMessage('target_procedure_start', { purpose: request.purpose, points: request.points.length, order: request.order, seed, fromMs, toMs, holdMs });
    const end = (how: string, points: ShownTargetResult[] | null) => this.stage.recordMessage('target_procedure_end', { purpose: request.purpose, how, points });
    const interrupted = (): Failure | null => {
      if (abort.signal.aborted) {
        end('cancelled', null);
        return fail('conflict', 'the target procedure was cancelled');
      }
      if (this.stage.gazeContext()?.sessionId !== context.sessionId) return fail('conflict', 'the recording stopped during the target procedure');
      return null;
    };
    try {
      const shown: Shown[] = [];
      for (const index of order) {
        const { x, y } = request.points[index]!;
        const targetId = this.stage.showTarget(x, y, request.purpose);
        shown.push({ index, targetId, onsetHostNs: this.stage.clock.nowNs() });
        await this.sleep(holdMs, abort.signal);
        this.stage.hideTarget(targetId);
        const stopped = interrupted();
        if (stopped) return stopped;
      }
      const lastWindowEndNs = shown.at(-1)!.onsetHostNs + toMs * 1e6;
      for (let waited = 0; latestNs < lastWindowEndNs && waited < this.graceMs; waited += 25) await this.sleep(25, abort.signal);
      const stopped = interrupted();
      if (stopped) return stopped;
      const points = shown.map((s) => this.measure(s, request.points[s.index]!, samples, { fromMs, toMs }));
      end('completed', points);
      return { sessionId: context.sessionId, purpose: request.purpose, points, seed, gazeUnits: this.stage.gazeContext()?.units ?? null, startedHostNs, endedHostNs: this.stage.clock.nowNs() };
    } finally {
      untap();
      this.current = null;
    }
  }

  private measure(shown: Shown, target: { x: number; y: number }, samples: readonly TimedSample[], window: { fromMs: number; toMs: number }): ShownTargetResult {
    const context = this.stage.gazeContext();
    const windowed = samplesInWindow(samples, shown.onsetHostNs, window.fromMs, window.toMs);
    // Without the hello's rate, lost samples cannot be counted: only invalid ones are.
    const expected = context?.rateHz ? expectedSampleCount(window.fromMs, window.toMs, context.rateHz) : Math.max(1, windowed.length);
    const { valid, mean } = windowGaze(windowed);
    const result = context && context.units !== 'raw' ? pointQuality(target, windowed, expected, context.display) : pointWithoutAngles(target, valid.length, expected);
    return { ...result, index: shown.index, targetId: shown.targetId, onsetHostNs: shown.onsetHostNs, meanGaze: mean ? { x: mean.x, y: mean.y } : null };
  }
}

function checkRequest(request: RunTargetProcedureRequest, context: GazeContext, t: { fromMs: number; toMs: number; holdMs: number }): Failure | null {
  if (!(t.fromMs < t.toMs)) return fail('bad_input', `the sample window must start before it ends, got fromMs ${t.fromMs} and toMs ${t.toMs}`, 'request.fromMs');
  if (t.toMs > t.holdMs) return fail('bad_input', `the sample window must end while the target is shown: toMs ${t.toMs} is after holdMs ${t.holdMs}`, 'request.toMs');
  const { widthPx, heightPx } = context.display;
  for (const [i, p] of request.points.entries()) {
    if (p.x < 0 || p.y < 0 || p.x > widthPx || p.y > heightPx) return fail('bad_input', `points[${i}] (${p.x}, ${p.y}) is outside the ${widthPx} x ${heightPx} screen`, `request.points[${i}]`);
  }
  return null;
}
