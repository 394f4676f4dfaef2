import { join } from 'node:path';
import { encodeTable } from '../../core/archive/table-codec';
import { createKeyring, encryptText, type DataKey } from '../../core/crypto';
import { Xoshiro128 } from '../../core/random/xoshiro128';
import { generateParticipantCode } from '../../core/study/participant-code';
import { checkEligibility } from '../../core/study/eligibility';
import { planSession } from '../../core/study/session-plan';
import { tables, type RecordOf, type TableName } from '../../core/study/records';
import { demoClipRecipes, type DemoClipRecipe } from '../stimuli/demo-clips';
import { demoClipTracks } from './demo-clip-tracks';
import { demoConsent, demoParticipant } from './demo-participant';
import { DEMO_DISPLAY, DEMO_OPERATOR_ID, DEMO_PASSPHRASE, DEMO_SENSOR, demoProtocol, demoStimuli, demoStudy } from './demo-protocol';
import type { DemoPersonalData } from './personal-data-tsv';
import { runSimulatedSession, type DemoClip, type SimulatedTrackerChoice } from './simulated-session';

export interface DemoStudyOptions {
  readonly participants: number;
  readonly seed: number;
  /** Where the session recordings are made (one folder per session). */
  readonly recordingsDir: string;
  /** One row per participant, from --personal-data. */
  readonly personalData?: readonly DemoPersonalData[];
  /** The lab passphrase; the demo passphrase (shown on the demo lock screen) by default. */
  readonly passphrase?: string;
  readonly now?: Date;
  readonly onProgress?: (fraction: number, label: string) => void;
  readonly recipes?: readonly DemoClipRecipe[];
}

export interface DemoParticipantSummary {
  readonly code: string;
  readonly sessionId: string;
  readonly driftDegPerMin: number;
  readonly samples: number;
  /** The largest drift-check offset of the session, degrees. */
  readonly maxDriftDeg: number | null;
  readonly meanValidationAccuracyDeg: number | null;
}

export interface DemoStudy {
  readonly tables: Record<TableName, string>;
  readonly sessionDirs: string[];
  readonly participants: DemoParticipantSummary[];
  /** Only for a lab passphrase of the user's own: the recovery key to keep on paper. */
  readonly recoveryKey: string | null;
}

export const MAX_DEMO_PARTICIPANTS = 60;
/** The participant given heavy drift: the second (or the only one). */
export const driftingEnrolment = (participants: number): number => Math.min(2, participants);
const HEAVY_DRIFT_DEG_PER_MIN = 1.5;
const LIGHT_DRIFT_DEG_PER_MIN = 0.1;
const DAY_MS = 86_400_000;

type Rows = { [T in TableName]: RecordOf<T>[] };

function tracker(seed: number, enrolment: number, participants: number): SimulatedTrackerChoice {
  const driftDegPerMin = enrolment === driftingEnrolment(participants) ? HEAVY_DRIFT_DEG_PER_MIN : LIGHT_DRIFT_DEG_PER_MIN;
  return { kind: 'simulated', seed: (seed * 1000 + enrolment) >>> 0, rateHz: 500, noiseDeg: 0.03, driftDegPerMin, accuracyOffsetDeg: 0.3, lossPct: 1, latencyMs: 4 };
}

/**
 * A small complete study of invented data, made by the simulator: the demo protocol, the
 * warehouse clips, `participants` people with demographics, eligibility and consent, one
 * operator, and one session each, recorded through the session recorder from the simulated
 * tracker in simulated time (the second participant drifts heavily). Returns the tables as
 * the console would store them, personal fields sealed with the lab passphrase's key.
 */
