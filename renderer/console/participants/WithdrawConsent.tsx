import { useState } from 'react';
import { sealText } from '../../../app/core/crypto';
import type { ConsentRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { localInputValue, withdrawalScopeLabels } from './consent-status';
import { ProblemNote } from '../ProblemNote';

type Scope = NonNullable<ConsentRecord['withdrawal']>['scope'];

/** Withdrawal asks for its date and scope and a confirmation; it is recorded on the consent and audited. */
export function WithdrawConsent({ consent }: { consent: ConsentRecord }) {
  const { store, dataKey, operator } = useLab();
  const [open, setOpen] = useState(false);
  const [at, setAt] = useState(() => localInputValue(new Date()));
  const [scope, setScope] = useState<Scope>('all_use');
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  if (!open)
    return (
      <button type="button" className="secondary danger" onClick={() => setOpen(true)}>
        Record a withdrawal…
      </button>
    );

  const withdraw = async () => {
    const when = new Date(at);
    if (Number.isNaN(when.getTime())) return setProblem('Withdrawn at: a date and time.');
    if (!dataKey || !operator) return setProblem('The console is locked.');
    const withdrawal = { at: when.toISOString(), scope, operatorId: operator.id, note: await sealText(dataKey, note.trim() || null) };
    await store.put('consents', { ...consent, withdrawal }, { operatorId: operator.id, action: 'withdraw', summary: `scope ${scope}; fields: ${note.trim() ? 'withdrawal.note' : 'none'}` });
    setOpen(false);
  };

  return (
    <div className="confirm" role="group" aria-label="Record a withdrawal">
      <p>Withdrawal excludes this person from every later release. It cannot be undone here; a new consent form can be recorded later.</p>
      <label className="field">
        Withdrawn at
        <input type="datetime-local" value={at} onChange={(event) => setAt(event.target.value)} />
      </label>
      <fieldset>
        <legend>Withdrawal scope</legend>
        {(Object.keys(withdrawalScopeLabels) as Scope[]).map((s) => (
          <label key={s} className="check">
            <input type="radio" name={`scope-${consent.id}`} checked={scope === s} onChange={() => setScope(s)} /> {withdrawalScopeLabels[s]}
          </label>
        ))}
      </fieldset>
      <label className="field">
        Withdrawal note (optional, encrypted)
        <textarea value={note} rows={2} onChange={(event) => setNote(event.target.value)} />
      </label>
      <ProblemNote problem={problem} />
      <div className="button-row">
        <button type="button" className="danger" onClick={() => void withdraw()}>
          Record the withdrawal
        </button>
        <button type="button" className="secondary" onClick={() => setOpen(false)}>
          Keep the consent
        </button>
      </div>
    </div>
  );
}
