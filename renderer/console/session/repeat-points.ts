import { summarizeValidation } from '../../../app/core/quality';
import type { ProtocolRecord, TargetResult, ValidationRecord } from '../../../app/core/study/records';

/**
 * A validation with some of its points measured again: the repeated points replace those
 * of `last` (matched by their index in `last.points`), the others are kept, and the whole
 * is judged against the protocol's thresholds again. The result is a new record (the old
 * one stays as it was); its hostNs is the start of the repeat.
 */
export function mergeRepeatedPoints(input: { last: ValidationRecord; repeated: readonly { index: number; result: TargetResult }[]; thresholds: ProtocolRecord['thresholds']; hostNs: number; at: string; id: string }): { record: ValidationRecord; reasons: string[] } {
  const points = [...input.last.points];
  for (const { index, result } of input.repeated) {
    if (!Number.isInteger(index) || index < 0 || index >= points.length) throw new RangeError(`repeated point index ${index} is outside the validation's ${points.length} points`);
    points[index] = result;
  }
  const q = summarizeValidation(points, input.thresholds);
  return {
    record: { ...input.last, id: input.id, at: input.at, hostNs: input.hostNs, points, meanAccuracyDeg: q.meanAccuracyDeg, maxAccuracyDeg: q.maxAccuracyDeg, accepted: q.accepted },
    reasons: q.reasons,
  };
}
