import { z } from 'zod';
import { encryptedField } from './encrypted-field';

/**
 * The lab's records, one schema per table, shared by the console's database (renderer/db),
 * the lab archive (tables/NAME.ndjson) and the command line, so all three write exactly
 * the same records. Ids are strings; times are ISO 8601 (wall clock) unless named ...HostNs.
 * Personal fields are `encryptedField` (or null when not given).
 */
const id = z.string().min(1).max(120);
const iso = z.string().min(10).max(40);
const finite = z.number().refine(Number.isFinite, 'expected a finite number');
const personal = encryptedField.nullable();

export const visionCorrections = ['none', 'glasses', 'contact_lenses'] as const;
export const sexes = ['female', 'male', 'other', 'not_given'] as const;
export const handednesses = ['left', 'right', 'ambidextrous', 'not_given'] as const;

export const studyRecord = z.object({
  id,
  name: z.string().min(1).max(200),
  description: z.string().max(5000),
  createdAt: iso,
  /** Demo data made by the simulator: shown as such everywhere. */
  demo: z.boolean(),
});

/** A library stimulus a study uses (the events stay in the host's library). */
export const stimulusRecord = z.object({
  id,
  studyId: id,
  name: z.string().max(200),
  durationS: finite,
  sensor: z.object({ width: z.number().int().positive(), height: z.number().int().positive() }),
  mayFlash: z.boolean(),
  addedAt: iso,
});

export const protocolStep = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('calibrate') }),
  z.object({ kind: z.literal('validate') }),
  z.object({ kind: z.literal('drift_check') }),
  z.object({ kind: z.literal('clip'), stimulusId: id }),
  /** Clips shown in a counterbalanced order, with a drift check every N clips if the protocol says so. */
  z.object({ kind: z.literal('block'), name: z.string().max(100), stimulusIds: z.array(id).min(1).max(200) }),
  z.object({ kind: z.literal('rest'), seconds: finite.min(1).max(3600) }),
  z.object({ kind: z.literal('message'), text: z.string().min(1).max(2000) }),
]);

export const protocolRecord = z.object({
  id,
  studyId: id,
  name: z.string().min(1).max(200),
  version: z.number().int().positive(),
  steps: z.array(protocolStep).min(1).max(500),
  counterbalancing: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('latin-square') }),
    z.object({ kind: z.literal('seeded-shuffle'), generator: z.literal('xoshiro128**') }),
    z.object({ kind: z.literal('none') }),
  ]),
  /** A drift check after every N clips of a block (null: only where the steps put one). */
  driftCheckEvery: z.number().int().positive().nullable(),
  validationLayout: z.union([z.literal(5), z.literal(9), z.literal(13)]),
  thresholds: z.object({
    validationMeanDeg: finite.positive(),
    validationMaxDeg: finite.positive(),
    driftDeg: finite.positive(),
  }),
  /** Clip display: look and speed. */
  look: z.enum(['polarity', 'decay', 'grey']),
  speed: finite.min(0.1).max(1),
  /** Rest limits in minutes (app/core/study/rest-limits.ts); missing: the defaults 20/40/2/60. */
  restLimits: z
    .object({ warnAfterMin: finite.min(1).max(600), requireRestAfterMin: finite.min(1).max(600), requiredRestMin: finite.min(0.5).max(60), sessionWarnAfterMin: finite.min(1).max(1440) })
    .refine((l) => l.warnAfterMin <= l.requireRestAfterMin, { message: 'the viewing warning must come no later than the required rest', path: ['warnAfterMin'] })
    .optional(),
  /** Clips of the steps that may flash when saved: the protocol runs only participants cleared in photosensitivity screening. */
  flashingStimulusIds: z.array(id).max(500).optional(),
  createdAt: iso,
  updatedAt: iso,
});

export const operatorRecord = z.object({ id, name: personal, createdAt: iso });

