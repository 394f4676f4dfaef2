import type { GazeloomApi } from '../../../app/contract';
import type { ParticipantRecord, ProtocolRecord, SessionRecord } from '../../../app/core/study/records';
import { planSession } from '../../../app/core/study/session-plan';
import { restLimitsOf } from '../../../app/core/study/rest-limits';
import { resumeRunner, type RunnerState } from '../../../app/core/study/session-runner';
import type { LabStore } from '../../db/lab-store';

/**
 * A session the database says is still running. 'attached': the host is recording it now
 * (the console was reloaded); 'recovered': the host restarted and recovered its recording,
 * which can be appended to; 'lost': its recording cannot be resumed.
 */
export interface ResumeOffer {
  readonly session: SessionRecord;
  readonly participant: ParticipantRecord;
  readonly protocol: ProtocolRecord;
  readonly how: 'attached' | 'recovered' | 'lost';
  readonly runner: RunnerState | null;
  readonly problem: string | null;
}

export async function findResumable(api: GazeloomApi, store: LabStore, studyId: string): Promise<ResumeOffer[]> {
  const running = await store.list('sessions', { studyId, state: 'running' });
  if (running.length === 0) return [];
  const [live, recovered] = await Promise.all([api.getLiveStatus({}), api.listRecoveredSessions({})]);
  const recordingNow = live.ok ? (live.value.recording?.sessionId ?? null) : null;
  const resumable = new Set(recovered.ok ? recovered.value.sessions.filter((s) => s.resumable).map((s) => s.sessionId) : []);
  const offers: ResumeOffer[] = [];
  for (const session of running) {
    const [participant, protocol, trials] = await Promise.all([store.get('participants', session.participantId), store.get('protocols', session.protocolId), store.list('trials', { sessionId: session.id })]);
    if (!participant || !protocol) continue;
    const how = recordingNow === session.id ? 'attached' : resumable.has(session.id) ? 'recovered' : 'lost';
    try {
      const { steps } = planSession(protocol, { enrolment: participant.enrolment, seed: session.counterbalance.seed ?? 0 });
      offers.push({ session, participant, protocol, how, runner: resumeRunner(steps, trials, restLimitsOf(protocol)), problem: null });
    } catch (error) {
      offers.push({ session, participant, protocol, how: 'lost', runner: null, problem: (error as Error).message });
    }
  }
  return offers;
}
