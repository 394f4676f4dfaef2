import { useState } from 'react';
import { flagLabel, formatDeg, formatPct, formatRate } from './quality-format';
import { sortStudyQuality, type SortColumn, type SortOrder, type StudyQualityRow } from './study-quality-rows';

const columns: readonly { id: SortColumn; label: string; show: (r: StudyQualityRow) => string }[] = [
  { id: 'participantCode', label: 'Participant', show: (r) => r.participantCode },
  { id: 'startedAt', label: 'Started', show: (r) => r.startedAt.slice(0, 16).replace('T', ' ') },
  { id: 'meanAccuracyDeg', label: 'Mean accuracy', show: (r) => formatDeg(r.meanAccuracyDeg) },
  { id: 'maxAccuracyDeg', label: 'Worst point', show: (r) => formatDeg(r.maxAccuracyDeg) },
  { id: 'precisionRmsS2SDeg', label: 'Precision RMS-S2S', show: (r) => formatDeg(r.precisionRmsS2SDeg) },
  { id: 'dataLossPct', label: 'Data loss', show: (r) => formatPct(r.dataLossPct) },
  { id: 'maxDriftDeg', label: 'Largest drift', show: (r) => formatDeg(r.maxDriftDeg) },
  { id: 'driftRateDegPerMin', label: 'Drift rate', show: (r) => formatRate(r.driftRateDegPerMin) },
  { id: 'flags', label: 'Flags', show: (r) => (r.flags.length ? r.flags.map(flagLabel).join(', ') : 'none') },
];

/**
 * Every session of the study against the protocol's thresholds: flagged sessions first,
 * then by the column chosen (click a heading; again to reverse).
 */
export function StudyQualityTable({ rows, chosen, onChoose, thresholds }: { rows: readonly StudyQualityRow[]; chosen: string | null; onChoose: (sessionId: string) => void; thresholds: string }) {
  const [order, setOrder] = useState<SortOrder>({ column: 'startedAt', descending: false });
  const sorted = sortStudyQuality(rows, order);
  const sortBy = (column: SortColumn) => setOrder((o) => ({ column, descending: o.column === column ? !o.descending : false }));
  return (
    <>
      <p className="muted">{thresholds} Flagged sessions are listed first; the figures are those of each session's last validation.</p>
      <table className="quality-table" aria-label="Sessions by quality">
        <thead>
          <tr>
            {columns.map((c) => (
              <th key={c.id} scope="col" aria-sort={order.column === c.id ? (order.descending ? 'descending' : 'ascending') : 'none'}>
                <button type="button" className="link" onClick={() => sortBy(c.id)} aria-label={`Sort by ${c.label}`}>
                  {c.label}
                  {order.column === c.id ? (order.descending ? ' ▼' : ' ▲') : ''}
                </button>
              </th>
            ))}
            <th scope="col">Review</th>
          </tr>
        </thead>
        <tbody>
          {sorted.map((r) => (
            <tr key={r.sessionId} className={`${r.flags.length ? 'flagged' : ''} ${r.sessionId === chosen ? 'selected' : ''}`} data-session={r.sessionId}>
              {columns.map((c) => (
                <td key={c.id}>{c.show(r)}</td>
              ))}
              <td>
                {r.excluded && <span className="badge badge-warn">excluded</span>} {r.corrected && <span className="badge">correction on</span>}{' '}
                <button type="button" className="secondary" onClick={() => onChoose(r.sessionId)} aria-label={`Review session of ${r.participantCode}`} aria-pressed={r.sessionId === chosen}>
                  Review
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
