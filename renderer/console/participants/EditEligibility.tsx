import { useState } from 'react';
import type { ParticipantRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { EligibilityFields } from './EligibilityFields';
import { eligibilityRecord, type EligibilityDraft } from './participant-draft';

const draftOf = (e: ParticipantRecord['eligibility']): EligibilityDraft => ({
  photosensitivityCleared: e.photosensitivityCleared,
  normalOrCorrectedVision: e.normalOrCorrectedVision,
  noNeurologicalCondition: e.noNeurologicalCondition,
  done: e.checkedAt !== null,
});

/** The checklist again (screening may be done after registration); every change is audited. */
export function EditEligibility({ participant }: { participant: ParticipantRecord }) {
  const { store, operator } = useLab();
  const [open, setOpen] = useState(false);
  const [draft, setDraft] = useState(() => draftOf(participant.eligibility));
  if (!open)
    return (
      <button type="button" className="secondary" onClick={() => setOpen(true)}>
        Update the eligibility checklist…
      </button>
    );
  return (
    <form
      onSubmit={async (event) => {
        event.preventDefault();
        const eligibility = eligibilityRecord(draft, new Date().toISOString());
        await store.put('participants', { ...participant, eligibility }, { operatorId: operator?.id ?? null, action: 'update_eligibility', summary: `fields: eligibility (${Object.entries(draft).filter(([, v]) => v).map(([k]) => k).join(', ') || 'none ticked'})` });
        setOpen(false);
      }}
    >
      <EligibilityFields value={draft} onChange={setDraft} />
      <div className="button-row">
        <button type="submit">Save the checklist</button>
        <button type="button" className="secondary" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
