import { useState } from 'react';
import type { GazeloomApi } from '../../../app/contract';
import type { LabStore } from '../../db/lab-store';

type Outcome = { state: 'idle' } | { state: 'running' } | { state: 'done'; text: string } | { state: 'failed'; message: string };

/** "Back up now": every table of this profile and every session recording it knows, as a folder or a .zip. */
export function BackupPanel({ api, store, onDone }: { api: GazeloomApi; store: LabStore; onDone: () => void }) {
  const [zip, setZip] = useState(true);
  const [outcome, setOutcome] = useState<Outcome>({ state: 'idle' });

  const backUp = async () => {
    setOutcome({ state: 'running' });
    try {
      const tables = await store.exportTables();
      const sessionIds = (await store.list('sessions')).map((s) => s.id);
      const r = await api.backupLabArchive({ tables, sessionIds, zip });
      if (!r.ok) return setOutcome({ state: 'failed', message: r.message });
      const records = Object.values(r.value.manifest.tables).reduce((n, t) => n + t.records, 0);
      const recordings = Object.keys(r.value.manifest.recordings).length;
      const missing = r.value.missingRecordings.length ? ` ${r.value.missingRecordings.length} session(s) had no recording in the data folder: ${r.value.missingRecordings.join(', ')}.` : '';
      setOutcome({ state: 'done', text: `Backed up ${records} records and ${recordings} recordings to ${r.value.path}.${missing}` });
      onDone();
    } catch (error) {
      setOutcome({ state: 'failed', message: (error as Error).message });
    }
  };

  return (
    <section className="panel" aria-labelledby="backup-heading">
      <h2 id="backup-heading">Back up</h2>
      <p className="muted">A lab archive holds every record of this profile (personal fields stay encrypted) and the session recordings, with a SHA-256 of each file.</p>
      <fieldset>
        <legend>Write it as</legend>
        <label>
          <input type="radio" name="backup-kind" checked={zip} onChange={() => setZip(true)} /> one .zip file
        </label>
        <label>
          <input type="radio" name="backup-kind" checked={!zip} onChange={() => setZip(false)} /> a folder
        </label>
      </fieldset>
      <button type="button" onClick={() => void backUp()} disabled={outcome.state === 'running'}>
        Back up now
      </button>
      <p role="status" aria-live="polite">
        {outcome.state === 'running' ? 'Writing the lab archive…' : outcome.state === 'done' ? outcome.text : ''}
      </p>
      {outcome.state === 'failed' && (
        <p className="failure" role="alert">
          The backup failed: {outcome.message}
        </p>
      )}
    </section>
  );
}
