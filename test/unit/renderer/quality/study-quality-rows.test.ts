import { describe, expect, it } from 'vitest';
import { sortStudyQuality, type StudyQualityRow } from '../../../../renderer/console/quality/study-quality-rows';

const row = (code: string, startedAt: string, meanAccuracyDeg: number | null, flags: string[] = []): StudyQualityRow => ({
  sessionId: `s-${code}`,
  participantCode: code,
  startedAt,
  meanAccuracyDeg,
  maxAccuracyDeg: null,
  precisionRmsS2SDeg: null,
  dataLossPct: null,
  maxDriftDeg: null,
  driftRateDegPerMin: null,
  flags,
  excluded: false,
  corrected: false,
});

// The study table's order (Gazeloom's own rule, no source): flagged sessions first, then the chosen column.
describe('study quality order', () => {
  const rows = [row('A', '2026-01-01', 0.4), row('B', '2026-01-02', 0.9, ['drift_exceeded']), row('C', '2026-01-03', null), row('D', '2026-01-04', 0.2), row('E', '2026-01-05', 1.2, ['validation_failed', 'drift_exceeded'])];
  const codes = (r: StudyQualityRow[]) => r.map((x) => x.participantCode).join('');

  it('puts flagged sessions first whichever way a column is sorted, missing figures last', () => {
    expect(codes(sortStudyQuality(rows, { column: 'meanAccuracyDeg', descending: false }))).toBe('BEDAC');
    expect(codes(sortStudyQuality(rows, { column: 'meanAccuracyDeg', descending: true }))).toBe('EBADC');
    expect(codes(sortStudyQuality(rows, { column: 'participantCode', descending: true }))).toBe('EBDCA');
    expect(codes(sortStudyQuality(rows, { column: 'flags', descending: true }))).toBe('EBACD');
  });

  it('keeps every row and leaves the input as it was', () => {
    const copy = [...rows];
    expect(sortStudyQuality(rows, { column: 'startedAt', descending: false })).toHaveLength(rows.length);
    expect(rows).toEqual(copy);
  });
});
