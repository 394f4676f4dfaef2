import { openText } from '../../../app/core/crypto';
import { checkEligibility } from '../../../app/core/study/eligibility';
import type { ConsentRecord, ParticipantRecord } from '../../../app/core/study/records';
import { useLabQuery } from '../lab/use-lab-query';
import { useOpened } from '../lab/use-opened';
import { ConsentList } from './ConsentList';
import { EditEligibility } from './EditEligibility';
import { RecordConsent } from './RecordConsent';

const words = (value: string) => value.replace(/_/g, ' ');

/** One participant: personal details (decrypted only while unlocked), demographics, eligibility and consent. */
export function ParticipantDetail({ participant: p, consents }: { participant: ParticipantRecord; consents: ConsentRecord[] }) {
  const personal = useOpened(
    async (key) => ({ name: await openText(key, p.name), contact: await openText(key, p.contact), birthDate: await openText(key, p.birthDate), notes: await openText(key, p.notes) }),
    [p],
  );
  const stimuli = useLabQuery(['stimuli'], (store) => store.list('stimuli', { studyId: p.studyId }), [p.studyId]);
  const eligibility = stimuli ? checkEligibility(p, consents, stimuli) : null;
  const shown = (text: string | null | undefined) => (personal.value ? (text ?? <span className="muted">not given</span>) : <span className="muted">locked</span>);
  return (
    <section className="panel participant-detail" aria-labelledby="participant-heading">
      <h2 id="participant-heading" className="path">
        {p.code}
      </h2>
      <p className="muted">
        Enrolment {p.enrolment} · registered {new Date(p.createdAt).toLocaleString()}
      </p>
      {personal.failure && (
        <p className="failure" role="alert">
          {personal.failure}
        </p>
      )}
      <div className="detail-columns">
        <dl className="facts" aria-label="Personal details">
          <dt>Name</dt>
          <dd>{shown(personal.value?.name)}</dd>
          <dt>Contact</dt>
          <dd>{shown(personal.value?.contact)}</dd>
          <dt>Birth date</dt>
          <dd>{shown(personal.value?.birthDate)}</dd>
          <dt>Notes</dt>
          <dd>{shown(personal.value?.notes)}</dd>
        </dl>
        <dl className="facts" aria-label="Demographics">
          <dt>Age</dt>
          <dd>{p.demographics.age ?? 'not given'}</dd>
          <dt>Sex</dt>
          <dd>{words(p.demographics.sex)}</dd>
          <dt>Handedness</dt>
          <dd>{words(p.demographics.handedness)}</dd>
          <dt>Vision correction</dt>
          <dd>{words(p.demographics.visionCorrection)}</dd>
        </dl>
      </div>
      <h3>Eligibility</h3>
      {eligibility && (eligibility.ok ? <p>Can be run on every clip of the study.</p> : <ul className="warning" aria-label="Eligibility problems">{eligibility.problems.map((problem) => <li key={problem}>{problem}</li>)}</ul>)}
      <EditEligibility participant={p} />
      <h3>Consent</h3>
      <ConsentList consents={consents} />
      <RecordConsent participantId={p.id} />
    </section>
  );
}
