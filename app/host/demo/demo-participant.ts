import { encryptText, sealText, type DataKey } from '../../core/crypto';
import type { Xoshiro128 } from '../../core/random/xoshiro128';
import { sexes, visionCorrections, type ConsentRecord, type ParticipantRecord } from '../../core/study/records';
import { DEMO_OPERATOR_ID, DEMO_STUDY_ID } from './demo-protocol';
import type { DemoPersonalData } from './personal-data-tsv';

export const DEMO_CONSENT_FORM = 'demo-consent-v1';

/** Whole years from a YYYY-MM-DD birth date to `on`. */
export function ageOn(birthDate: string, on: Date): number {
  const [y, m, d] = birthDate.split('-').map(Number) as [number, number, number];
  const before = on.getUTCMonth() + 1 < m || (on.getUTCMonth() + 1 === m && on.getUTCDate() < d);
  return on.getUTCFullYear() - y - (before ? 1 : 0);
}

const pick = <T>(items: readonly T[], random: Xoshiro128): T => items[random.nextInt(items.length)]!;

/** A registered demo participant: demographics, a completed eligibility checklist, personal fields sealed with the lab key. */
export async function demoParticipant(key: DataKey, o: { enrolment: number; code: string; registeredAt: Date; random: Xoshiro128; personal: DemoPersonalData | null }): Promise<ParticipantRecord> {
  const { personal, random } = o;
  const at = o.registeredAt.toISOString();
  return {
    id: `demo-participant-${o.enrolment}`,
    studyId: DEMO_STUDY_ID,
    code: o.code,
    enrolment: o.enrolment,
    createdAt: at,
    name: await sealText(key, personal?.name ?? null),
    contact: await sealText(key, personal?.email ?? null),
    birthDate: await sealText(key, personal?.birthDate ?? null),
    notes: null,
    demographics: {
      age: personal ? ageOn(personal.birthDate, o.registeredAt) : 19 + random.nextInt(30),
      sex: pick(sexes.slice(0, 3), random),
      handedness: random.nextInt(10) === 0 ? 'left' : 'right',
      visionCorrection: pick(visionCorrections, random),
    },
    eligibility: { photosensitivityCleared: true, normalOrCorrectedVision: true, noNeurologicalCondition: true, checkedAt: at },
  };
}

/**
 * The participant's consent: to take part, and to sharing (a public anonymized release and
 * named collaborators) as `share` says; a withdrawal when `withdrawnAt` is given.
 */
export async function demoConsent(key: DataKey, p: ParticipantRecord, o: { signedAt: Date; share: boolean; note: string | null; withdrawnAt: Date | null }): Promise<ConsentRecord> {
  return {
    id: `demo-consent-${p.enrolment}`,
    participantId: p.id,
    formVersion: DEMO_CONSENT_FORM,
    signedAt: o.signedAt.toISOString(),
    operatorId: DEMO_OPERATOR_ID,
    scopes: { participate: true, publicRelease: o.share, namedCollaborators: o.share, recontact: false },
    signatureRef: null,
    note: o.note ? await encryptText(key, o.note) : null,
    withdrawal: o.withdrawnAt ? { at: o.withdrawnAt.toISOString(), scope: 'all_use', operatorId: DEMO_OPERATOR_ID, note: null } : null,
  };
}
