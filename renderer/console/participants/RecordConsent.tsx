import { useState } from 'react';
import { sealText } from '../../../app/core/crypto';
import type { ConsentRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { localInputValue, scopeLabels } from './consent-status';
import { ProblemNote } from '../ProblemNote';

type Scopes = ConsentRecord['scopes'];
const noScopes: Scopes = { participate: false, publicRelease: false, namedCollaborators: false, recontact: false };
const scopeKeys = Object.keys(scopeLabels) as (keyof Scopes)[];

/** A signed consent form: version, date and time, the operator, the four scopes, an optional signature reference and note (encrypted). */
export function RecordConsent({ participantId }: { participantId: string }) {
  const { store, dataKey, operator } = useLab();
  const [open, setOpen] = useState(false);
  const [formVersion, setFormVersion] = useState('');
  const [signedAt, setSignedAt] = useState(() => localInputValue(new Date()));
  const [scopes, setScopes] = useState<Scopes>(noScopes);
  const [signatureRef, setSignatureRef] = useState('');
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

  if (!open)
    return (
      <button type="button" onClick={() => setOpen(true)}>
        Record consent…
      </button>
    );

  const save = async () => {
    if (formVersion.trim() === '') return setProblem('Form version: which version of the consent form was signed (e.g. v2).');
    const when = new Date(signedAt);
    if (Number.isNaN(when.getTime())) return setProblem('Signed at: a date and time.');
    if (!dataKey || !operator) return setProblem('The console is locked.');
    const record: ConsentRecord = {
      id: `c-${globalThis.crypto.randomUUID()}`,
      participantId,
      formVersion: formVersion.trim(),
      signedAt: when.toISOString(),
      operatorId: operator.id,
      scopes,
      signatureRef: await sealText(dataKey, signatureRef.trim() || null),
      note: await sealText(dataKey, note.trim() || null),
      withdrawal: null,
    };
    const given = scopeKeys.filter((k) => scopes[k]).join(', ') || 'none';
    await store.put('consents', record, { operatorId: operator.id, action: 'record_consent', summary: `form ${record.formVersion}; scopes: ${given}; fields: ${[signatureRef.trim() && 'signatureRef', note.trim() && 'note'].filter(Boolean).join(', ') || 'none'}` });
    setOpen(false);
    setFormVersion('');
    setScopes(noScopes);
    setSignatureRef('');
    setNote('');
    setProblem(null);
  };

  return (
    <form
      className="record-consent"
      aria-label="Record consent"
      onSubmit={(event) => {
        event.preventDefault();
        void save();
      }}
    >
      <div className="inline-fields">
        <label className="field">
          Form version
          <input value={formVersion} maxLength={40} autoFocus onChange={(event) => setFormVersion(event.target.value)} />
        </label>
        <label className="field">
          Signed at
          <input type="datetime-local" value={signedAt} onChange={(event) => setSignedAt(event.target.value)} />
        </label>
      </div>
      <fieldset>
        <legend>The participant agrees to</legend>
        {scopeKeys.map((k) => (
          <label key={k} className="check">
            <input type="checkbox" checked={scopes[k]} onChange={(event) => setScopes({ ...scopes, [k]: event.target.checked })} /> {scopeLabels[k]}
          </label>
        ))}
      </fieldset>
      <label className="field">
        Signature reference (optional, encrypted: typed signature or where the scan is kept)
        <input value={signatureRef} onChange={(event) => setSignatureRef(event.target.value)} />
      </label>
      <label className="field">
        Consent note (optional, encrypted)
        <textarea value={note} rows={2} onChange={(event) => setNote(event.target.value)} />
      </label>
      <ProblemNote problem={problem} />
      <div className="button-row">
        <button type="submit">Save the consent</button>
        <button type="button" className="secondary" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
