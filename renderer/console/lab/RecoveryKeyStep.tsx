import { useState } from 'react';

/** The recovery key, shown this once: it opens the lab if the passphrase is forgotten. */
export function RecoveryKeyStep({ recoveryKey, onKept }: { recoveryKey: string; onKept: () => void }) {
  const [kept, setKept] = useState(false);
  return (
    <div className="recovery-step">
      <h3>Write down the recovery key</h3>
      <p>
        If the passphrase is forgotten, this key is the only way to open the lab’s personal data. Write it on paper and keep it locked away from this computer. It will not be shown
        again.
      </p>
      <output className="recovery-key" aria-label="Recovery key">
        {recoveryKey}
      </output>
      <label className="check">
        <input type="checkbox" checked={kept} onChange={(event) => setKept(event.target.checked)} /> I have written the recovery key down and stored it safely
      </label>
      <button type="button" disabled={!kept} onClick={onKept}>
        Continue
      </button>
    </div>
  );
}
