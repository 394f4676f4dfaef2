import { useState } from 'react';
import type { ParticipantRecord, ProtocolRecord, RecordOf, SessionRecord } from '../../../app/core/study/records';
import { restLimitsOf } from '../../../app/core/study/rest-limits';
import { flashingClips } from '../../../app/core/study/protocol-flash';
import { runnerReducer, startRunner, type RunnerState } from '../../../app/core/study/session-runner';
import { useHost } from '../host-context';
import { useLab } from '../lab/lab-context';
import { PreflightPanel } from './PreflightPanel';
import { ResumeOffers } from './ResumeOffers';
import { endedSession } from './session-records';
import { SessionRun } from './SessionRun';
import { SessionSetup, type SessionChoice } from './SessionSetup';
import { SessionSummaryPanel } from './SessionSummaryPanel';
import './session.css';

type StimulusRecord = RecordOf<'stimuli'>;
type Run = { session: SessionRecord; participant: ParticipantRecord; protocol: ProtocolRecord; initial: RunnerState };
type Phase =
  | { kind: 'setup' }
  | { kind: 'preflight'; choice: SessionChoice }
  | { kind: 'run'; run: Run }
  | { kind: 'summary'; session: SessionRecord; steps: RunnerState['steps']; samples: number | null };

/** The session console: choose, check, run, summarize; and pick up a session a crash left open. */
export function SessionScreen() {
  const { api } = useHost();
  const { store, studyId, operator, dataKey, demo } = useLab();
  const [phase, setPhase] = useState<Phase>({ kind: 'setup' });
  const [stimuli, setStimuli] = useState<StimulusRecord[]>([]);
  const operatorId = operator?.id ?? null;

  if (!studyId) return <main className="panel">Choose or create a study first (Study screen).</main>;
  const clipName = (id: string) => stimuli.find((s) => s.id === id)?.name || id;

  const end = async (run: Run, state: RunnerState) => {
    const stopped = await api.stopRecording({});
    const session = endedSession(run.session, state.phase === 'finished', new Date().toISOString());
    await store.put('sessions', session, { operatorId, action: 'end_session', summary: `session ${session.id} ${session.state}` });
    setPhase({ kind: 'summary', session, steps: state.steps, samples: stopped.ok ? stopped.value.samples : null });
  };

  return (
    <main className="session-console" aria-label="Session console">
      {phase.kind === 'setup' && (
        <>
          <ResumeOffers
            api={api}
            store={store}
            studyId={studyId}
            operatorId={operatorId}
            onResume={(offer) => {
              void store.list('stimuli', { studyId }).then(setStimuli);
              setPhase({ kind: 'run', run: { session: offer.session, participant: offer.participant, protocol: offer.protocol, initial: offer.runner! } });
            }}
          />
          <SessionSetup
            store={store}
            studyId={studyId}
            onChosen={(choice) => {
              setStimuli(choice.stimuli);
              setPhase({ kind: 'preflight', choice });
            }}
          />
        </>
      )}
      {phase.kind === 'preflight' &&
        (operatorId ? (
          <PreflightPanel
            api={api}
            store={store}
            choice={phase.choice}
            operatorId={operatorId}
            demo={demo}
            keysEnabled={dataKey !== null}
            onBegin={(session) =>
              setPhase({ kind: 'run', run: { session, participant: phase.choice.participant, protocol: phase.choice.protocol, initial: runnerReducer(startRunner(phase.choice.plan.steps, restLimitsOf(phase.choice.protocol)), { type: 'begin' }) } })
            }
            onCancel={() => setPhase({ kind: 'setup' })}
          />
        ) : (
          <p className="failure" role="alert">
            Choose the operator at the lock screen before running a session.
          </p>
        ))}
      {phase.kind === 'run' && (
        <SessionRun
          ctx={{ api, store, operatorId, session: phase.run.session, protocol: phase.run.protocol, flashing: new Set(flashingClips(phase.run.protocol, stimuli)) }}
          initial={phase.run.initial}
          dataKey={dataKey}
          participantCode={phase.run.participant.code}
          clipName={clipName}
          onEnd={(state) => void end(phase.run, state)}
        />
      )}
      {phase.kind === 'summary' && <SessionSummaryPanel api={api} store={store} session={phase.session} steps={phase.steps} samples={phase.samples} onNext={() => setPhase({ kind: 'setup' })} />}
    </main>
  );
}
