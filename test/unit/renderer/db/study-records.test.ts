import { describe, expect, it } from 'vitest';
import type { StimulusMeta } from '../../../../app/contract';
import { createKeyring, decryptText } from '../../../../app/core/crypto';
import { checkEligibility } from '../../../../app/core/study/eligibility';
import { checkRecord } from '../../../../renderer/db/record-checks';
import { consentSummary } from '../../../../renderer/console/participants/consent-status';
import { draftProblems, emptyDraft, participantRecord } from '../../../../renderer/console/participants/participant-draft';
import { staleStimuli, stimulusFromLibrary } from '../../../../renderer/console/study/library-mirror';
import { consent, study } from './lab-records';

// The records the Study and Participants screens write (common practice, no source).
const meta = (over: Partial<StimulusMeta>): StimulusMeta => ({
  id: 'clip-beacon',
  name: 'rotating warning beacon',
  notes: '',
  createdAt: '2026-03-01T09:00:00.000Z',
  source: { kind: 'import', file: 'beacon.csv' },
  sensor: { width: 346, height: 260 },
  resolution: 'us',
  eventCount: 1000,
  tStartUs: 0,
  tEndUs: 6_000_000,
  durationS: 6,
  mayFlash: false,
  demo: true,
  hasTracks: false,
  warnings: [],
  ...over,
});

describe('a study’s stimuli follow the library', () => {
  it('a clip marked "may flash" in the library is marked in the study, so screening applies to it', () => {
    const added = checkRecord('stimuli', stimulusFromLibrary(study, meta({}), '2026-03-02T09:00:00.000Z'));
    expect(staleStimuli([added], [meta({})])).toEqual([]);
    const [fresh] = staleStimuli([added], [meta({ mayFlash: true, name: 'beacon, fast' })]);
    expect(fresh).toEqual({ ...added, mayFlash: true, name: 'beacon, fast' });
    expect(staleStimuli([added], [])).toEqual([]); // removed from the library: the record stays as it was
  });
});

describe('registering a participant', () => {
  it('encrypts the personal fields and keeps the rest for analysis', async () => {
    const key = (await createKeyring('correct horse battery staple', { demo: false })).dataKey;
    const draft = { ...emptyDraft, name: ' Ola Berg ', contact: 'ola@aisle.example', age: '34', visionCorrection: 'glasses' as const, eligibility: { ...emptyDraft.eligibility, normalOrCorrectedVision: true, noNeurologicalCondition: true, done: true } };
    const fixed = { id: 'p-1', studyId: study.id, code: 'K7M4XR9', enrolment: 1, createdAt: '2026-03-01T10:00:00.000Z' };
    const record = checkRecord('participants', await participantRecord(draft, key, fixed));
    expect(JSON.stringify(record)).not.toContain('Ola');
    expect(await decryptText(key, record.name!)).toBe('Ola Berg');
    expect(record.birthDate).toBeNull();
    expect(record.demographics).toEqual({ age: 34, sex: 'not_given', handedness: 'not_given', visionCorrection: 'glasses' });
    expect(record.eligibility.checkedAt).toBe(fixed.createdAt);

    // Not cleared for photosensitivity: a "may flash" clip is refused, other clips are not.
    const consents = [await consent(key, 'c-1', 'p-1', false)];
    const beacon = stimulusFromLibrary(study, meta({ mayFlash: true }), fixed.createdAt);
    expect(checkEligibility(record, consents, [beacon]).ok).toBe(false);
    expect(checkEligibility(record, consents, [{ ...beacon, mayFlash: false }]).ok).toBe(true);
  });

  it('says which fields are wrong', () => {
    expect(draftProblems(emptyDraft)).toEqual([]);
    expect(draftProblems({ ...emptyDraft, age: 'thirty' })).toEqual(['Age: a whole number of years, or empty.']);
    expect(draftProblems({ ...emptyDraft, age: '131' })).toEqual(['Age: at most 130.']);
  });
});

describe('the consent column', () => {
  it('reads the latest consent', async () => {
    const key = (await createKeyring('correct horse battery staple', { demo: false })).dataKey;
    const given = await consent(key, 'c-1', 'p-1', false);
    const withdrawn = await consent(key, 'c-2', 'p-1', true);
    expect(consentSummary([])).toBe('no consent');
    expect(consentSummary([given])).toBe('consented, public release');
    expect(consentSummary([given, { ...withdrawn, signedAt: '2026-03-02T10:00:00.000Z' }])).toBe('withdrawn (future releases)');
    expect(consentSummary([{ ...given, scopes: { ...given.scopes, participate: false } }])).toBe('declined to take part');
  });
});
