import { sealText, type DataKey } from '../../../app/core/crypto';
import { handednesses, sexes, visionCorrections, type ParticipantRecord } from '../../../app/core/study/records';

export interface EligibilityDraft {
  photosensitivityCleared: boolean;
  normalOrCorrectedVision: boolean;
  noNeurologicalCondition: boolean;
  /** The checklist was gone through with the participant (sets the time it was checked). */
  done: boolean;
}

export interface ParticipantDraft {
  name: string;
  contact: string;
  birthDate: string;
  notes: string;
  age: string;
  sex: (typeof sexes)[number];
  handedness: (typeof handednesses)[number];
  visionCorrection: (typeof visionCorrections)[number];
  eligibility: EligibilityDraft;
}

export const emptyDraft: ParticipantDraft = {
  name: '',
  contact: '',
  birthDate: '',
  notes: '',
  age: '',
  sex: 'not_given',
  handedness: 'not_given',
  visionCorrection: 'none',
  eligibility: { photosensitivityCleared: false, normalOrCorrectedVision: false, noNeurologicalCondition: false, done: false },
};

/** What is wrong with the draft, field by field (empty when it can be saved). */
export function draftProblems(draft: ParticipantDraft): string[] {
  const problems: string[] = [];
  if (draft.age.trim() !== '' && !/^\d{1,3}$/.test(draft.age.trim())) problems.push('Age: a whole number of years, or empty.');
  else if (draft.age.trim() !== '' && Number(draft.age) > 130) problems.push('Age: at most 130.');
  if (draft.birthDate !== '' && Number.isNaN(Date.parse(draft.birthDate))) problems.push('Birth date: a date such as 1990-05-17, or empty.');
  return problems;
}

export function eligibilityRecord(e: EligibilityDraft, now: string): ParticipantRecord['eligibility'] {
  return { photosensitivityCleared: e.photosensitivityCleared, normalOrCorrectedVision: e.normalOrCorrectedVision, noNeurologicalCondition: e.noNeurologicalCondition, checkedAt: e.done ? now : null };
}

const optional = (text: string): string | null => (text.trim() === '' ? null : text.trim());

/** The participant record: personal fields encrypted with the lab key, the rest in clear for analysis. */
export async function participantRecord(
  draft: ParticipantDraft,
  key: DataKey,
  fixed: { id: string; studyId: string; code: string; enrolment: number; createdAt: string },
): Promise<ParticipantRecord> {
  return {
    ...fixed,
    name: await sealText(key, optional(draft.name)),
    contact: await sealText(key, optional(draft.contact)),
    birthDate: await sealText(key, optional(draft.birthDate)),
    notes: await sealText(key, optional(draft.notes)),
    demographics: { age: draft.age.trim() === '' ? null : Number(draft.age), sex: draft.sex, handedness: draft.handedness, visionCorrection: draft.visionCorrection },
    eligibility: eligibilityRecord(draft.eligibility, fixed.createdAt),
  };
}

/** Field names that were given, for the audit log (never the values). */
export const givenFields = (draft: ParticipantDraft): string =>
  (['name', 'contact', 'birthDate', 'notes'] as const).filter((f) => draft[f].trim() !== '').join(', ') || 'none';
