import { describe, expect, it } from 'vitest';
import type { ValidationRecord } from '../../../../app/core/study/records';
import { checksFor, defaultUses } from '../../../../renderer/console/quality/correction-choice';
import { exclusionProblem } from '../../../../renderer/console/quality/ExclusionForm';

const check = (id: string, kind: ValidationRecord['kind']): ValidationRecord => ({ id, sessionId: 's', trialId: `t-${id}`, kind, at: '2026-01-01T10:00:00Z', hostNs: 0, points: [{ x: 1, y: 1, accuracyDeg: 0.1, precisionRmsS2SDeg: null, precisionSdDeg: null, dataLossPct: 0, samples: 1, dxDeg: 0, dyDeg: 0 }], meanAccuracyDeg: 0.1, maxAccuracyDeg: 0.1, accepted: true });

// Gazeloom's own form rules (no source).
describe('exclusion form', () => {
  it('asks for a reason, a clip, a valid time range', () => {
    expect(exclusionProblem('session', '', '', '', '  ')).toBe('Give a reason.');
    expect(exclusionProblem('session', '', '', '', 'sneezed')).toBeNull();
    expect(exclusionProblem('clip', '', '', '', 'sneezed')).toBe('Choose the clip.');
    expect(exclusionProblem('time_range', '', '10', '', 'sneezed')).toMatch(/time range/);
    expect(exclusionProblem('time_range', '', '20', '10', 'sneezed')).toMatch(/end after it starts/);
    expect(exclusionProblem('time_range', '', '10', '20', 'sneezed')).toBeNull();
  });
});

describe('correction checks offered', () => {
  it('fits on everything, holding out the last validation when there are two or more', () => {
    const one = [check('v1', 'validation'), check('d1', 'drift_check')];
    expect(defaultUses(one)).toEqual({ v1: 'fit', d1: 'fit' });
    const two = [...one, check('v2', 'validation')];
    const uses = defaultUses(two);
    expect(uses).toEqual({ v1: 'fit', d1: 'fit', v2: 'held_out' });
    expect(checksFor(two, uses, 'held_out').map((v) => v.id)).toEqual(['v2']);
    expect(checksFor(two, { v1: 'unused' }, 'unused').map((v) => v.id)).toEqual(['v1', 'd1', 'v2']);
  });
});
