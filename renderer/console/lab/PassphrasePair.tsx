import { useState } from 'react';
import { ProblemNote } from '../ProblemNote';

export const MIN_PASSPHRASE_LENGTH = 10;

/** A new passphrase typed twice; the form says what is wrong before anything is derived. */
export function PassphrasePair({ submitLabel, busy, onSubmit }: { submitLabel: string; busy: boolean; onSubmit: (passphrase: string) => Promise<void> }) {
  const [first, setFirst] = useState('');
  const [second, setSecond] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <form
      onSubmit={(event) => {
        event.preventDefault();
        if ([...first].length < MIN_PASSPHRASE_LENGTH) return setProblem(`The passphrase needs at least ${MIN_PASSPHRASE_LENGTH} characters (a few words are easier to remember).`);
        if (first !== second) return setProblem('The two passphrases differ.');
        setProblem(null);
        void onSubmit(first);
      }}
    >
      <label className="field">
        New passphrase
        <input type="password" value={first} autoComplete="new-password" onChange={(event) => setFirst(event.target.value)} />
      </label>
      <label className="field">
        New passphrase again
        <input type="password" value={second} autoComplete="new-password" onChange={(event) => setSecond(event.target.value)} />
      </label>
      <ProblemNote problem={problem} />
      <button type="submit" disabled={busy}>
        {busy ? 'Deriving the key…' : submitLabel}
      </button>
    </form>
  );
}