export async function buildDemoStudy(options: DemoStudyOptions): Promise<DemoStudy> {
  const n = options.participants;
  if (!(Number.isInteger(n) && n >= 1 && n <= MAX_DEMO_PARTICIPANTS)) throw new RangeError(`participants must be an integer from 1 to ${MAX_DEMO_PARTICIPANTS}, got ${n}`);
  if (options.personalData && options.personalData.length !== n) throw new RangeError(`the personal data has ${options.personalData.length} rows for ${n} participants (one row per participant)`);
  const recipes = options.recipes ?? demoClipRecipes;
  const now = options.now ?? new Date();
  // Participant k registers on day k of the study, which started n + 1 days ago at 09:00 UTC.
  const studyStart = new Date(Math.floor(now.getTime() / DAY_MS) * DAY_MS - (n + 1) * DAY_MS + 9 * 3_600_000);
  const created = studyStart.toISOString();
  const custom = options.passphrase !== undefined && options.passphrase !== DEMO_PASSPHRASE;
  const { keyring, dataKey, recoveryKey } = await createKeyring(options.passphrase ?? DEMO_PASSPHRASE, { demo: !custom, now: created });
  const rows = Object.fromEntries(Object.keys(tables).map((t) => [t, []])) as unknown as Rows;
  const audit = (at: string, table: TableName, recordId: string, action: string, summary: string) =>
    rows.audit.push({ id: `demo-audit-${rows.audit.length + 1}`, at, operatorId: DEMO_OPERATOR_ID, action, table, recordId, summary });

  rows.settings.push(keyring);
  rows.studies.push(demoStudy(created));
  rows.stimuli.push(...demoStimuli(created, recipes));
  const protocol = demoProtocol(created, recipes);
  rows.protocols.push(protocol);
  rows.operators.push({ id: DEMO_OPERATOR_ID, name: await encryptText(dataKey, 'Demo operator'), createdAt: created });
  audit(created, 'operators', DEMO_OPERATOR_ID, 'create', 'name');
  audit(created, 'studies', 'demo-study', 'create', 'name, description');
  for (const s of rows.stimuli) audit(created, 'stimuli', s.id, 'create', 'name, mayFlash');
  audit(created, 'protocols', protocol.id, 'create', 'steps, counterbalancing, thresholds');

  const clips = new Map<string, DemoClip>(recipes.map((r) => [r.id, { durationS: r.durationS, sensor: DEMO_SENSOR, tracks: demoClipTracks(r) }]));
  const random = new Xoshiro128(options.seed);
  const taken = new Set<string>();
  const sessionDirs: string[] = [];
  const summaries: DemoParticipantSummary[] = [];
  for (let enrolment = 1; enrolment <= n; enrolment++) {
    options.onProgress?.((enrolment - 1) / n, `simulating participant ${enrolment} of ${n}`);
    const registeredAt = new Date(studyStart.getTime() + enrolment * DAY_MS);
    const code = generateParticipantCode(() => random.next(), taken);
    taken.add(code);
    const personal = options.personalData?.[enrolment - 1] ?? null;
    const participant = await demoParticipant(dataKey, { enrolment, code, registeredAt, random, personal });
    const signedAt = new Date(registeredAt.getTime() + 5 * 60_000);
    // Without personal data every third participant declines sharing, so releases have someone to leave out.
    const share = personal ? personal.share : enrolment % 3 !== 0;
    const consent = await demoConsent(dataKey, participant, { signedAt, share, note: personal?.consentNote || null, withdrawnAt: null });
    const eligible = checkEligibility(participant, [consent], rows.stimuli);
    if (!eligible.ok) throw new Error(`demo participant ${code} is not eligible: ${eligible.problems.join(' ')}`);

    const sessionId = `demo-session-${enrolment}-${code}`;
    const session = await runDemoSession(rows, dataKey, { protocol, participant, sessionId, clips, startedAt: new Date(signedAt.getTime() + 10 * 60_000), tracker: tracker(options.seed, enrolment, n), dir: join(options.recordingsDir, sessionId), seed: options.seed });
    sessionDirs.push(join(options.recordingsDir, sessionId));
    rows.participants.push(participant);
    audit(participant.createdAt, 'participants', participant.id, 'create', 'code, demographics, eligibility, name, contact, birthDate');
    if (personal?.withdrawn) {
      const withdrawn = await demoConsent(dataKey, participant, { signedAt, share, note: personal.consentNote || null, withdrawnAt: new Date(registeredAt.getTime() + DAY_MS / 2) });
      rows.consents.push(withdrawn);
      audit(consent.signedAt, 'consents', consent.id, 'create', 'formVersion, scopes, note');
      audit(withdrawn.withdrawal!.at, 'consents', consent.id, 'withdraw', 'withdrawal');
    } else {
      rows.consents.push(consent);
      audit(consent.signedAt, 'consents', consent.id, 'create', 'formVersion, scopes, note');
    }
    summaries.push({ code, sessionId, ...session });
  }
  options.onProgress?.(1, `simulated ${n} participants`);
  const encoded = Object.fromEntries(Object.entries(rows).map(([t, records]) => [t, encodeTable(t as TableName, records)])) as Record<TableName, string>;
  return { tables: encoded, sessionDirs, participants: summaries, recoveryKey: custom ? recoveryKey : null };
}

