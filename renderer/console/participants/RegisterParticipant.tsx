import { useState } from 'react';
import { generateParticipantCode } from '../../../app/core/study/participant-code';
import { handednesses, sexes, visionCorrections } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { EligibilityFields } from './EligibilityFields';
import { draftProblems, emptyDraft, givenFields, participantRecord, type ParticipantDraft } from './participant-draft';

/** Uniform in [0, 1) from the platform's cryptographic generator: codes must not be guessable from each other. */
const cryptoRandom = () => globalThis.crypto.getRandomValues(new Uint32Array(1))[0]! / 4294967296;
const words = (value: string) => value.replace(/_/g, ' ');

export function RegisterParticipant({ studyId, onRegistered, onCancel }: { studyId: string; onRegistered: (id: string) => void; onCancel: () => void }) {
  const { store, dataKey, operator } = useLab();
  const [draft, setDraft] = useState<ParticipantDraft>(emptyDraft);
  const [problems, setProblems] = useState<string[]>([]);
  const set = <K extends keyof ParticipantDraft>(field: K, value: ParticipantDraft[K]) => setDraft({ ...draft, [field]: value });

  const register = async () => {
    const found = draftProblems(draft);
    setProblems(found);
    if (found.length > 0 || !dataKey) return;
    const everyone = await store.list('participants');
    const code = generateParticipantCode(cryptoRandom, new Set(everyone.map((p) => p.code)));
    const enrolment = Math.max(0, ...everyone.filter((p) => p.studyId === studyId).map((p) => p.enrolment)) + 1;
    const record = await participantRecord(draft, dataKey, { id: `p-${globalThis.crypto.randomUUID()}`, studyId, code, enrolment, createdAt: new Date().toISOString() });
    await store.put('participants', record, { operatorId: operator?.id ?? null, action: 'register', summary: `code ${code}; personal fields given: ${givenFields(draft)}` });
    onRegistered(record.id);
  };

  const text = (field: 'name' | 'contact' | 'birthDate', label: string, type = 'text') => (
    <label className="field">
      {label}
      <input type={type} value={draft[field]} autoComplete="off" onChange={(event) => set(field, event.target.value)} />
    </label>
  );
  return (
    <form
      className="panel register-participant"
      aria-labelledby="register-heading"
      onSubmit={(event) => {
        event.preventDefault();
        void register();
      }}
    >
      <h2 id="register-heading">Register a participant</h2>
      <p className="muted">A pseudonymous code is generated on saving. Name, contact, birth date and notes are stored encrypted and never leave this machine in clear.</p>
      <div className="detail-columns">
        <fieldset>
          <legend>Personal details (encrypted)</legend>
          {text('name', 'Name')}
          {text('contact', 'Contact (email or phone)')}
          {text('birthDate', 'Birth date', 'date')}
          <label className="field">
            Notes about the participant
            <textarea value={draft.notes} rows={2} onChange={(event) => set('notes', event.target.value)} />
          </label>
        </fieldset>
        <fieldset>
          <legend>Demographics (kept for release)</legend>
          <label className="field">
            Age in years
            <input inputMode="numeric" value={draft.age} onChange={(event) => set('age', event.target.value)} />
          </label>
          <label className="field">
            Sex
            <select value={draft.sex} onChange={(event) => set('sex', event.target.value as ParticipantDraft['sex'])}>
              {sexes.map((v) => <option key={v} value={v}>{words(v)}</option>)}
            </select>
          </label>
          <label className="field">
            Handedness
            <select value={draft.handedness} onChange={(event) => set('handedness', event.target.value as ParticipantDraft['handedness'])}>
              {handednesses.map((v) => <option key={v} value={v}>{words(v)}</option>)}
            </select>
          </label>
          <label className="field">
            Vision correction
            <select value={draft.visionCorrection} onChange={(event) => set('visionCorrection', event.target.value as ParticipantDraft['visionCorrection'])}>
              {visionCorrections.map((v) => <option key={v} value={v}>{words(v)}</option>)}
            </select>
          </label>
        </fieldset>
      </div>
      <EligibilityFields value={draft.eligibility} onChange={(eligibility) => set('eligibility', eligibility)} />
      {problems.length > 0 && (
        <ul className="failure" role="alert">
          {problems.map((p) => <li key={p}>{p}</li>)}
        </ul>
      )}
      <div className="dialog-buttons">
        <button type="button" className="secondary" onClick={onCancel}>
          Cancel
        </button>
        <button type="submit" disabled={!dataKey}>
          Register
        </button>
      </div>
    </form>
  );
}
