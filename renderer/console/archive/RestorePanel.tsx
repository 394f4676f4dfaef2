import { useState } from 'react';
import type { GazeloomApi } from '../../../app/contract';
import type { LabStore } from '../../db/lab-store';

type Outcome = { state: 'idle' } | { state: 'running' } | { state: 'done'; text: string } | { state: 'failed'; message: string };

/**
 * "Restore into this profile": only into an empty profile, so a restore never overwrites
 * anything. The host verifies every file against the manifest and copies the recordings;
 * the tables go into the database in one transaction.
 */
export function RestorePanel({ api, store, empty, chosenPath, onRestored }: { api: GazeloomApi; store: LabStore; empty: boolean | null; chosenPath: string; onRestored: () => Promise<void> }) {
  const [path, setPath] = useState(chosenPath);
  const [shownChoice, setShownChoice] = useState(chosenPath);
  const [outcome, setOutcome] = useState<Outcome>({ state: 'idle' });
  if (chosenPath !== shownChoice) {
    setShownChoice(chosenPath);
    setPath(chosenPath);
  }

  const restore = async () => {
    setOutcome({ state: 'running' });
    try {
      const r = await api.restoreLabArchive({ path });
      if (!r.ok) return setOutcome({ state: 'failed', message: r.message });
      await store.importTables(r.value.tables);
      const records = Object.values(r.value.manifest.tables).reduce((n, t) => n + t.records, 0);
      setOutcome({ state: 'done', text: `Restored ${records} records and ${r.value.restored.length + r.value.alreadyPresent.length} recordings. Unlock with the passphrase of the lab that made the archive.` });
      await onRestored();
    } catch (error) {
      setOutcome({ state: 'failed', message: (error as Error).message });
    }
  };

  return (
    <section className="panel" aria-labelledby="restore-heading">
      <h2 id="restore-heading">Restore</h2>
      {empty === false ? (
        <p className="muted">
          This profile already holds lab records, so nothing can be restored into it: a restore only goes into an empty profile and never overwrites. Start Gazeloom with a new data folder (or open
          the console in a fresh browser profile) and restore there.
        </p>
      ) : (
        <p className="muted">This profile is empty: a lab archive can be restored into it.</p>
      )}
      <label>
        Archive path <input type="text" value={path} onChange={(e) => setPath(e.target.value)} placeholder="/path/to/lab-20260301-091500.zip" size={60} />
      </label>
      <button type="button" onClick={() => void restore()} disabled={empty !== true || path.trim() === '' || outcome.state === 'running'}>
        Restore into this profile
      </button>
      <p role="status" aria-live="polite">
        {outcome.state === 'running' ? 'Checking the archive and restoring…' : outcome.state === 'done' ? outcome.text : ''}
      </p>
      {outcome.state === 'failed' && (
        <p className="failure" role="alert">
          The restore failed: {outcome.message}
        </p>
      )}
    </section>
  );
}
