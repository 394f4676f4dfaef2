import { useState } from 'react';
import { useLab } from '../lab/lab-context';
import { useLabQuery } from '../lab/use-lab-query';
import { ParticipantDetail } from './ParticipantDetail';
import { ParticipantTable } from './ParticipantTable';
import { RegisterParticipant } from './RegisterParticipant';

/** The chosen study's participants: register, look one up, record consent and withdrawal. */
export function ParticipantsScreen() {
  const { studyId } = useLab();
  const study = useLabQuery(['studies'], (store) => (studyId ? store.get('studies', studyId) : Promise.resolve(undefined)), [studyId]);
  const participants = useLabQuery(['participants'], (store) => (studyId ? store.list('participants', { studyId }) : Promise.resolve([])), [studyId]);
  const consents = useLabQuery(['consents'], (store) => store.list('consents'));
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [registering, setRegistering] = useState(false);

  if (!studyId || study === undefined)
    return (
      <main className="participants-screen" aria-label="Participants">
        <section className="panel">
          <h2>Participants</h2>
          <p className="muted">
            Choose or create a study first, on the <a href="#/study">Study</a> screen.
          </p>
        </section>
      </main>
    );
  const selected = participants?.find((p) => p.id === selectedId) ?? null;
  return (
    <main className="participants-screen library" aria-label="Participants">
      <section className="panel" aria-labelledby="participants-heading">
        <div className="panel-head">
          <h2 id="participants-heading">Participants of “{study?.name ?? '…'}”</h2>
          <button type="button" onClick={() => setRegistering(true)} disabled={registering}>
            Register a participant…
          </button>
        </div>
        {participants?.length === 0 && <p className="muted">Nobody is registered in this study yet.</p>}
        {participants && participants.length > 0 && consents && (
          <ParticipantTable participants={participants} consents={consents} selectedId={selectedId} onSelect={setSelectedId} />
        )}
      </section>
      {registering && (
        <RegisterParticipant
          studyId={studyId}
          onCancel={() => setRegistering(false)}
          onRegistered={(id) => {
            setRegistering(false);
            setSelectedId(id);
          }}
        />
      )}
      {!registering && selected && consents && <ParticipantDetail key={selected.id} participant={selected} consents={consents.filter((c) => c.participantId === selected.id)} />}
    </main>
  );
}
