import { describe, expect, it } from 'vitest';
import { activeCorrection, buildCorrection, correctSamples, gazeForAnalysis, removedCorrection } from '../../../../../app/core/quality/correction';
import type { CorrectionRecord } from '../../../../../app/core/study/records';
import { centre, display, simulateSession } from './simulated-session';

const { validations, columns } = simulateSession(
  [0.2, 1, 2, 3].map((atMin) => ({ id: `drift-${atMin}`, kind: 'drift_check' as const, atMin, points: centre })),
  { driftDegPerMin: 0.5, accuracyOffsetDeg: 0.3, seed: 99 },
);
const bytes = (a: Float64Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('hex');
const correction = buildCorrection({ id: 'c-1', sessionId: 'sim', model: 'offset_interpolated', fitOn: validations, heldOut: [], display, createdBy: 'op-1', createdAt: '2026-03-02T11:00:00.000Z' });

describe('corrections never change the recorded gaze', () => {
  it('the simulated recording has blinks (invalid samples) to carry through', () => {
    expect(columns.x.some(Number.isNaN)).toBe(true);
    expect(columns.x.length).toBeGreaterThan(20_000);
  });

  it('correctSamples returns new arrays, leaves the given ones bit for bit, and keeps invalid samples NaN', () => {
    const before = [bytes(columns.x), bytes(columns.y)];
    const out = correctSamples(correction, columns);
    expect(out.x).not.toBe(columns.x);
    expect([bytes(columns.x), bytes(columns.y)]).toEqual(before);
    expect(bytes(out.x)).not.toBe(before[0]);
    expect(columns.x.every((v, i) => Number.isNaN(out.x[i]) === Number.isNaN(v) && Number.isNaN(out.y[i]) === Number.isNaN(columns.y[i]))).toBe(true);
  });

  it('analysis uses the correction while it is on, and says which; removing it restores the recorded arrays exactly', () => {
    const raw = [bytes(columns.x), bytes(columns.y)];
    const on = gazeForAnalysis(columns, [correction], 'sim');
    expect(on.correctionId).toBe('c-1');
    expect(bytes(on.x)).not.toBe(raw[0]);
    const removed = removedCorrection(correction, '2026-03-02T12:00:00.000Z');
    expect(removed).toMatchObject({ id: 'c-1', enabled: false, removedAt: '2026-03-02T12:00:00.000Z', params: correction.params });
    const off = gazeForAnalysis(columns, [removed], 'sim');
    expect(off.correctionId).toBeNull();
    expect([bytes(off.x), bytes(off.y)]).toEqual(raw);
    expect(off.x).toBe(columns.x);
  });

  it('the active correction is the latest one switched on for that session', () => {
    const later: CorrectionRecord = { ...correction, id: 'c-2', createdAt: '2026-03-02T11:30:00.000Z' };
    const otherSession: CorrectionRecord = { ...correction, id: 'c-3', sessionId: 'other', createdAt: '2026-03-02T13:00:00.000Z' };
    expect(activeCorrection([correction, later, otherSession], 'sim')?.id).toBe('c-2');
    expect(activeCorrection([correction, removedCorrection(later, '2026-03-02T12:00:00.000Z')], 'sim')?.id).toBe('c-1');
    expect(activeCorrection([{ ...correction, enabled: false }], 'sim')).toBeNull();
  });

  it('refuses columns of different lengths', () => {
    expect(() => correctSamples(correction, { hostNs: [0], x: new Float64Array(2), y: new Float64Array(2) })).toThrow(/same length/);
  });
});
