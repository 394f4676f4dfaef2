import { describe, expect, it } from 'vitest';
import { checkEligibility } from '../../../../app/core/study/eligibility';
import { consent, participant, stimulus } from './study-records';

/** The study's rules for who may be run (issue requirements; common practice, no source). */
const calm = [stimulus('forklift-crossing'), stimulus('conveyor-parcels')];
const withBeacon = [...calm, stimulus('warning-beacon', true)];

describe('checkEligibility', () => {
  it('clears a screened participant with standing consent', () => {
    expect(checkEligibility(participant(), [consent()], withBeacon)).toEqual({ ok: true, problems: [] });
  });

  it('never lets a participant not cleared for photosensitivity see a clip marked "may flash"', () => {
    const p = participant({ photosensitivityCleared: false });
    const result = checkEligibility(p, [consent()], withBeacon);
    expect(result.ok).toBe(false);
    expect(result.problems).toEqual(['Not cleared in photosensitivity screening, so cannot be shown clips marked "may flash": "warning beacon".']);
    // The same participant may see a plan without flashing clips.
    expect(checkEligibility(p, [consent()], calm)).toEqual({ ok: true, problems: [] });
  });

  it('requires the eligibility checklist to be done and met', () => {
    expect(checkEligibility(participant({ checkedAt: null }), [consent()], calm).problems).toEqual(['The eligibility checklist has not been completed.']);
    const unmet = checkEligibility(participant({ normalOrCorrectedVision: false, noNeurologicalCondition: false }), [consent()], calm);
    expect(unmet.problems).toEqual(['Vision is not normal or corrected to normal.', 'A neurological condition was reported in screening.']);
    // An unchecked list clears nobody for flashing clips either.
    const unchecked = checkEligibility(participant({ checkedAt: null, photosensitivityCleared: false }), [consent()], withBeacon);
    expect(unchecked.problems).toHaveLength(2);
  });

  it('requires consent to take part, from this participant', () => {
    expect(checkEligibility(participant(), [], calm).problems).toEqual(['No consent is recorded.']);
    expect(checkEligibility(participant(), [consent({ participantId: 'participant-2' })], calm).problems).toEqual(['No consent is recorded.']);
    const declined = consent({ scopes: { participate: false, publicRelease: false, namedCollaborators: false, recontact: false } });
    expect(checkEligibility(participant(), [declined], calm).problems).toEqual(['No consent to take part is recorded.']);
  });

  it('refuses a withdrawn participant unless a newer consent was signed after the withdrawal', () => {
    const withdrawn = consent({ withdrawal: { at: '2026-03-05T10:00:00.000Z', scope: 'future_releases', operatorId: 'operator-1', note: null } });
    expect(checkEligibility(participant(), [withdrawn], calm)).toEqual({ ok: false, problems: ['Consent was withdrawn on 2026-03-05T10:00:00.000Z.'] });
    const before = consent({ id: 'consent-0', signedAt: '2026-03-01T10:00:00.000Z' });
    expect(checkEligibility(participant(), [before, withdrawn], calm).ok).toBe(false);
    const renewed = consent({ id: 'consent-2', formVersion: '2026-03', signedAt: '2026-03-09T10:00:00.000Z' });
    expect(checkEligibility(participant(), [withdrawn, renewed], calm)).toEqual({ ok: true, problems: [] });
  });

  it('reports a consent whose date cannot be read instead of guessing', () => {
    const garbled = consent({ signedAt: 'not-a-date-at-all' });
    expect(checkEligibility(participant(), [garbled], calm).problems).toEqual(['Consent consent-1 has a date that is not a valid date and time.']);
  });

  it('lists every problem at once', () => {
    const result = checkEligibility(participant({ photosensitivityCleared: false, noNeurologicalCondition: false }), [], withBeacon);
    expect(result.ok).toBe(false);
    expect(result.problems).toHaveLength(3);
  });
});
