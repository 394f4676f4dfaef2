import { useEffect, useState } from 'react';
import type { Failure, GazeloomApi, PreflightReport } from '../../../app/contract';
import type { SessionRecord } from '../../../app/core/study/records';
import type { LabStore } from '../../db/lab-store';
import { useLiveStatus } from '../live/use-live-status';
import { useStageStatus } from '../use-stage-status';
import { allPassed, evaluatePreflight, expectedSessionSeconds } from './preflight-checks';
import type { SessionChoice } from './SessionSetup';
import { displayOf, sourceChoice } from './SourceFields';
import { useSessionKeys } from './use-session-keys';

/** A rate for the disk estimate when the source has not said its own yet. */
const ASSUMED_FEED_RATE_HZ = 1000;

const describeSource = (choice: SessionChoice['source']): string =>
  choice.kind === 'simulated' ? `simulated tracker (seed ${choice.seed}, ${choice.rateHz} Hz)` : choice.kind === 'feed' ? `gaze feed ${choice.url}` : 'mouse on the stage';

/**
 * The checks before the first step: display geometry, the stage page, free disk space, and
 * (once the recording has started) the gaze source at its nominal rate. The session record
 * is written when the recording starts.
 */
export function PreflightPanel({
  api,
  store,
  choice,
  operatorId,
  demo,
  keysEnabled,
  onBegin,
  onCancel,
}: {
  api: GazeloomApi;
  store: LabStore;
  choice: SessionChoice;
  operatorId: string;
  demo: boolean;
  keysEnabled: boolean;
  onBegin: (session: SessionRecord) => void;
  onCancel: () => void;
}) {
  const stage = useStageStatus();
  const live = useLiveStatus();
  const [disk, setDisk] = useState<PreflightReport | Failure | null>(null);
  const [session, setSession] = useState<SessionRecord | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const display = displayOf(choice.source);
  const { protocol, participant } = choice;

  useEffect(() => {
    const durations = new Map(choice.stimuli.map((s) => [s.id, s.durationS]));
    const expectedSeconds = expectedSessionSeconds(choice.plan.steps, (id) => durations.get(id) ?? 0, protocol.validationLayout, protocol.speed);
    const rateHz = choice.source.kind === 'simulated' ? Number(choice.source.rateHz) || ASSUMED_FEED_RATE_HZ : choice.source.kind === 'mouse' ? 60 : ASSUMED_FEED_RATE_HZ;
    void api.getPreflight({ expectedSeconds, rateHz }).then((r) => setDisk(r.ok ? r.value : r));
  }, [api, choice, protocol]);

  const ours = live?.recording && session && live.recording.sessionId === session.id ? live : null;
  const checks = evaluatePreflight({ display, stage, disk, live: ours });
  const ready = session !== null && allPassed(checks);

  const connect = async () => {
    const r = await api.startRecording({ source: sourceChoice(choice.source), display, label: participant.code });
    if (!r.ok) return setFailure(r);
    const record: SessionRecord = {
      id: r.value.sessionId,
      studyId: participant.studyId,
      participantId: participant.id,
      protocolId: protocol.id,
      protocolVersion: protocol.version,
      operatorId,
      startedAt: new Date().toISOString(),
      endedAt: null,
      state: 'running',
      counterbalance: choice.plan.counterbalance,
      display,
      gazeSource: describeSource(choice.source),
      demo,
    };
    await store.put('sessions', record, { operatorId, action: 'start_session', summary: `session ${record.id} for ${participant.code}` });
    setSession(record);
    setFailure(null);
  };
  const cancel = async () => {
    if (session) {
      await api.stopRecording({});
      await store.put('sessions', { ...session, state: 'aborted', endedAt: new Date().toISOString() }, { operatorId, action: 'abort_session', summary: `session ${session.id} cancelled before the first step` });
    }
    onCancel();
  };
  useSessionKeys(keysEnabled, (c) => c === 'continue' && ready && session && onBegin(session));

  return (
    <section className="panel" aria-labelledby="preflight-heading">
      <h2 id="preflight-heading">Pre-flight checks</h2>
      <p>
        {participant.code} on {protocol.name} (version {protocol.version}): {choice.plan.steps.length} steps.
      </p>
      <ul className="preflight" aria-label="Pre-flight checks">
        {checks.map((c) => (
          <li key={c.id} className={`check-${c.state}`}>
            <strong>{c.state === 'ok' ? '✓' : c.state === 'failed' ? '✗' : '…'}</strong> {c.label}: <span>{c.detail}</span>
          </li>
        ))}
      </ul>
      {failure && (
        <p className="failure" role="alert">
          {failure.message}
        </p>
      )}
      <div className="button-row">
        {session === null ? (
          <button type="button" onClick={() => void connect()}>
            Connect the gaze source and start recording
          </button>
        ) : (
          <button type="button" disabled={!ready} onClick={() => onBegin(session)}>
            Begin the session <kbd>Enter</kbd>
          </button>
        )}
        <button type="button" className="secondary" onClick={() => void cancel()}>
          Cancel
        </button>
      </div>
      <p role="status" className="muted">
        {ready ? 'All checks passed: press Enter to begin.' : session ? 'Waiting for every check to pass.' : 'Start the recording to check the gaze source.'}
      </p>
    </section>
  );
}
