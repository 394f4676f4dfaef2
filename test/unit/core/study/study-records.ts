import { tables, type ConsentRecord, type ParticipantRecord, type ProtocolRecord, type RecordOf, type TrialRecord } from '../../../../app/core/study/records';

/** Records for the warehouse-aisle demo scenario, each checked against its table's schema. */
const at = '2026-03-02T09:00:00.000Z';

export function protocol(fields: Partial<ProtocolRecord> = {}): ProtocolRecord {
  return tables.protocols.parse({
    id: 'protocol-aisle',
    studyId: 'study-aisle',
    name: 'Aisle clips',
    version: 1,
    steps: [{ kind: 'calibrate' }, { kind: 'validate' }],
    counterbalancing: { kind: 'none' },
    driftCheckEvery: null,
    validationLayout: 9,
    thresholds: { validationMeanDeg: 1, validationMaxDeg: 1.5, driftDeg: 1.5 },
    look: 'decay',
    speed: 1,
    createdAt: at,
    updatedAt: at,
    ...fields,
  });
}

export function participant(eligibility: Partial<ParticipantRecord['eligibility']> = {}): ParticipantRecord {
  return tables.participants.parse({
    id: 'participant-1',
    studyId: 'study-aisle',
    code: 'K7M4XR2',
    enrolment: 1,
    createdAt: at,
    name: null,
    contact: null,
    birthDate: null,
    notes: null,
    demographics: { age: 31, sex: 'not_given', handedness: 'right', visionCorrection: 'glasses' },
    eligibility: { photosensitivityCleared: true, normalOrCorrectedVision: true, noNeurologicalCondition: true, checkedAt: at, ...eligibility },
  });
}

export function consent(fields: Partial<ConsentRecord> = {}): ConsentRecord {
  return tables.consents.parse({
    id: 'consent-1',
    participantId: 'participant-1',
    formVersion: '2026-01',
    signedAt: at,
    operatorId: 'operator-1',
    scopes: { participate: true, publicRelease: true, namedCollaborators: false, recontact: false },
    signatureRef: null,
    note: null,
    withdrawal: null,
    ...fields,
  });
}

export function stimulus(id: string, mayFlash = false): RecordOf<'stimuli'> {
  return tables.stimuli.parse({ id, studyId: 'study-aisle', name: id.replace(/-/g, ' '), durationS: 20, sensor: { width: 640, height: 480 }, mayFlash, addedAt: at });
}

export function trial(index: number, kind: TrialRecord['kind'], state: TrialRecord['state'], fields: Partial<TrialRecord> = {}): TrialRecord {
  return tables.trials.parse({
    id: `trial-${index}`,
    sessionId: 'session-1',
    index,
    kind,
    stimulusId: null,
    state,
    startedHostNs: state === 'pending' ? null : 1e9 * (index + 1),
    endedHostNs: state === 'pending' ? null : 1e9 * (index + 1) + 5e8,
    badReason: null,
    ...fields,
  });
}
