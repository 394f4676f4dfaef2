import { describe, expect, it } from 'vitest';
import { buildCorrection, correctionMap, meanErrorDeg, pairsFromValidations } from '../../../../../app/core/quality/correction';
import type { CorrectionModel, ValidationRecord } from '../../../../../app/core/study/records';
import { centre, display, grid9, quadrants, simulateSession } from './simulated-session';

// A heavy-drift participant: 0.4° constant offset plus 0.15°/min of drift, about 3° after 20 minutes.
const driftChecks = [0.5, 3, 6, 9, 12, 15, 18].map((atMin) => ({ id: `drift-${atMin}`, kind: 'drift_check' as const, atMin, points: centre }));
const { validations } = simulateSession(
  [
    ...driftChecks,
    { id: 'val-10', kind: 'validation', atMin: 10, points: grid9 },
    { id: 'held-10.6', kind: 'validation', atMin: 10.6, points: quadrants },
    { id: 'held-4.5', kind: 'validation', atMin: 4.5, points: quadrants },
    { id: 'held-16.5', kind: 'validation', atMin: 16.5, points: quadrants },
  ],
  { driftDegPerMin: 0.15, accuracyOffsetDeg: 0.4, seed: 4242 },
);
const byId = (...ids: string[]): ValidationRecord[] => ids.map((id) => validations.find((v) => v.id === id)!);

function corrected(model: CorrectionModel, fitOn: ValidationRecord[], heldOut: ValidationRecord[]) {
  return buildCorrection({ id: `c-${model}`, sessionId: 'sim', model, fitOn, heldOut, display, createdBy: 'op-1', createdAt: '2026-03-02T11:00:00.000Z' });
}

describe('corrections on simulated drift reduce the error at held-out validation points', () => {
  it('the simulated session drifts: the raw error grows over the session', () => {
    const early = meanErrorDeg(pairsFromValidations(byId('drift-0.5'), display), display, null)!;
    const late = meanErrorDeg(pairsFromValidations(byId('drift-18'), display), display, null)!;
    expect(early).toBeLessThan(0.8);
    expect(late).toBeGreaterThan(2.2);
  });

  // Fitted on the 9-point validation at 10 min, judged at the quadrant points 36 s later.
  for (const model of ['offset', 'affine', 'polynomial2'] as const) {
    it(`${model}: fitted on a 9-point validation, judged on points it never saw`, () => {
      const c = corrected(model, byId('val-10'), byId('held-10.6'));
      expect(c.fit.points).toBe(9);
      expect(c.fit.heldOutErrorBeforeDeg!).toBeGreaterThan(1);
      expect(c.fit.heldOutErrorAfterDeg!).toBeLessThan(0.35 * c.fit.heldOutErrorBeforeDeg!);
    });
  }

  it('offset_interpolated: fitted on the drift checks through the session, judged on validations between them', () => {
    const heldOut = byId('held-4.5', 'held-10.6', 'held-16.5');
    const c = corrected('offset_interpolated', byId(...driftChecks.map((d) => d.id)), heldOut);
    expect((c.params as { knots: unknown[] }).knots).toHaveLength(7);
    expect(c.fit.heldOutErrorAfterDeg!).toBeLessThan(0.35 * c.fit.heldOutErrorBeforeDeg!);
    // A single offset from the 10-minute validation cannot follow the drift over the whole session.
    const single = corrected('offset', byId('val-10'), heldOut);
    expect(c.fit.heldOutErrorAfterDeg!).toBeLessThan(single.fit.heldOutErrorAfterDeg!);
  });

  it('records its provenance: which checks, which model, the residual and the errors before and after', () => {
    const c = corrected('affine', byId('val-10'), byId('held-10.6'));
    expect(c).toMatchObject({ sessionId: 'sim', model: 'affine', fromValidationIds: ['val-10'], heldOutValidationIds: ['held-10.6'], createdBy: 'op-1', enabled: true, removedAt: null });
    expect(c.fit.rmsResidualPx).toBeGreaterThan(0);
    const map = correctionMap(c);
    expect(meanErrorDeg(pairsFromValidations(byId('held-10.6'), display), display, map)).toBe(c.fit.heldOutErrorAfterDeg);
  });

  it('refuses checks of another session, or a check both fitted on and held out', () => {
    const other = { ...byId('val-10')[0]!, sessionId: 'other' };
    expect(() => corrected('offset', [other], [])).toThrow(/belongs to session other/);
    expect(() => corrected('offset', byId('val-10'), byId('val-10'))).toThrow(/both fitted on and held out/);
  });
});
