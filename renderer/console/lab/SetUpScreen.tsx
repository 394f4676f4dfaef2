import { useState } from 'react';
import { createKeyring, encryptText, KDF_ITERATIONS, type DataKey } from '../../../app/core/crypto';
import type { KeyringRecord, RecordOf } from '../../../app/core/study/records';
import { useLabState } from './lab-context';
import { PassphrasePair } from './PassphrasePair';
import { RecoveryKeyStep } from './RecoveryKeyStep';

type Made = { keyring: KeyringRecord; dataKey: DataKey; recoveryKey: string };

/**
 * First run: the lab chooses its passphrase, writes the recovery key on paper (it is shown
 * this once), and the first operator gives their name. Nothing is stored until the end,
 * so a lab that stops half-way starts again with a fresh key.
 */
export function SetUpScreen() {
  const lab = useLabState();
  const [made, setMade] = useState<Made | null>(null);
  const [recoveryKept, setRecoveryKept] = useState(false);
  const [busy, setBusy] = useState(false);
  const [name, setName] = useState('');

  const finish = async () => {
    setBusy(true);
    const now = new Date().toISOString();
    const operator: RecordOf<'operators'> = { id: `op-${globalThis.crypto.randomUUID()}`, name: await encryptText(made!.dataKey, name.trim()), createdAt: now };
    await lab.store!.putMany(
      [
        { table: 'settings', record: made!.keyring },
        { table: 'operators', record: operator },
      ],
      { operatorId: operator.id, action: 'set_up', summary: 'new lab keyring; operator fields: name' },
    );
    await lab.reload(made!.dataKey, operator.id);
  };

  return (
    <main className="lab-setup" aria-label="Set up the lab">
      <section className="panel" aria-labelledby="setup-heading">
        <h2 id="setup-heading">Set up this lab</h2>
        {lab.demoBuilding && <p className="muted">The demo study is still being made; wait for it to load instead if you only want to look around.</p>}
        {lab.demoFailure && <p className="warning">{lab.demoFailure}</p>}
        <p className="muted">
          Moving a lab from another machine? Restore its lab archive on the <a href="#/archive">Backups</a> screen instead.
        </p>
        {!made && (
          <>
            <p>
              Names, contact details, birth dates, consent notes and notes about people are stored encrypted with a key made from the lab passphrase (PBKDF2-SHA256,{' '}
              {KDF_ITERATIONS.toLocaleString('en')} rounds; AES-GCM). Codes, gaze and quality data are not, so analysis works without it.
            </p>
            <PassphrasePair
              submitLabel="Create the lab key"
              busy={busy}
              onSubmit={async (passphrase) => {
                setBusy(true);
                setMade(await createKeyring(passphrase, { demo: false }));
                setBusy(false);
              }}
            />
          </>
        )}
        {made && !recoveryKept && <RecoveryKeyStep recoveryKey={made.recoveryKey} onKept={() => setRecoveryKept(true)} />}
        {made && recoveryKept && (
          <form
            onSubmit={(event) => {
              event.preventDefault();
              void finish();
            }}
          >
            <h3>The first operator</h3>
            <label className="field">
              Your name (stored encrypted)
              <input value={name} autoFocus onChange={(event) => setName(event.target.value)} />
            </label>
            <button type="submit" disabled={busy || name.trim() === ''}>
              Open the lab
            </button>
          </form>
        )}
      </section>
    </main>
  );
}
