import { describe, expect, it } from 'vitest';
import type { TargetResult, ValidationRecord } from '../../../../app/core/study/records';
import type { RunnerStep } from '../../../../app/core/study/session-runner';
import { summarizeSession } from '../../../../renderer/console/session/session-summary';

const step = (index: number, kind: RunnerStep['kind'], state: RunnerStep['state']): RunnerStep => ({ index, kind, state, stimulusId: kind === 'clip' ? `clip-${index}` : null, seconds: null, text: null, block: null, attempts: 1, badReason: state === 'bad' ? 'blink' : null });
const point = (dataLossPct: number): TargetResult => ({ x: 0, y: 0, accuracyDeg: 0.5, precisionRmsS2SDeg: 0.1, precisionSdDeg: 0.1, dataLossPct, samples: 100, dxDeg: 0, dyDeg: 0 });
const check = (hostNs: number, kind: ValidationRecord['kind'], losses: number[], accepted: boolean): ValidationRecord => ({ id: `v${hostNs}`, sessionId: 's', trialId: 't', kind, at: '2026-03-02T10:00:00.000Z', hostNs, points: losses.map(point), meanAccuracyDeg: 0.5, maxAccuracyDeg: 0.5, accepted });

describe('the session summary', () => {
  it('counts steps and clips by state and averages data loss over every target', () => {
    const steps = [step(0, 'calibrate', 'done'), step(1, 'validate', 'done'), step(2, 'clip', 'done'), step(3, 'clip', 'bad'), step(4, 'drift_check', 'skipped'), step(5, 'clip', 'pending')];
    const s = summarizeSession(steps, [check(20, 'drift_check', [10], false), check(10, 'validation', [0, 2, 4, 6, 8], true)]);
    expect(s.steps).toEqual({ total: 6, done: 3, skipped: 1, bad: 1, notRun: 1 });
    expect(s.clips).toEqual({ total: 3, done: 1, bad: 1 });
    expect(s.checks.map((c) => [c.kind, c.dataLossPct, c.accepted])).toEqual([
      ['validation', 4, true],
      ['drift_check', 10, false],
    ]);
    expect(s.dataLossPct).toBeCloseTo(30 / 6, 12); // (0+2+4+6+8+10)/6 targets
  });

  it('has no data loss figure without checks', () => {
    expect(summarizeSession([], []).dataLossPct).toBeNull();
  });
});
