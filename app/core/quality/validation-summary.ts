import type { TargetResult } from '../study/records';

export interface ValidationThresholds {
  /** Largest acceptable mean accuracy over the points, degrees. */
  readonly validationMeanDeg: number;
  /** Largest acceptable accuracy at any one point, degrees. */
  readonly validationMaxDeg: number;
}

export interface ValidationSummary {
  readonly meanAccuracyDeg: number | null;
  readonly maxAccuracyDeg: number | null;
  /** Means over the points that have the measure. */
  readonly meanPrecisionRmsS2SDeg: number | null;
  readonly meanPrecisionSdDeg: number | null;
  /** Mean of the points' data loss (every point's window expects the same number of samples). */
  readonly dataLossPct: number | null;
  readonly accepted: boolean;
  /** Why it was not accepted, one line per problem, naming the point (1-based) where one is to blame. */
  readonly reasons: string[];
}

const mean = (values: readonly number[]): number | null => (values.length ? values.reduce((a, b) => a + b, 0) / values.length : null);
const present = (values: readonly (number | null)[]): number[] => values.filter((v): v is number => v !== null);
const deg = (v: number): string => `${v.toFixed(2)}°`;
const where = (p: TargetResult, i: number): string => `point ${i + 1} at (${Math.round(p.x)}, ${Math.round(p.y)})`;

/**
 * A validation's overall figures and whether the protocol's thresholds accept it: every
 * point must have valid gaze, the mean accuracy must not exceed validationMeanDeg and no
 * point's accuracy may exceed validationMaxDeg.
 */
export function summarizeValidation(points: readonly TargetResult[], t: ValidationThresholds): ValidationSummary {
  for (const key of ['validationMeanDeg', 'validationMaxDeg'] as const) {
    if (!(Number.isFinite(t[key]) && t[key] > 0)) throw new RangeError(`thresholds.${key} must be a number > 0, got ${t[key]}`);
  }
  const accuracies = present(points.map((p) => p.accuracyDeg));
  const meanAccuracyDeg = mean(accuracies);
  const maxAccuracyDeg = accuracies.length ? Math.max(...accuracies) : null;
  const reasons: string[] = [];
  if (points.length === 0) reasons.push('no points were measured');
  points.forEach((p, i) => {
    if (p.accuracyDeg === null) reasons.push(`${where(p, i)}: no valid gaze samples`);
    else if (p.accuracyDeg > t.validationMaxDeg) reasons.push(`${where(p, i)}: accuracy ${deg(p.accuracyDeg)} exceeds ${deg(t.validationMaxDeg)}`);
  });
  if (meanAccuracyDeg !== null && meanAccuracyDeg > t.validationMeanDeg) reasons.push(`mean accuracy ${deg(meanAccuracyDeg)} exceeds ${deg(t.validationMeanDeg)}`);
  return {
    meanAccuracyDeg,
    maxAccuracyDeg,
    meanPrecisionRmsS2SDeg: mean(present(points.map((p) => p.precisionRmsS2SDeg))),
    meanPrecisionSdDeg: mean(present(points.map((p) => p.precisionSdDeg))),
    dataLossPct: mean(points.map((p) => p.dataLossPct)),
    accepted: reasons.length === 0,
    reasons,
  };
}
