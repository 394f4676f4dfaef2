import type { EligibilityDraft } from './participant-draft';

/** The eligibility checklist, photosensitivity screening first: it decides whether flashing clips may be shown. */
export function EligibilityFields({ value, onChange }: { value: EligibilityDraft; onChange: (next: EligibilityDraft) => void }) {
  const box = (field: keyof EligibilityDraft, label: string) => (
    <label className="check">
      <input type="checkbox" checked={value[field]} onChange={(event) => onChange({ ...value, [field]: event.target.checked })} /> {label}
    </label>
  );
  return (
    <fieldset>
      <legend>Eligibility checklist</legend>
      {box('photosensitivityCleared', 'Photosensitivity screening: cleared to see flashing stimuli')}
      {box('normalOrCorrectedVision', 'Normal or corrected-to-normal vision')}
      {box('noNeurologicalCondition', 'No neurological condition reported')}
      {box('done', 'The checklist was gone through with the participant')}
    </fieldset>
  );
}
