import { useLabState } from './lab-context';

/** In the console's header: the demo mark, and the lock button while the lab is open. */
export function LabBar() {
  const lab = useLabState();
  return (
    <span className="lab-bar">
      {lab.keyring?.demo && <span className="demo-banner">Demo study: invented data</span>}
      {lab.keyring && lab.persistence === 'refused' && <span className="warning" title="The browser may clear the lab database when the disk runs low: back up often (Backups)">storage not persistent</span>}
      {lab.phase === 'open' && (
        <button type="button" className="secondary lock-button" onClick={lab.lock} title="Lock the console (personal data is hidden until the passphrase is given)">
          Lock
        </button>
      )}
    </span>
  );
}
