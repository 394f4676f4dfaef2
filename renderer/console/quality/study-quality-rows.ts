import type { SessionQuality } from '../../../app/core/quality/session-quality';

/** One row of the study's quality table: a session's figures against the protocol's thresholds. */
export interface StudyQualityRow {
  readonly sessionId: string;
  readonly participantCode: string;
  readonly startedAt: string;
  /** Of the session's last validation (the one its data rests on). */
  readonly meanAccuracyDeg: number | null;
  readonly maxAccuracyDeg: number | null;
  readonly precisionRmsS2SDeg: number | null;
  readonly dataLossPct: number | null;
  /** The largest drift-check offset. */
  readonly maxDriftDeg: number | null;
  readonly driftRateDegPerMin: number | null;
  readonly flags: readonly string[];
  readonly excluded: boolean;
  /** A correction is switched on for the session. */
  readonly corrected: boolean;
}

export type SortColumn = 'participantCode' | 'startedAt' | 'meanAccuracyDeg' | 'maxAccuracyDeg' | 'precisionRmsS2SDeg' | 'dataLossPct' | 'maxDriftDeg' | 'driftRateDegPerMin' | 'flags';
export interface SortOrder {
  readonly column: SortColumn;
  readonly descending: boolean;
}

export function studyQualityRow(q: SessionQuality, participantCode: string, startedAt: string, marks: { excluded: boolean; corrected: boolean }): StudyQualityRow {
  const last = q.validations.at(-1);
  const drifts = q.drift.map((d) => d.offset_deg).filter((v): v is number => v !== null && Number.isFinite(v));
  return {
    sessionId: q.session,
    participantCode,
    startedAt,
    meanAccuracyDeg: last?.mean_accuracy_deg ?? null,
    maxAccuracyDeg: last?.max_accuracy_deg ?? null,
    precisionRmsS2SDeg: last?.precision_rms_s2s_deg ?? null,
    dataLossPct: q.data_loss_pct ?? null,
    maxDriftDeg: drifts.length > 0 ? Math.max(...drifts) : null,
    driftRateDegPerMin: q.drift_rate_deg_per_min ?? null,
    flags: q.flags,
    ...marks,
  };
}

const valueOf = (row: StudyQualityRow, column: SortColumn): string | number | null => (column === 'flags' ? row.flags.length : row[column]);

/**
 * Flagged sessions first, always; within each group by the chosen column, missing figures
 * last whichever the direction, then by start time so the order is stable.
 */
export function sortStudyQuality(rows: readonly StudyQualityRow[], order: SortOrder): StudyQualityRow[] {
  return [...rows].sort((a, b) => {
    const flagged = Number(b.flags.length > 0) - Number(a.flags.length > 0);
    if (flagged !== 0) return flagged;
    const va = valueOf(a, order.column);
    const vb = valueOf(b, order.column);
    if (va === null || vb === null) {
      if (va !== vb) return va === null ? 1 : -1;
    } else {
      const c = typeof va === 'string' ? va.localeCompare(vb as string) : va - (vb as number);
      if (c !== 0) return order.descending ? -c : c;
    }
    return a.startedAt.localeCompare(b.startedAt);
  });
}
