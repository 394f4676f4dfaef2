import { useState } from 'react';
import { KeyringDamagedError, unlockWithPassphrase, unlockWithRecoveryKey, readRecoveryKey } from '../../../app/core/crypto';
import { DEMO_PASSPHRASE } from './demo-study';
import { useLabState } from './lab-context';
import { OperatorChoice } from './OperatorChoice';
import { ProblemNote } from '../ProblemNote';

/**
 * Covers the console while the lab is locked: the passphrase (or the recovery key) opens it,
 * then the operator says who they are. A wrong secret reads nothing and says so.
 */
export function LockScreen({ preselectOperatorId }: { preselectOperatorId: string | null }) {
  const lab = useLabState();
  return (
    <div className="lock-overlay">
      <section className="lock-panel panel" role="dialog" aria-modal="true" aria-labelledby="lock-heading">
        {lab.keyring?.demo && (
          <p className="demo-banner">
            Demo study: invented data. Its passphrase is <code className="demo-passphrase">{DEMO_PASSPHRASE}</code>. A real lab starts its own (see the README).
          </p>
        )}
        {lab.phase === 'locked' ? <UnlockForm /> : <OperatorChoice preselectId={preselectOperatorId} />}
      </section>
    </div>
  );
}

function UnlockForm() {
  const lab = useLabState();
  const [useRecovery, setUseRecovery] = useState(false);
  const [secret, setSecret] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const keyring = lab.keyring!;

  const submit = async () => {
    if (useRecovery) {
      const reading = readRecoveryKey(secret);
      if (!reading.ok) return setProblem(reading.message);
    }
    setBusy(true);
    setProblem(null);
    try {
      const key = useRecovery ? await unlockWithRecoveryKey(keyring, secret) : await unlockWithPassphrase(keyring, secret);
      if (!key) return setProblem(useRecovery ? 'Wrong recovery key' : 'Wrong passphrase');
      setSecret('');
      lab.unlocked(key);
    } catch (error) {
      if (error instanceof KeyringDamagedError) return setProblem(`The lab's keyring is damaged (${error.message}). Restore it from a lab archive backup.`);
      throw error;
    } finally {
      setBusy(false);
    }
  };

  return (
    <form
      onSubmit={(event) => {
        event.preventDefault();
        void submit();
      }}
    >
      <h2 id="lock-heading">The console is locked</h2>
      <p className="muted">Personal details stay encrypted until the lab {useRecovery ? 'recovery key' : 'passphrase'} is given.</p>
      <label className="field">
        {useRecovery ? 'Recovery key' : 'Lab passphrase'}
        <input type={useRecovery ? 'text' : 'password'} value={secret} autoFocus autoComplete="off" spellCheck={false} onChange={(event) => setSecret(event.target.value)} />
      </label>
      <ProblemNote problem={problem} />
      <div className="button-row">
        <button type="submit" disabled={busy || secret.length === 0}>
          {busy ? 'Opening…' : 'Unlock'}
        </button>
        <button
          type="button"
          className="link"
          onClick={() => {
            setUseRecovery(!useRecovery);
            setSecret('');
            setProblem(null);
          }}
        >
          {useRecovery ? 'Use the passphrase' : 'Forgot the passphrase? Use the recovery key'}
        </button>
      </div>
    </form>
  );
}
