import { describe, expect, it } from 'vitest';
import type { TargetResult, ValidationRecord } from '../../../../app/core/study/records';
import { mergeRepeatedPoints } from '../../../../renderer/console/session/repeat-points';

const point = (x: number, accuracyDeg: number | null): TargetResult => ({ x, y: 540, accuracyDeg, precisionRmsS2SDeg: 0.03, precisionSdDeg: 0.1, dataLossPct: accuracyDeg === null ? 100 : 2, samples: accuracyDeg === null ? 0 : 490, dxDeg: accuracyDeg, dyDeg: 0 });
const last: ValidationRecord = { id: 'v1', sessionId: 's', trialId: 's-trial-2', kind: 'validation', at: '2026-01-01T10:00:00Z', hostNs: 1e9, points: [point(100, 0.5), point(960, null), point(1800, 1.9)], meanAccuracyDeg: 1.2, maxAccuracyDeg: 1.9, accepted: false };
const thresholds = { validationMeanDeg: 1, validationMaxDeg: 1.5, driftDeg: 1.5 };

// Worked by hand: repeating points 2 and 3 with 0.4° and 0.6° gives mean (0.5 + 0.4 + 0.6) / 3 = 0.5°, worst 0.6°.
describe('repeating chosen validation points', () => {
  it('replaces just the repeated points and judges the whole again', () => {
    const { record, reasons } = mergeRepeatedPoints({ last, repeated: [{ index: 1, result: point(960, 0.4) }, { index: 2, result: point(1800, 0.6) }], thresholds, hostNs: 5e9, at: '2026-01-01T10:01:00Z', id: 'v2' });
    expect(record.points[0]).toBe(last.points[0]);
    expect(record.points.map((p) => p.accuracyDeg)).toEqual([0.5, 0.4, 0.6]);
    expect(record.meanAccuracyDeg).toBeCloseTo(0.5, 12);
    expect(record.maxAccuracyDeg).toBe(0.6);
    expect(record).toMatchObject({ id: 'v2', trialId: last.trialId, kind: 'validation', hostNs: 5e9, accepted: true });
    expect(reasons).toEqual([]);
    expect(last.points[1]!.accuracyDeg).toBeNull(); // the earlier record is untouched
  });

  it('stays not accepted when a repeated point is still beyond the threshold', () => {
    const { record, reasons } = mergeRepeatedPoints({ last, repeated: [{ index: 1, result: point(960, 0.3) }], thresholds, hostNs: 5e9, at: 'x'.repeat(10), id: 'v3' });
    expect(record.accepted).toBe(false);
    expect(reasons.join(' ')).toContain('1.90');
  });

  it('refuses an index outside the validation', () => {
    expect(() => mergeRepeatedPoints({ last, repeated: [{ index: 3, result: point(0, 0.1) }], thresholds, hostNs: 0, at: 'x'.repeat(10), id: 'v4' })).toThrow(RangeError);
  });
});
