import type { RecordOf, TableName } from '../../../../app/core/study/records';

// A small, valid set of lab records for archive tests (warehouse demo scenario, invented).
const sealed = (ct: string) => ({ alg: 'AES-GCM-256' as const, keyId: 'k1', iv: 'aXZpdml2aXZpdml2', ct });
const at = '2026-03-02T09:15:00.000Z';

export function sampleTables(): { [T in TableName]?: RecordOf<T>[] } {
  return {
    studies: [{ id: 'study-1', name: 'Warehouse aisle saliency', description: 'Forklifts and parcels', createdAt: at, demo: false }],
    stimuli: [{ id: 'demo-forklift-crossing', studyId: 'study-1', name: 'Forklifts crossing', durationS: 6, sensor: { width: 640, height: 480 }, mayFlash: false, addedAt: at }],
    operators: [{ id: 'op-1', name: sealed('b3BlcmF0b3I='), createdAt: at }],
    participants: [
      {
        id: 'p-1',
        studyId: 'study-1',
        code: 'K7M4XR9',
        enrolment: 1,
        createdAt: at,
        name: sealed('bmFtZQ=='),
        contact: null,
        birthDate: null,
        notes: null,
        demographics: { age: 31, sex: 'female', handedness: 'right', visionCorrection: 'glasses' },
        eligibility: { photosensitivityCleared: true, normalOrCorrectedVision: true, noNeurologicalCondition: true, checkedAt: at },
      },
    ],
    audit: [
      { id: 'a-1', at, operatorId: 'op-1', action: 'create', table: 'participants', recordId: 'p-1', summary: 'name, demographics' },
      { id: 'a-2', at, operatorId: 'op-1', action: 'create', table: 'studies', recordId: 'study-1', summary: 'name' },
    ],
  };
}
