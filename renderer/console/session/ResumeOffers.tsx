import { useEffect, useState } from 'react';
import type { GazeloomApi } from '../../../app/contract';
import type { LabStore } from '../../db/lab-store';
import { findResumable, type ResumeOffer } from './session-resume';

/** Sessions left running by a crash or a reload, with "Resume from trial N". */
export function ResumeOffers({ api, store, studyId, operatorId, onResume }: { api: GazeloomApi; store: LabStore; studyId: string; operatorId: string | null; onResume: (offer: ResumeOffer) => void }) {
  const [offers, setOffers] = useState<ResumeOffer[]>([]);
  const [failure, setFailure] = useState<string | null>(null);
  const refresh = () => void findResumable(api, store, studyId).then(setOffers);
  useEffect(refresh, [api, store, studyId]);
  useEffect(() => api.onFirstRunProgress((task) => task.id === 'recover-recordings' && task.state === 'done' && refresh()), [api]);
  if (offers.length === 0) return null;

  const resume = async (offer: ResumeOffer) => {
    if (offer.how === 'recovered') {
      const r = await api.resumeRecording({ sessionId: offer.session.id });
      if (!r.ok) return setFailure(r.message);
    }
    onResume(offer);
  };
  const close = async (offer: ResumeOffer) => {
    await store.put('sessions', { ...offer.session, state: 'interrupted', endedAt: new Date().toISOString() }, { operatorId, action: 'interrupt_session', summary: `session ${offer.session.id} closed as interrupted` });
    refresh();
  };
  return (
    <section className="panel" aria-labelledby="resume-heading">
      <h2 id="resume-heading">Unfinished sessions</h2>
      <ul className="recovered">
        {offers.map((o) => (
          <li key={o.session.id}>
            <strong>{o.participant.code}</strong> on {o.protocol.name} ({o.session.id}):{' '}
            {o.how === 'attached' ? 'still recording on the host.' : o.how === 'recovered' ? 'the host stopped during it; its recording was recovered.' : (o.problem ?? 'its recording cannot be resumed.')}{' '}
            {o.runner && o.how !== 'lost' && o.runner.phase !== 'finished' && (
              <button type="button" onClick={() => void resume(o)}>
                Resume from trial {o.runner.cursor + 1}
              </button>
            )}{' '}
            <button type="button" className="secondary" onClick={() => void close(o)}>
              Close as interrupted
            </button>
          </li>
        ))}
      </ul>
      {failure && (
        <p className="failure" role="alert">
          {failure}
        </p>
      )}
    </section>
  );
}
