import { useState } from 'react';
import { unlockWithPassphrase } from '../../../app/core/crypto';
import type { RekeyProgress } from '../../db/lab-store';
import { useLabState } from './lab-context';
import { PassphrasePair } from './PassphrasePair';

const describe = (p: RekeyProgress): string =>
  p.phase === 'deriving' ? 'Deriving the new key…' : p.phase === 'encrypting' ? `Re-encrypting personal fields: ${p.done} of ${p.total}` : 'Writing everything in one transaction…';

/**
 * A new passphrase: the current one first (someone at an unlocked console is not enough),
 * then every personal field is re-encrypted under a new key in one transaction.
 */
export function ChangePassphrase() {
  const lab = useLabState();
  const [current, setCurrent] = useState('');
  const [busy, setBusy] = useState(false);
  const [progress, setProgress] = useState<RekeyProgress | null>(null);
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string } | null>(null);

  const change = async (passphrase: string) => {
    setBusy(true);
    setOutcome(null);
    try {
      if (!(await unlockWithPassphrase(lab.keyring!, current))) return setOutcome({ ok: false, text: 'Wrong passphrase: the current passphrase is needed to change it.' });
      const key = await lab.store!.changePassphrase(lab.dataKey!, passphrase, setProgress, lab.operator?.id ?? null);
      await lab.reload(key);
      setCurrent('');
      setOutcome({ ok: true, text: 'The passphrase was changed and every personal field re-encrypted. The recovery key is unchanged.' });
    } catch (error) {
      setOutcome({ ok: false, text: `Nothing was changed: ${(error as Error).message}` });
    } finally {
      setBusy(false);
      setProgress(null);
    }
  };

  return (
    <div className="change-passphrase">
      <h3>Change the passphrase</h3>
      <label className="field">
        Current passphrase
        <input type="password" value={current} autoComplete="current-password" onChange={(event) => setCurrent(event.target.value)} />
      </label>
      <PassphrasePair submitLabel="Change the passphrase" busy={busy} onSubmit={change} />
      {progress && (
        <p>
          {describe(progress)}
          <progress max={progress.phase === 'encrypting' ? progress.total : 1} value={progress.phase === 'encrypting' ? progress.done : progress.phase === 'writing' ? 1 : undefined} aria-label="Passphrase change progress" />
        </p>
      )}
      {outcome && (
        <p className={outcome.ok ? '' : 'failure'} role={outcome.ok ? 'status' : 'alert'}>
          {outcome.text}
        </p>
      )}
    </div>
  );
}
