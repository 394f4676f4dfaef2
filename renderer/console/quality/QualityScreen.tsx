import { useState } from 'react';
import { DEFAULT_QUALITY_LIMITS } from '../../../app/core/quality/session-quality';
import { useLab } from '../lab/lab-context';
import { useLabQuery } from '../lab/use-lab-query';
import './quality.css';
import { SessionQualityView } from './SessionQualityView';
import { StudyQualityTable } from './StudyQualityTable';
import { useStudyQuality } from './use-study-quality';

/** Data quality of the chosen study: every session against the thresholds, then one session in detail. */
export function QualityScreen() {
  const { studyId } = useLab();
  const study = useLabQuery(['studies'], (store) => (studyId ? store.get('studies', studyId) : Promise.resolve(undefined)), [studyId]);
  if (!studyId)
    return (
      <main className="quality-screen" aria-label="Quality">
        <p className="muted">Choose or create a study first (Study screen).</p>
      </main>
    );
  return (
    <main className="quality-screen" aria-label="Quality">
      <StudyQuality studyId={studyId} name={study?.name ?? ''} />
    </main>
  );
}

function StudyQuality({ studyId, name }: { studyId: string; name: string }) {
  const quality = useStudyQuality(studyId);
  const protocol = useLabQuery(['protocols'], (store) => store.list('protocols', { studyId }).then((all) => all.at(-1) ?? null), [studyId]);
  const [chosen, setChosen] = useState<string | null>(null);
  const t = protocol?.thresholds;
  const thresholds = t ? `Thresholds: mean accuracy ${t.validationMeanDeg}°, any point ${t.validationMaxDeg}°, drift ${t.driftDeg}°, data loss ${DEFAULT_QUALITY_LIMITS.dataLossPct} %, drift rate ${DEFAULT_QUALITY_LIMITS.driftRateDegPerMin}°/min.` : '';
  return (
    <>
      <section className="panel" aria-labelledby="study-quality-heading">
        <h2 id="study-quality-heading">Quality of {name || 'the study'}</h2>
        {quality === null && <p className="muted">Reading the sessions…</p>}
        {quality?.rows.length === 0 && <p className="muted">No session has been run in this study yet.</p>}
        {quality && quality.rows.length > 0 && <StudyQualityTable rows={quality.rows} chosen={chosen} onChoose={setChosen} thresholds={thresholds} />}
        {quality && quality.unread.length > 0 && (
          <p className="muted" role="status">
            Reading or missing the recording of {quality.unread.length} session{quality.unread.length === 1 ? '' : 's'}: data loss and late frames show as n/a until it is read.
          </p>
        )}
      </section>
      {chosen && <SessionQualityView key={chosen} sessionId={chosen} />}
    </>
  );
}
