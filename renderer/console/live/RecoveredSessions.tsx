import { useEffect, useState } from 'react';
import type { Failure, RecoveredSessionInfo } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';

/** Recordings a crash or power cut left open: what was recovered, and a way to carry on. */
export function RecoveredSessions({ recording }: { recording: boolean }) {
  const { api, connection } = useHost();
  const [sessions, setSessions] = useState<RecoveredSessionInfo[]>([]);
  const [failure, setFailure] = useState<Failure | null>(null);
  const refresh = () => void api.listRecoveredSessions({}).then((r) => r.ok && setSessions(r.value.sessions));
  useEffect(() => {
    if (connection === 'open') refresh();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [connection]);
  useEffect(() => api.onFirstRunProgress((task) => task.id === 'recover-recordings' && task.state === 'done' && refresh()), [api]);
  if (sessions.length === 0) return null;
  return (
    <section className="panel" aria-labelledby="recovered-heading">
      <h2 id="recovered-heading">Unfinished recordings</h2>
      <p className="muted">These recordings did not close (the host stopped while they ran). Everything written before the stop was recovered.</p>
      <ul className="recovered">
        {sessions.map((s) => (
          <li key={s.sessionId}>
            <strong>{s.sessionId}</strong>: {s.samples.toLocaleString('en-GB')} samples, {s.frames.toLocaleString('en-GB')} frames recovered
            {s.tornTailBytes > 0 && `, ${s.tornTailBytes} bytes of an unfinished last write cut`}
            {s.corruptChunks > 0 && `, ${s.corruptChunks} damaged chunks kept aside`}.{' '}
            <button
              type="button"
              disabled={recording || !s.resumable}
              onClick={async () => {
                const result = await api.resumeRecording({ sessionId: s.sessionId });
                setFailure(result.ok ? null : result);
                refresh();
              }}
            >
              Resume recording
            </button>
          </li>
        ))}
      </ul>
      {failure && <FailureNote failure={failure} />}
    </section>
  );
}
