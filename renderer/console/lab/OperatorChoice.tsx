import { useState } from 'react';
import { useLabState } from './lab-context';
import { addOperator, operatorNames } from './operators';
import { useOpened } from './use-opened';

/** After unlocking: who is at the console (every change is audited under this operator). */
export function OperatorChoice({ preselectId }: { preselectId: string | null }) {
  const lab = useLabState();
  const store = lab.store!;
  const { value: operators, failure } = useOpened((key) => operatorNames(store, key), [store]);
  const [chosen, setChosen] = useState<string | null>(null);
  const [newName, setNewName] = useState('');
  const selected = chosen ?? (operators?.some((o) => o.id === preselectId) ? preselectId : (operators?.[0]?.id ?? 'new'));
  const adding = selected === 'new';

  const submit = async () => {
    if (!adding) return lab.chooseOperator(selected!);
    const record = await addOperator(store, lab.dataKey!, newName);
    lab.chooseOperator(record.id);
  };

  return (
    <form
      onSubmit={(event) => {
        event.preventDefault();
        void submit();
      }}
    >
      <h2 id="lock-heading">Who is at the console?</h2>
      {failure && (
        <p className="failure" role="alert">
          {failure}
        </p>
      )}
      {operators === null && !failure && <p className="muted">Reading the operators…</p>}
      {operators && (
        <fieldset className="operator-choice">
          <legend>Operator</legend>
          {operators.map((o) => (
            <label key={o.id} className="check">
              <input type="radio" name="operator" checked={selected === o.id} onChange={() => setChosen(o.id)} /> {o.name}
            </label>
          ))}
          <label className="check">
            <input type="radio" name="operator" checked={adding} onChange={() => setChosen('new')} /> A new operator
          </label>
        </fieldset>
      )}
      {adding && (
        <label className="field">
          New operator’s name
          <input value={newName} autoFocus onChange={(event) => setNewName(event.target.value)} />
        </label>
      )}
      <div className="button-row">
        <button type="submit" disabled={operators === null || (adding && newName.trim() === '')}>
          Continue
        </button>
        <button type="button" className="secondary" onClick={lab.lock}>
          Lock again
        </button>
      </div>
    </form>
  );
}
