import type { DataKey } from '../../../../app/core/crypto';
import { encryptText, sealText } from '../../../../app/core/crypto';
import type { RecordOf } from '../../../../app/core/study/records';

/** Small valid records for the database tests (the warehouse-aisle study). */
export const study: RecordOf<'studies'> = { id: 'study-aisle', name: 'Warehouse aisle', description: 'Forklifts and parcels', createdAt: '2026-03-01T09:00:00.000Z', demo: false };

export async function participant(key: DataKey, id: string, enrolment: number, name: string): Promise<RecordOf<'participants'>> {
  return {
    id,
    studyId: study.id,
    code: `K7M4XR${enrolment}`,
    enrolment,
    createdAt: `2026-03-0${enrolment}T10:00:00.000Z`,
    name: await encryptText(key, name),
    contact: await sealText(key, `${name.toLowerCase().replace(' ', '.')}@lab.example`),
    birthDate: await sealText(key, '1990-05-17'),
    notes: null,
    demographics: { age: 35, sex: 'not_given', handedness: 'right', visionCorrection: 'glasses' },
    eligibility: { photosensitivityCleared: true, normalOrCorrectedVision: true, noNeurologicalCondition: true, checkedAt: '2026-03-01T10:00:00.000Z' },
  };
}

export async function consent(key: DataKey, id: string, participantId: string, withdrawn: boolean): Promise<RecordOf<'consents'>> {
  return {
    id,
    participantId,
    formVersion: 'v2',
    signedAt: '2026-03-01T10:05:00.000Z',
    operatorId: 'op-1',
    scopes: { participate: true, publicRelease: true, namedCollaborators: false, recontact: false },
    signatureRef: await sealText(key, 'scan 0042'),
    note: await sealText(key, 'asked about the beacon'),
    withdrawal: withdrawn ? { at: '2026-03-09T12:00:00.000Z', scope: 'future_releases', operatorId: 'op-1', note: await sealText(key, 'moved away') } : null,
  };
}
