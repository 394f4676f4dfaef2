import { useState } from 'react';
import type { RecordOf } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { ExclusionForm } from './ExclusionForm';

type Exclusion = RecordOf<'exclusions'>;

const describe = (e: Exclusion, clipName: (id: string) => string): string =>
  e.scope.kind === 'session' ? 'Whole session' : e.scope.kind === 'clip' ? `Clip ${clipName(e.scope.stimulusId)}` : `From ${e.scope.fromS} s to ${e.scope.toS} s`;

/**
 * The session's exclusion decisions, honoured by analysis and release. Each is written
 * with its audit record; revoking keeps the record (revokedAt set), so the history stays.
 */
export function ExclusionsPanel({ sessionId, exclusions, clips }: { sessionId: string; exclusions: readonly Exclusion[]; clips: readonly { stimulusId: string; name: string }[] }) {
  const { store, operator } = useLab();
  const [confirming, setConfirming] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const clipName = (id: string) => clips.find((c) => c.stimulusId === id)?.name ?? id;

  const add = async (scope: Exclusion['scope'], reason: string) => {
    if (!operator) return;
    const record: Exclusion = { id: `${sessionId}-exclusion-${globalThis.crypto.randomUUID()}`, sessionId, scope, reason, decidedBy: operator.id, decidedAt: new Date().toISOString(), revokedAt: null };
    await store.put('exclusions', record, { operatorId: operator.id, action: 'exclude', summary: `session ${sessionId}: ${scope.kind}` }).catch((e: Error) => setFailure(`Could not save the exclusion: ${e.message}`));
  };
  const revoke = async (e: Exclusion) => {
    if (!operator) return;
    setConfirming(null);
    await store.put('exclusions', { ...e, revokedAt: new Date().toISOString() }, { operatorId: operator.id, action: 'revoke_exclusion', summary: `session ${sessionId}: ${e.scope.kind}` }).catch((err: Error) => setFailure(`Could not revoke the exclusion: ${err.message}`));
  };

  return (
    <section className="panel" aria-labelledby="exclusions-heading">
      <h3 id="exclusions-heading">Exclusions</h3>
      {exclusions.length === 0 ? (
        <p className="muted">Nothing of this session is excluded.</p>
      ) : (
        <ul className="exclusion-list" aria-label="Exclusion decisions">
          {exclusions.map((e) => (
            <li key={e.id} className={e.revokedAt ? 'revoked' : ''}>
              <strong>{describe(e, clipName)}</strong>: {e.reason} <span className="muted">(decided {e.decidedAt.slice(0, 16).replace('T', ' ')}{e.revokedAt ? `, revoked ${e.revokedAt.slice(0, 16).replace('T', ' ')}` : ''})</span>{' '}
              {!e.revokedAt &&
                (confirming === e.id ? (
                  <span role="group" aria-label="Confirm the revocation">
                    <button type="button" className="danger" onClick={() => void revoke(e)}>
                      Revoke the exclusion
                    </button>{' '}
                    <button type="button" className="secondary" onClick={() => setConfirming(null)}>
                      Keep it
                    </button>
                  </span>
                ) : (
                  <button type="button" className="secondary" onClick={() => setConfirming(e.id)} aria-label={`Revoke: ${describe(e, clipName)}`}>
                    Revoke…
                  </button>
                ))}
            </li>
          ))}
        </ul>
      )}
      {operator ? <ExclusionForm clips={clips} onSave={add} /> : <p className="muted">Unlock the console to decide exclusions.</p>}
      {failure && (
        <p className="failure" role="alert">
          {failure}
        </p>
      )}
    </section>
  );
}
