import type { ConsentRecord, ParticipantRecord, RecordOf } from './records';

type StimulusRecord = RecordOf<'stimuli'>;

/**
 * Whether a participant may be run on a session showing `stimuli` (the clips of its plan).
 * Problems are sentences for the operator; `ok` is true only when there are none.
 *
 * Consent: the participant's consents (others in `consents` are ignored) must include one
 * that agrees to take part, is not withdrawn, and was signed after any withdrawal. The
 * eligibility checklist must be done and met; a participant not cleared in photosensitivity
 * screening is never shown a clip marked "may flash".
 */
export function checkEligibility(p: ParticipantRecord, consents: ConsentRecord[], stimuli: StimulusRecord[]): { ok: boolean; problems: string[] } {
  const problems = [...consentProblems(consents.filter((c) => c.participantId === p.id)), ...checklistProblems(p), ...flashProblems(p, stimuli)];
  return { ok: problems.length === 0, problems };
}

function consentProblems(own: ConsentRecord[]): string[] {
  if (own.length === 0) return ['No consent is recorded.'];
  const unreadable = own.filter((c) => Number.isNaN(Date.parse(c.signedAt)) || (c.withdrawal && Number.isNaN(Date.parse(c.withdrawal.at))));
  if (unreadable.length > 0) return unreadable.map((c) => `Consent ${c.id} has a date that is not a valid date and time.`);
  const withdrawals = own.flatMap((c) => (c.withdrawal ? [c.withdrawal.at] : [])).sort((a, b) => Date.parse(a) - Date.parse(b));
  const lastWithdrawal = withdrawals.at(-1);
  const standing = own.filter(
    (c) => c.scopes.participate && c.withdrawal === null && (lastWithdrawal === undefined || Date.parse(c.signedAt) > Date.parse(lastWithdrawal)),
  );
  if (standing.length > 0) return [];
  if (lastWithdrawal !== undefined) return [`Consent was withdrawn on ${lastWithdrawal}.`];
  return ['No consent to take part is recorded.'];
}

function checklistProblems(p: ParticipantRecord): string[] {
  const e = p.eligibility;
  if (e.checkedAt === null) return ['The eligibility checklist has not been completed.'];
  const problems: string[] = [];
  if (!e.normalOrCorrectedVision) problems.push('Vision is not normal or corrected to normal.');
  if (!e.noNeurologicalCondition) problems.push('A neurological condition was reported in screening.');
  return problems;
}

function flashProblems(p: ParticipantRecord, stimuli: StimulusRecord[]): string[] {
  const flashing = stimuli.filter((s) => s.mayFlash);
  if (flashing.length === 0 || p.eligibility.photosensitivityCleared) return [];
  const names = flashing.map((s) => `"${s.name || s.id}"`).join(', ');
  return [`Not cleared in photosensitivity screening, so cannot be shown clips marked "may flash": ${names}.`];
}
