import { useState } from 'react';
import { activeCorrection } from '../../../app/core/quality/correction';
import type { ValidationRecord } from '../../../app/core/study/records';
import { CorrectionsPanel } from './CorrectionsPanel';
import { ExclusionsPanel } from './ExclusionsPanel';
import { PointTable } from './PointTable';
import { QualityPlots } from './QualityPlots';
import { formatDeg } from './quality-format';
import { SessionFigures } from './SessionFigures';
import { limitsOf, useSessionQuality, useSessionRecords, useSessionSeries } from './use-session-quality';
import { ValidationDiagram } from './ValidationDiagram';

/** One session's quality: figures, the validation diagram and table, plots over time, exclusions and correction. */
export function SessionQualityView({ sessionId }: { sessionId: string }) {
  const records = useSessionRecords(sessionId);
  const series = useSessionSeries(sessionId);
  const quality = useSessionQuality(records, series);
  const [shownId, setShownId] = useState<string | null>(null);
  if (records === null) return <p className="muted">Reading the session…</p>;
  if (records === undefined) return <p className="failure">No session {sessionId} in this lab.</p>;
  const { session, validations } = records;
  const limits = limitsOf(records.protocol);
  const first = series?.ok ? series.series.firstSampleHostNs : null;
  const timeOf = (v: ValidationRecord) => (first === null ? v.at.slice(11, 19) : `${((v.hostNs - first) / 1e9).toFixed(1)} s`);
  const shown = validations.find((v) => v.id === shownId) ?? validations.filter((v) => v.kind === 'validation').at(-1) ?? validations[0] ?? null;
  const active = activeCorrection(records.corrections, session.id);

  return (
    <section className="session-quality" aria-labelledby="session-quality-heading">
      <h2 id="session-quality-heading">
        Session {records.participantCode} <span className="muted">{session.id}</span>
        {active && <span className="badge badge-warn">correction on</span>}
      </h2>
      {series && !series.ok && (
        <p className="warning" role="alert">
          The recording could not be read ({series.message}): times, data loss and late frames are missing.
        </p>
      )}
      {quality ? <SessionFigures quality={quality} /> : <p className="muted">Reading the recording…</p>}
      <div className="panel">
        <h3>Validations and drift checks</h3>
        {validations.length === 0 ? (
          <p className="muted">This session has no validation or drift check.</p>
        ) : (
          <label className="field">
            Shown on the diagram
            <select value={shown?.id ?? ''} onChange={(e) => setShownId(e.target.value)}>
              {validations.map((v) => (
                <option key={v.id} value={v.id}>
                  {`${v.kind === 'validation' ? 'Validation' : 'Drift check'} at ${timeOf(v)}: mean ${formatDeg(v.meanAccuracyDeg)}, ${v.accepted ? 'accepted' : 'not accepted'}`}
                </option>
              ))}
            </select>
          </label>
        )}
        {shown && (
          <div className="detail-columns">
            <ValidationDiagram validation={shown} display={session.display} />
            <PointTable validation={shown} caption="Accuracy and precision per point" />
          </div>
        )}
      </div>
      {quality && <QualityPlots quality={quality} series={series?.ok ? series.series : null} driftDeg={limits.driftDeg} dataLossPct={limits.dataLossPct} />}
      <div className="detail-columns">
        <ExclusionsPanel sessionId={session.id} exclusions={records.exclusions} clips={records.clips} />
        <CorrectionsPanel key={session.id} session={session} checks={validations} corrections={records.corrections} timeOf={timeOf} />
      </div>
    </section>
  );
}
