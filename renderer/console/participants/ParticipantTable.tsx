import type { ConsentRecord, ParticipantRecord } from '../../../app/core/study/records';
import { consentSummary } from './consent-status';

/** Pseudonymous columns only: the list is readable while locked and shows no personal data. */
export function ParticipantTable({
  participants,
  consents,
  selectedId,
  onSelect,
}: {
  participants: readonly ParticipantRecord[];
  consents: readonly ConsentRecord[];
  selectedId: string | null;
  onSelect: (id: string) => void;
}) {
  const ordered = [...participants].sort((a, b) => a.enrolment - b.enrolment);
  return (
    <table className="stimulus-table" aria-label="Participants">
      <thead>
        <tr>
          <th>#</th>
          <th>Code</th>
          <th>Consent</th>
          <th>Flashing clips</th>
        </tr>
      </thead>
      <tbody>
        {ordered.map((p) => (
          <tr key={p.id} className={p.id === selectedId ? 'selected' : ''} onClick={() => onSelect(p.id)}>
            <td>{p.enrolment}</td>
            <td>
              <button type="button" className="link path" aria-pressed={p.id === selectedId} onClick={() => onSelect(p.id)}>
                {p.code}
              </button>
            </td>
            <td>{consentSummary(consents.filter((c) => c.participantId === p.id))}</td>
            <td>{p.eligibility.photosensitivityCleared ? 'cleared' : <span className="badge badge-warn">not cleared</span>}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