export const participantRecord = z.object({
  id,
  studyId: id,
  /** The pseudonymous code with its check character (app/core/study/participant-code.ts). */
  code: z.string().min(3).max(20),
  /** 1 for the first participant enrolled in the study: indexes the Latin square. */
  enrolment: z.number().int().positive(),
  createdAt: iso,
  name: personal,
  contact: personal,
  birthDate: personal,
  notes: personal,
  demographics: z.object({
    age: z.number().int().min(0).max(130).nullable(),
    sex: z.enum(sexes),
    handedness: z.enum(handednesses),
    visionCorrection: z.enum(visionCorrections),
  }),
  eligibility: z.object({
    /** Screened for photosensitive epilepsy and cleared to see flashing stimuli. */
    photosensitivityCleared: z.boolean(),
    normalOrCorrectedVision: z.boolean(),
    noNeurologicalCondition: z.boolean(),
    checkedAt: iso.nullable(),
  }),
});

export const consentScopes = z.object({
  participate: z.boolean(),
  publicRelease: z.boolean(),
  namedCollaborators: z.boolean(),
  recontact: z.boolean(),
});

export const consentRecord = z.object({
  id,
  participantId: id,
  formVersion: z.string().min(1).max(40),
  signedAt: iso,
  operatorId: id,
  scopes: consentScopes,
  signatureRef: personal,
  note: personal,
  /** Withdrawal excludes the person from every later release. */
  withdrawal: z
    .object({ at: iso, scope: z.enum(['all_use', 'future_releases']), operatorId: id, note: personal })
    .nullable(),
});

export const sessionRecord = z.object({
  /** The recording's session id (its folder under recordings/). */
  id,
  studyId: id,
  participantId: id,
  protocolId: id,
  protocolVersion: z.number().int().positive(),
  operatorId: id,
  startedAt: iso,
  endedAt: iso.nullable(),
  state: z.enum(['running', 'completed', 'aborted', 'interrupted']),
  /** The clip order this session used and how it was made (seed recorded for shuffles). */
  counterbalance: z.object({ kind: z.enum(['latin-square', 'seeded-shuffle', 'none']), seed: z.number().int().nullable(), row: z.number().int().nullable() }),
  display: z.object({ widthMm: finite, heightMm: finite, widthPx: z.number().int(), heightPx: z.number().int(), distanceMm: finite }),
  gazeSource: z.string().max(200),
  demo: z.boolean(),
});

export const trialRecord = z.object({
  id,
  sessionId: id,
  /** Position in the session's expanded plan, from 0. */
  index: z.number().int().nonnegative(),
  kind: z.enum(['calibrate', 'validate', 'drift_check', 'clip', 'rest', 'message']),
  stimulusId: id.nullable(),
  state: z.enum(['pending', 'done', 'skipped', 'bad']),
  startedHostNs: finite.nullable(),
  endedHostNs: finite.nullable(),
  badReason: z.string().max(500).nullable(),
});

export const targetResult = z.object({
  x: finite,
  y: finite,
  accuracyDeg: finite.nullable(),
  precisionRmsS2SDeg: finite.nullable(),
  precisionSdDeg: finite.nullable(),
  dataLossPct: finite,
  samples: z.number().int().nonnegative(),
  /** Mean gaze offset from the target, degrees (right and down positive). */
  dxDeg: finite.nullable(),
  dyDeg: finite.nullable(),
});

export const calibrationRecord = z.object({
  id,
  sessionId: id,
  trialId: id,
  at: iso,
  hostNs: finite,
  method: z.enum(['tracker', 'polynomial2']),
  points: z.array(targetResult),
});

export const validationRecord = z.object({
  id,
  sessionId: id,
  trialId: id,
  kind: z.enum(['validation', 'drift_check']),
  at: iso,
  hostNs: finite,
  points: z.array(targetResult).min(1),
  meanAccuracyDeg: finite.nullable(),
  maxAccuracyDeg: finite.nullable(),
  accepted: z.boolean(),
});

/**
 * A post-hoc correction of one session's gaze, fitted on its validations and drift checks.
 * Never destructive: the recorded gaze stays as it was; analysis and release apply the
 * correction only while it is enabled, and say so. Removing it keeps the record (enabled
 * false, removedAt set) as provenance.
 */
export const correctionModels = ['offset', 'offset_interpolated', 'affine', 'polynomial2'] as const;

