import type { TableName } from '../../app/core/study/records';

/**
 * The lab database's schema, one entry per version, each kept as it shipped: Dexie needs
 * every version that carries an upgrade, and a database written by an old version must
 * still open. Primary key first ('id' everywhere), then the indexes.
 */
type Stores = Record<TableName, string>;
/** The tables before version 3 added `corrections`. */
type StoresBeforeV3 = Omit<Stores, 'corrections'>;

/** Version 1, frozen: test/fixtures/db/lab-v1.json was written with exactly this. */
export const storesV1: StoresBeforeV3 = {
  settings: 'id',
  studies: 'id',
  stimuli: 'id, studyId',
  protocols: 'id, studyId',
  operators: 'id',
  participants: 'id, studyId, code',
  consents: 'id, participantId',
  sessions: 'id, studyId, participantId',
  trials: 'id, sessionId',
  calibrations: 'id, sessionId',
  validations: 'id, sessionId',
  notes: 'id, sessionId, participantId',
  exclusions: 'id, sessionId',
  releases: 'id',
  audit: 'id, at',
};

/**
 * Version 2: participants carry their enrolment number in the study (it indexes the
 * Latin square), sessions are found by state (crash recovery), trials by position, and the
 * audit log by the record it speaks of.
 */
export const storesV2: StoresBeforeV3 = {
  ...storesV1,
  participants: 'id, studyId, code, [studyId+enrolment]',
  sessions: 'id, studyId, participantId, state',
  trials: 'id, sessionId, [sessionId+index]',
  audit: 'id, at, [table+recordId]',
};

/** Version 3: a session's gaze corrections (records.ts correctionRecord); no record changes. */
export const storesV3: Stores = {
  ...storesV2,
  corrections: 'id, sessionId',
};

export const LATEST_VERSION = 3;
