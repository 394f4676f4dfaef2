import { useCallback, useEffect, useRef, useState } from 'react';
import type { GazeloomApi } from '../../../app/contract';
import type { SessionRecord, ValidationRecord } from '../../../app/core/study/records';
import type { RunnerStep } from '../../../app/core/study/session-runner';
import type { LabStore } from '../../db/lab-store';
import { summarizeSession } from './session-summary';

type Backup = { state: 'running' } | { state: 'done'; path: string } | { state: 'failed'; message: string };
const deg = (v: number | null) => (v === null ? 'n/a' : `${v.toFixed(2)}°`);
const pct = (v: number | null) => (v === null ? 'n/a' : `${v.toFixed(1)} %`);

/** The end of a session: what was done and how good the gaze was; then a lab-archive backup of it. */
export function SessionSummaryPanel({ api, store, session, steps, samples, onNext }: { api: GazeloomApi; store: LabStore; session: SessionRecord; steps: readonly RunnerStep[]; samples: number | null; onNext: () => void }) {
  const [validations, setValidations] = useState<ValidationRecord[] | null>(null);
  const [backup, setBackup] = useState<Backup>({ state: 'running' });
  const started = useRef(false);

  const backUp = useCallback(async () => {
    setBackup({ state: 'running' });
    try {
      const tables = await store.exportTables();
      const r = await api.backupLabArchive({ tables, sessionIds: [session.id] });
      setBackup(r.ok ? { state: 'done', path: r.value.path } : { state: 'failed', message: r.message });
    } catch (error) {
      setBackup({ state: 'failed', message: (error as Error).message });
    }
  }, [api, store, session.id]);

  useEffect(() => {
    void store.list('validations', { sessionId: session.id }).then(setValidations);
    if (!started.current) {
      started.current = true;
      void backUp();
    }
  }, [store, session.id, backUp]);

  const summary = summarizeSession(steps, validations ?? []);
  return (
    <section className="panel" aria-labelledby="summary-heading">
      <h2 id="summary-heading">Session summary</h2>
      <p>
        Session {session.id}: {session.state === 'completed' ? 'completed' : 'ended early'}.
      </p>
      <dl className="facts" aria-label="Session figures">
        <dt>Trials done</dt>
        <dd>
          {summary.steps.done} of {summary.steps.total} steps ({summary.clips.done} of {summary.clips.total} clips)
        </dd>
        <dt>Skipped, bad, not run</dt>
        <dd>
          {summary.steps.skipped}, {summary.steps.bad}, {summary.steps.notRun}
        </dd>
        <dt>Data loss at the targets</dt>
        <dd>{pct(summary.dataLossPct)}</dd>
        {samples !== null && (
          <>
            <dt>Gaze samples recorded</dt>
            <dd>{samples.toLocaleString('en-GB')}</dd>
          </>
        )}
      </dl>
      <table className="step-table" aria-label="Validation results">
        <thead>
          <tr>
            <th>Check</th>
            <th>Mean accuracy</th>
            <th>Worst point</th>
            <th>Data loss</th>
            <th>Result</th>
          </tr>
        </thead>
        <tbody>
          {summary.checks.map((c, i) => (
            <tr key={i}>
              <td>{c.kind === 'validation' ? 'Validation' : 'Drift check'}</td>
              <td>{deg(c.meanAccuracyDeg)}</td>
              <td>{deg(c.maxAccuracyDeg)}</td>
              <td>{pct(c.dataLossPct)}</td>
              <td>{c.accepted ? 'accepted' : 'not accepted'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p role="status" data-testid="session-backup">
        {backup.state === 'running' ? 'Backing up the lab archive…' : backup.state === 'done' ? `Backed up to ${backup.path}` : `The backup failed: ${backup.message}`}
      </p>
      {backup.state === 'failed' && (
        <button type="button" onClick={() => void backUp()}>
          Back up again
        </button>
      )}
      <button type="button" className="secondary" onClick={onNext}>
        New session
      </button>
    </section>
  );
}