export const correctionRecord = z.object({
  id,
  sessionId: id,
  model: z.enum(correctionModels),
  /**
   * Parameters in screen px (app/core/quality/correction): offset {dx, dy} (added to the gaze);
   * offset_interpolated {knots: [{hostNs, dx, dy}]}; affine {ax: [3], ay: [3]} (terms 1, x, y);
   * polynomial2 {ax: [6], ay: [6]} (terms 1, x, y, xy, x², y²), with x and y normalised
   * as params.centre and params.scale say.
   */
  params: z.record(z.string(), z.unknown()),
  /** Provenance: which checks it was fitted on and which were held out to judge it. */
  fromValidationIds: z.array(id),
  heldOutValidationIds: z.array(id),
  fit: z.object({ points: z.number().int(), rmsResidualPx: finite.nullable(), heldOutErrorBeforeDeg: finite.nullable(), heldOutErrorAfterDeg: finite.nullable() }),
  createdAt: iso,
  createdBy: id,
  enabled: z.boolean(),
  removedAt: iso.nullable(),
});

export const noteRecord = z.object({
  id,
  sessionId: id.nullable(),
  participantId: id.nullable(),
  at: iso,
  hostNs: finite.nullable(),
  operatorId: id,
  /** Free text may be about a person, so it is always encrypted. */
  text: encryptedField,
});

export const exclusionRecord = z.object({
  id,
  sessionId: id,
  scope: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('session') }),
    z.object({ kind: z.literal('clip'), stimulusId: id }),
    z.object({ kind: z.literal('time_range'), fromS: finite, toS: finite }),
  ]),
  reason: z.string().min(1).max(2000),
  decidedBy: id,
  decidedAt: iso,
  revokedAt: iso.nullable(),
});

export const releaseRecord = z.object({ id, version: z.string().max(40), createdAt: iso, createdBy: id, folder: z.string().max(1000), notes: z.string().max(5000) });

export const auditRecord = z.object({
  id,
  at: iso,
  operatorId: id.nullable(),
  action: z.string().max(80),
  table: z.string().max(40),
  recordId: id,
  /** What changed, without personal values (field names only). */
  summary: z.string().max(1000),
});

/** The lab's key material: the data key wrapped by the passphrase and by the recovery key (app/core/crypto). */
export const keyringRecord = z.object({
  id: z.literal('keyring'),
  version: z.literal(1),
  keyId: z.string(),
  kdf: z.object({ alg: z.literal('PBKDF2-SHA256'), iterations: z.number().int().min(600_000), salt: z.string() }),
  wrappedByPassphrase: z.object({ iv: z.string(), ct: z.string() }),
  wrappedByRecovery: z.object({ recoveryPublicJwk: z.record(z.string(), z.unknown()), ephemeralPublicJwk: z.record(z.string(), z.unknown()), iv: z.string(), ct: z.string() }),
  /** A known plaintext encrypted with the data key: a wrong passphrase is told apart from damage. */
  check: encryptedField,
  demo: z.boolean(),
  createdAt: iso,
  updatedAt: iso,
});

/** Every table of the lab database and archive, in archive order. */
export const tables = {
  settings: keyringRecord,
  studies: studyRecord,
  stimuli: stimulusRecord,
  protocols: protocolRecord,
  operators: operatorRecord,
  participants: participantRecord,
  consents: consentRecord,
  sessions: sessionRecord,
  trials: trialRecord,
  calibrations: calibrationRecord,
  validations: validationRecord,
  corrections: correctionRecord,
  notes: noteRecord,
  exclusions: exclusionRecord,
  releases: releaseRecord,
  audit: auditRecord,
} as const;

export type TableName = keyof typeof tables;
export type RecordOf<T extends TableName> = z.infer<(typeof tables)[T]>;
export type ProtocolStep = z.infer<typeof protocolStep>;
export type StudyRecord = RecordOf<'studies'>;
export type ProtocolRecord = RecordOf<'protocols'>;
export type ParticipantRecord = RecordOf<'participants'>;
export type ConsentRecord = RecordOf<'consents'>;
export type SessionRecord = RecordOf<'sessions'>;
export type TrialRecord = RecordOf<'trials'>;
export type ValidationRecord = RecordOf<'validations'>;
export type TargetResult = z.infer<typeof targetResult>;
export type CorrectionRecord = RecordOf<'corrections'>;
export type CorrectionModel = CorrectionRecord['model'];
export type KeyringRecord = RecordOf<'settings'>;
