import type { ValidationRecord } from '../../../app/core/study/records';
import type { RunnerStep } from '../../../app/core/study/session-runner';

export interface SessionSummary {
  readonly steps: { total: number; done: number; skipped: number; bad: number; notRun: number };
  readonly clips: { total: number; done: number; bad: number };
  /** Validations and drift checks in the order they were run. */
  readonly checks: readonly { kind: ValidationRecord['kind']; meanAccuracyDeg: number | null; maxAccuracyDeg: number | null; dataLossPct: number | null; accepted: boolean }[];
  /** Mean data loss over every validation and drift-check target (each window expects the same number of samples). */
  readonly dataLossPct: number | null;
}

const mean = (xs: readonly number[]): number | null => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);

/** What the operator sees when a session ends: how many trials ran, and how good the gaze was. */
export function summarizeSession(steps: readonly RunnerStep[], validations: readonly ValidationRecord[]): SessionSummary {
  const count = (pred: (s: RunnerStep) => boolean) => steps.filter(pred).length;
  const clips = steps.filter((s) => s.kind === 'clip');
  const ordered = [...validations].sort((a, b) => a.hostNs - b.hostNs);
  return {
    steps: {
      total: steps.length,
      done: count((s) => s.state === 'done'),
      skipped: count((s) => s.state === 'skipped'),
      bad: count((s) => s.state === 'bad'),
      notRun: count((s) => s.state === 'pending' || s.state === 'running'),
    },
    clips: { total: clips.length, done: clips.filter((s) => s.state === 'done').length, bad: clips.filter((s) => s.state === 'bad').length },
    checks: ordered.map((v) => ({ kind: v.kind, meanAccuracyDeg: v.meanAccuracyDeg, maxAccuracyDeg: v.maxAccuracyDeg, dataLossPct: mean(v.points.map((p) => p.dataLossPct)), accepted: v.accepted })),
    dataLossPct: mean(ordered.flatMap((v) => v.points.map((p) => p.dataLossPct))),
  };
}
