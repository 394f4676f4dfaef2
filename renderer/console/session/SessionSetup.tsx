import { useEffect, useMemo, useState } from 'react';
import { checkEligibility } from '../../../app/core/study/eligibility';
import { protocolFlashProblems } from '../../../app/core/study/protocol-flash';
import type { ConsentRecord, ParticipantRecord, ProtocolRecord, RecordOf } from '../../../app/core/study/records';
import { planSession, type PlannedStep } from '../../../app/core/study/session-plan';
import { latestVersions } from '../protocols/protocol-draft';
import type { LabStore } from '../../db/lab-store';
import { defaultSourceSetup, SourceFields, type SourceSetup } from './SourceFields';

type StimulusRecord = RecordOf<'stimuli'>;

export interface SessionChoice {
  readonly participant: ParticipantRecord;
  readonly protocol: ProtocolRecord;
  readonly stimuli: StimulusRecord[];
  readonly plan: { steps: PlannedStep[]; counterbalance: RecordOf<'sessions'>['counterbalance'] };
  readonly source: SourceSetup;
}

const SETUP_KEY = 'gazeloom.session.source';
const savedSetup = (): SourceSetup => {
  try {
    return { ...defaultSourceSetup, ...(JSON.parse(localStorage.getItem(SETUP_KEY) ?? '{}') as Partial<SourceSetup>) };
  } catch {
    return defaultSourceSetup;
  }
};
const freshSeed = (): number => globalThis.crypto.getRandomValues(new Uint32Array(1))[0]!;

/** Choose who is run on which protocol, and from which gaze source; eligibility is checked here. */
export function SessionSetup({ store, studyId, onChosen }: { store: LabStore; studyId: string; onChosen: (choice: SessionChoice) => void }) {
  const [data, setData] = useState<{ participants: ParticipantRecord[]; consents: ConsentRecord[]; protocols: ProtocolRecord[]; stimuli: StimulusRecord[] } | null>(null);
  const [participantId, setParticipantId] = useState('');
  const [protocolId, setProtocolId] = useState('');
  const [source, setSource] = useState(savedSetup);
  const [seed] = useState(freshSeed);

  useEffect(() => {
    void Promise.all([store.list('participants', { studyId }), store.list('consents'), store.list('protocols', { studyId }), store.list('stimuli', { studyId })]).then(([participants, consents, protocols, stimuli]) => {
      const newest = latestVersions(protocols);
      setData({ participants: participants.sort((a, b) => a.enrolment - b.enrolment), consents, protocols: newest, stimuli });
      setParticipantId((id) => id || participants[0]?.id || '');
      setProtocolId((id) => id || newest[0]?.id || '');
    });
  }, [store, studyId]);

  const participant = data?.participants.find((p) => p.id === participantId) ?? null;
  const protocol = data?.protocols.find((p) => p.id === protocolId) ?? null;
  const plan = useMemo(() => (participant && protocol ? planSession(protocol, { enrolment: participant.enrolment, seed }) : null), [participant, protocol, seed]);
  const planStimuli = useMemo(() => {
    const ids = new Set(plan?.steps.flatMap((s) => (s.stimulusId ? [s.stimulusId] : [])) ?? []);
    return data?.stimuli.filter((s) => ids.has(s.id)) ?? [];
  }, [plan, data]);
  const eligibility = useMemo(() => {
    if (!participant || !data) return null;
    const checked = checkEligibility(participant, data.consents, planStimuli);
    // The protocol's own flash rule also counts the clips it recorded as flashing when saved
    // (checkEligibility already names the plan's marked clips).
    const markedInPlan = planStimuli.some((s) => s.mayFlash);
    const problems = [...checked.problems, ...(protocol && !markedInPlan ? protocolFlashProblems(protocol, participant, data.stimuli) : [])];
    return { ok: problems.length === 0, problems };
  }, [participant, protocol, data, planStimuli]);

  if (!data) return <p className="muted">Loading the study…</p>;
  return (
    <form
      className="panel"
      aria-label="New session"
      onSubmit={(event) => {
        event.preventDefault();
        if (!participant || !protocol || !plan || !eligibility?.ok) return;
        localStorage.setItem(SETUP_KEY, JSON.stringify(source));
        onChosen({ participant, protocol, stimuli: data.stimuli, plan, source });
      }}
    >
      <h2>New session</h2>
      <label className="field">
        Participant
        <select value={participantId} onChange={(e) => setParticipantId(e.target.value)}>
          {data.participants.map((p) => (
            <option key={p.id} value={p.id}>
              {p.code} (enrolment {p.enrolment})
            </option>
          ))}
        </select>
      </label>
      <label className="field">
        Protocol
        <select value={protocolId} onChange={(e) => setProtocolId(e.target.value)}>
          {data.protocols.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name} (version {p.version})
            </option>
          ))}
        </select>
      </label>
      {data.participants.length === 0 && <p className="muted">No participant is registered in this study yet (Participants screen).</p>}
      {data.protocols.length === 0 && <p className="muted">This study has no protocol yet (Protocols screen).</p>}
      {plan && <p className="muted">{plan.steps.length} steps; clip order {plan.counterbalance.kind}{plan.counterbalance.row !== null ? `, row ${plan.counterbalance.row + 1}` : ''}.</p>}
      {eligibility && !eligibility.ok && (
        <ul className="failure" aria-label="Why this participant cannot be run">
          {eligibility.problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      <SourceFields value={source} onChange={setSource} />
      <button type="submit" disabled={!eligibility?.ok || !plan}>
        Go to the pre-flight checks
      </button>
    </form>
  );
}
