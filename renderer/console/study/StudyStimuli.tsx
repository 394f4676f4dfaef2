import { useEffect } from 'react';
import type { StudyRecord } from '../../../app/core/study/records';
import { FailureNote } from '../FailureNote';
import { useLab } from '../lab/lab-context';
import { useLabQuery } from '../lab/use-lab-query';
import { useStimuli } from '../stimuli/use-stimuli';
import { staleStimuli, stimulusFromLibrary } from './library-mirror';

/** Which library clips the study uses; each keeps the library's "may flash" mark. */
export function StudyStimuli({ study }: { study: StudyRecord }) {
  const { store, operator } = useLab();
  const { stimuli: library, failure } = useStimuli();
  const records = useLabQuery(['stimuli'], (s) => s.list('stimuli'));
  const audit = (action: string, summary: string) => ({ operatorId: operator?.id ?? null, action, summary });

  useEffect(() => {
    if (!library || !records) return;
    const stale = staleStimuli(records, library);
    if (stale.length > 0) void store.putMany(stale.map((record) => ({ table: 'stimuli' as const, record })), audit('mirror_library', 'fields: name, durationS, sensor, mayFlash'));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [library, records, store]);

  const byId = new Map((records ?? []).map((r) => [r.id, r]));
  return (
    <section className="panel" aria-labelledby="study-stimuli-heading">
      <h2 id="study-stimuli-heading">Stimuli of “{study.name}”</h2>
      {failure && <FailureNote failure={failure} />}
      {(library === null || records === null) && <p className="muted">Reading the library…</p>}
      {library?.length === 0 && <p className="muted">The stimulus library is empty: import recordings on the Stimuli screen.</p>}
      {library && records && library.length > 0 && (
        <ul className="study-stimuli">
          {library.map((meta) => {
            const record = byId.get(meta.id);
            const elsewhere = record !== undefined && record.studyId !== study.id;
            return (
              <li key={meta.id}>
                <label className="check">
                  <input
                    type="checkbox"
                    checked={record?.studyId === study.id}
                    disabled={elsewhere}
                    onChange={(event) =>
                      void (event.target.checked
                        ? store.put('stimuli', stimulusFromLibrary(study, meta, new Date().toISOString()), audit('add_stimulus', 'fields: name, durationS, sensor, mayFlash'))
                        : store.remove('stimuli', meta.id, audit('remove_stimulus', 'record removed')))
                    }
                  />{' '}
                  {meta.name} <span className="muted">({meta.durationS.toFixed(1)} s)</span>
                  {meta.mayFlash && <span className="badge badge-warn">may flash</span>}
                  {elsewhere && <span className="muted"> used by another study</span>}
                </label>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
