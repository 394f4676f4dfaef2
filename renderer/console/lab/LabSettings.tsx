import { ChangePassphrase } from './ChangePassphrase';
import { useLabState } from './lab-context';

const persistenceText = {
  pending: 'asking the browser…',
  granted: 'persistent: the browser will not clear the lab database to free space',
  refused: 'NOT persistent: the browser refused, and may clear the lab database when the disk runs low. Back up to a lab archive often.',
  unsupported: 'this browser cannot make storage persistent. Back up to a lab archive often.',
} as const;

/** The lab's settings: storage, the inactivity lock, locking now and the passphrase. */
export function LabSettings() {
  const lab = useLabState();
  return (
    <section className="panel" aria-labelledby="lab-settings-heading">
      <h2 id="lab-settings-heading">Lab settings</h2>
      <dl className="facts">
        <dt>Storage</dt>
        <dd className={lab.persistence === 'refused' || lab.persistence === 'unsupported' ? 'warning' : ''} data-testid="storage-persistence">
          {persistenceText[lab.persistence]}
        </dd>
        <dt>Lab key</dt>
        <dd>
          PBKDF2-SHA256, {lab.keyring?.kdf.iterations.toLocaleString('en')} rounds{lab.keyring?.demo ? ' (demo keyring)' : ''}
        </dd>
      </dl>
      <div className="inline-fields">
        <label>
          Lock after{' '}
          <input
            type="number"
            min={1}
            max={240}
            value={lab.lockAfterMinutes}
            className="short-number"
            onChange={(event) => {
              const minutes = Number(event.target.value);
              if (Number.isInteger(minutes) && minutes >= 1 && minutes <= 240) lab.setLockAfterMinutes(minutes);
            }}
          />{' '}
          minutes without input
        </label>
        <button type="button" className="secondary" onClick={lab.lock}>
          Lock now
        </button>
      </div>
      <ChangePassphrase />
    </section>
  );
}