async function runDemoSession(
  rows: Rows,
  key: DataKey,
  o: { protocol: RecordOf<'protocols'>; participant: RecordOf<'participants'>; sessionId: string; clips: Map<string, DemoClip>; startedAt: Date; tracker: SimulatedTrackerChoice; dir: string; seed: number },
): Promise<Omit<DemoParticipantSummary, 'code' | 'sessionId'>> {
  const { protocol, participant, sessionId } = o;
  const plan = planSession(protocol, { enrolment: participant.enrolment, seed: (o.seed + participant.enrolment) >>> 0 });
  const outcome = await runSimulatedSession({ dir: o.dir, sessionId, label: `Demo: participant ${participant.code}`, display: DEMO_DISPLAY, tracker: o.tracker, steps: plan.steps, protocol, clips: o.clips, startedAt: o.startedAt, targetSeed: (o.seed * 7919 + participant.enrolment) >>> 0 });
  rows.sessions.push({
    id: sessionId,
    studyId: protocol.studyId,
    participantId: participant.id,
    protocolId: protocol.id,
    protocolVersion: protocol.version,
    operatorId: DEMO_OPERATOR_ID,
    startedAt: o.startedAt.toISOString(),
    endedAt: outcome.endedAt,
    state: 'completed',
    counterbalance: plan.counterbalance,
    display: { ...DEMO_DISPLAY },
    gazeSource: `Simulated tracker at ${o.tracker.rateHz} Hz (seed ${o.tracker.seed})`,
    demo: true,
  });
  rows.trials.push(...outcome.trials);
  rows.calibrations.push(...outcome.calibrations);
  rows.validations.push(...outcome.validations);
  for (const failed of outcome.failedChecks) {
    const v = outcome.validations.find((x) => x.trialId === `${sessionId}-trial-${failed.index}`)!;
    const note = { id: `${sessionId}-note-${failed.index}`, sessionId, participantId: participant.id, at: v.at, hostNs: v.hostNs, operatorId: DEMO_OPERATOR_ID, text: await encryptText(key, `${failed.reasons.join('; ')}: recalibration offered, participant asked to sit still.`) };
    rows.notes.push(note);
  }
  const audit = (table: TableName, recordId: string, summary: string) => rows.audit.push({ id: `demo-audit-${rows.audit.length + 1}`, at: outcome.endedAt, operatorId: DEMO_OPERATOR_ID, action: 'create', table, recordId, summary });
  audit('sessions', sessionId, 'state, counterbalance, display');
  for (const v of outcome.validations) audit('validations', v.id, 'points, accepted');
  const drifts = outcome.validations.filter((v) => v.kind === 'drift_check' && v.meanAccuracyDeg !== null).map((v) => v.meanAccuracyDeg!);
  const firstValidation = outcome.validations.find((v) => v.kind === 'validation');
  return { driftDegPerMin: o.tracker.driftDegPerMin ?? 0, samples: outcome.samples, maxDriftDeg: drifts.length ? Math.max(...drifts) : null, meanValidationAccuracyDeg: firstValidation?.meanAccuracyDeg ?? null };
}
