import { LabSettings } from '../lab/LabSettings';
import { useLab } from '../lab/lab-context';
import { useLabQuery } from '../lab/use-lab-query';
import { CreateStudy } from './CreateStudy';
import { StudyList } from './StudyList';
import { StudyStimuli } from './StudyStimuli';

/** The lab's studies: make one, choose the one being run, pick its stimuli; and the lab's settings. */
export function StudyScreen() {
  const { studyId } = useLab();
  const studies = useLabQuery(['studies'], (store) => store.list('studies'));
  const chosen = studies?.find((s) => s.id === studyId) ?? null;
  return (
    <main className="study-screen" aria-label="Study">
      <section className="panel" aria-labelledby="studies-heading">
        <h2 id="studies-heading">Studies</h2>
        {studies === null && <p className="muted">Reading the studies…</p>}
        {studies?.length === 0 && <p className="muted">No study yet. Make the first one below.</p>}
        {studies && studies.length > 0 && <StudyList studies={studies} />}
        <CreateStudy />
      </section>
      {chosen ? (
        <StudyStimuli study={chosen} />
      ) : (
        <section className="panel">
          <h2>Stimuli</h2>
          <p className="muted">Choose a study to pick its stimuli.</p>
        </section>
      )}
      <LabSettings />
    </main>
  );
}
