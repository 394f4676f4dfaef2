import type { CorrectionRecord } from '../../study/records';
import { correctionMap } from './models';

/** A session's gaze as columns: host time (ns) and screen px, NaN where a sample is invalid. */
export interface GazeColumns {
  readonly hostNs: ArrayLike<number>;
  readonly x: Float64Array;
  readonly y: Float64Array;
}

/**
 * The samples with a correction applied, in NEW arrays: the given ones are never written.
 * An invalid sample (x or y not finite) stays NaN.
 */
export function correctSamples(record: Pick<CorrectionRecord, 'model' | 'params'>, samples: GazeColumns): { x: Float64Array; y: Float64Array } {
  const n = samples.x.length;
  if (samples.y.length !== n || samples.hostNs.length !== n) throw new RangeError(`hostNs, x and y must have the same length, got ${samples.hostNs.length}, ${n} and ${samples.y.length}`);
  const map = correctionMap(record);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const sx = samples.x[i]!;
    const sy = samples.y[i]!;
    if (!(Number.isFinite(sx) && Number.isFinite(sy))) {
      x[i] = Number.NaN;
      y[i] = Number.NaN;
      continue;
    }
    const c = map(sx, sy, samples.hostNs[i]!);
    x[i] = c.x;
    y[i] = c.y;
  }
  return { x, y };
}

/** The session's correction that is switched on (the latest created, if several are), or null. */
export function activeCorrection(records: readonly CorrectionRecord[], sessionId: string): CorrectionRecord | null {
  const on = records.filter((r) => r.sessionId === sessionId && r.enabled && r.removedAt === null);
  return on.sort((a, b) => b.createdAt.localeCompare(a.createdAt) || b.id.localeCompare(a.id))[0] ?? null;
}

/**
 * The gaze analysis and release use: corrected when the session has a correction switched
 * on (and which one, so that they can say so), otherwise the recorded arrays themselves.
 */
export function gazeForAnalysis(samples: GazeColumns, records: readonly CorrectionRecord[], sessionId: string): { x: Float64Array; y: Float64Array; correctionId: string | null } {
  const active = activeCorrection(records, sessionId);
  if (!active) return { x: samples.x, y: samples.y, correctionId: null };
  return { ...correctSamples(active, samples), correctionId: active.id };
}

/** A correction switched off and marked removed; the record itself is kept as provenance. */
export function removedCorrection(record: CorrectionRecord, at: string): CorrectionRecord {
  return { ...record, enabled: false, removedAt: at };
}
