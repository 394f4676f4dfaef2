import type { GazeloomApi, LiveStatus, Result } from '../../../app/contract';
import { summarizeDriftCheck, summarizeValidation, validationLayout } from '../../../app/core/quality';
import { targetResult, type ProtocolRecord, type TargetResult } from '../../../app/core/study/records';
import type { RunnerStep } from '../../../app/core/study/session-runner';

/** Host time now (the host's monotonic clock, ns), from one clock exchange. */
export async function hostNow(api: GazeloomApi): Promise<number | null> {
  const r = await api.ping({ clientSentMs: performance.now() });
  return r.ok ? r.value.hostReceivedNs : null;
}

export interface TargetOutcome {
  readonly points: TargetResult[];
  readonly startedHostNs: number;
  readonly endedHostNs: number;
  /** The figures and whether the protocol's thresholds accept them. */
  readonly quality: { meanAccuracyDeg: number | null; maxAccuracyDeg: number | null; accepted: boolean; reasons: string[] };
}

const purposeOf = { validate: 'validation', drift_check: 'drift_check' } as const;

/**
 * Runs a validation or drift check on the stage (calibration: calibration-step.ts): the
 * protocol's layout (a drift check has one target at the centre) in a random order from a
 * fresh seed, then its quality against the protocol's thresholds.
 */
export async function runTargets(api: GazeloomApi, kind: 'validate' | 'drift_check', protocol: ProtocolRecord, screen: { widthPx: number; heightPx: number }): Promise<Result<TargetOutcome>> {
  const points = kind === 'drift_check' ? [{ x: screen.widthPx / 2, y: screen.heightPx / 2 }] : validationLayout(protocol.validationLayout, screen);
  const r = await api.runTargetProcedure({ purpose: purposeOf[kind], points, order: kind === 'drift_check' ? 'as_given' : 'random' });
  if (!r.ok) return r;
  const results = r.value.points.map((p) => targetResult.parse(p));
  let quality: TargetOutcome['quality'];
  if (kind === 'validate') quality = summarizeValidation(results, protocol.thresholds);
  else {
    const drift = summarizeDriftCheck(results, protocol.thresholds);
    const offset = drift.offset?.offsetDeg ?? null;
    quality = { meanAccuracyDeg: offset, maxAccuracyDeg: offset, accepted: drift.accepted, reasons: drift.reasons };
  }
  return { ok: true, value: { points: results, startedHostNs: r.value.startedHostNs, endedHostNs: r.value.endedHostNs, quality } };
}

/** Resolves when the clip `playbackId` is no longer on the stage (it ended, failed or was stopped). */
export function playbackEnded(api: GazeloomApi, playbackId: string, signal: AbortSignal): Promise<void> {
  return new Promise((resolve) => {
    const done = () => {
      unsubscribe();
      resolve();
    };
    const unsubscribe = api.onLiveStatus((status: LiveStatus) => {
      if (status.playback?.playbackId !== playbackId) done();
    });
    signal.addEventListener('abort', done, { once: true });
  });
}

/** Waits `ms`, or less if aborted. */
export function wait(ms: number, signal: AbortSignal): Promise<void> {
  return new Promise((resolve) => {
    const timer = setTimeout(resolve, ms);
    signal.addEventListener('abort', () => {
      clearTimeout(timer);
      resolve();
    }, { once: true });
  });
}

/** A short line about a finished check, for the console. */
export function describeOutcome(step: RunnerStep, outcome: TargetOutcome): string {
  const deg = (v: number | null) => (v === null ? 'n/a' : `${v.toFixed(2)}°`);
  const q = outcome.quality;
  const what = step.kind === 'drift_check' ? `Drift check: offset ${deg(q.meanAccuracyDeg)}` : `Validation: mean ${deg(q.meanAccuracyDeg)}, worst point ${deg(q.maxAccuracyDeg)}`;
  return `${what}, ${q.accepted ? 'accepted' : `not accepted (${q.reasons.join('; ')})`}.`;
}
