import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { decryptText, encryptText } from '../../../../app/core/crypto/field-cipher';
import { personalFieldPaths, reencryptRecord } from '../../../../app/core/crypto/personal-fields';
import { WrongKeyError } from '../../../../app/core/crypto/wrong-key-error';
import { encryptedField } from '../../../../app/core/study/encrypted-field';
import { type ConsentRecord, type ParticipantRecord, tables, type TableName } from '../../../../app/core/study/records';
import { dataKeyFromBytes, randomBytes } from './test-keys';

/** Dotted paths of every encryptedField in a schema, found by walking the zod schema itself. */
function encryptedPaths(schema: z.ZodType, prefix = ''): string[] {
  if (schema === encryptedField) return [prefix];
  if (schema instanceof z.ZodNullable || schema instanceof z.ZodOptional) return encryptedPaths(schema.unwrap() as z.ZodType, prefix);
  if (schema instanceof z.ZodObject) {
    return Object.entries(schema.shape).flatMap(([key, child]) => encryptedPaths(child as z.ZodType, prefix ? `${prefix}.${key}` : key));
  }
  if (schema instanceof z.ZodArray) return encryptedPaths(schema.element as z.ZodType, `${prefix}[]`);
  if (schema instanceof z.ZodDiscriminatedUnion || schema instanceof z.ZodUnion) return schema.options.flatMap((o) => encryptedPaths(o as z.ZodType, prefix));
  return [];
}

const keys = async () => ({ from: await dataKeyFromBytes('dk-old', randomBytes(32)), to: await dataKeyFromBytes('dk-new', randomBytes(32)) });

async function participant(key: Awaited<ReturnType<typeof keys>>['from']): Promise<ParticipantRecord> {
  return tables.participants.parse({
    id: 'p1', studyId: 's1', code: 'K7QX-4', enrolment: 1, createdAt: '2026-03-02T09:00:00Z',
    name: await encryptText(key, 'Ada Forklift'), contact: await encryptText(key, 'ada@example.org'), birthDate: null, notes: await encryptText(key, 'prefers mornings'),
    demographics: { age: 34, sex: 'female', handedness: 'right', visionCorrection: 'glasses' },
    eligibility: { photosensitivityCleared: true, normalOrCorrectedVision: true, noNeurologicalCondition: true, checkedAt: '2026-03-02T09:05:00Z' },
  });
}

describe('personalFieldPaths', () => {
  it('lists exactly the encrypted fields of every table schema', () => {
    for (const table of Object.keys(tables) as TableName[]) {
      if (table === 'settings') continue; // the keyring's check field is key material, not personal data
      expect([...(personalFieldPaths[table] ?? [])].sort(), table).toEqual(encryptedPaths(tables[table]).sort());
    }
  });

  it('covers names, contact details, birth dates, consent notes, signatures, notes about people and operator names', () => {
    expect(personalFieldPaths).toEqual({
      operators: ['name'],
      participants: ['name', 'contact', 'birthDate', 'notes'],
      consents: ['signatureRef', 'note', 'withdrawal.note'],
      notes: ['text'],
    });
  });
});

describe('reencryptRecord', () => {
  it('moves every personal field of a participant to the new key, keeps the rest and leaves the input alone', async () => {
    const { from, to } = await keys();
    const before = await participant(from);
    const snapshot = structuredClone(before);
    const after = await reencryptRecord('participants', before, from, to);
    expect(before).toEqual(snapshot);
    expect(tables.participants.parse(after)).toEqual(after);
    expect({ ...after, name: null, contact: null, notes: null }).toEqual({ ...before, name: null, contact: null, notes: null });
    expect(after.birthDate).toBeNull();
    expect([after.name, after.contact, after.notes].map((f) => f?.keyId)).toEqual(['dk-new', 'dk-new', 'dk-new']);
    expect(await decryptText(to, after.name!)).toBe('Ada Forklift');
    expect(await decryptText(to, after.notes!)).toBe('prefers mornings');
  });

  it('reaches the nested withdrawal note, and skips a withdrawal that is null', async () => {
    const { from, to } = await keys();
    const consent: ConsentRecord = {
      id: 'c1', participantId: 'p1', formVersion: 'v2', signedAt: '2026-03-02T09:10:00Z', operatorId: 'op1',
      scopes: { participate: true, publicRelease: true, namedCollaborators: false, recontact: false },
      signatureRef: await encryptText(from, 'scan-0042.pdf'), note: null,
      withdrawal: { at: '2026-05-01T12:00:00Z', scope: 'future_releases', operatorId: 'op1', note: await encryptText(from, 'moved abroad') },
    };
    const after = await reencryptRecord('consents', consent, from, to);
    expect(await decryptText(to, after.withdrawal!.note!)).toBe('moved abroad');
    expect(await decryptText(to, after.signatureRef!)).toBe('scan-0042.pdf');
    const notWithdrawn = await reencryptRecord('consents', { ...consent, withdrawal: null }, from, to);
    expect(notWithdrawn.withdrawal).toBeNull();
  });

  it('re-encrypts notes and operator names, and returns records of tables without personal fields unchanged', async () => {
    const { from, to } = await keys();
    const note = { id: 'n1', sessionId: 'ses1', participantId: 'p1', at: '2026-03-02T09:30:00Z', hostNs: 1e9, operatorId: 'op1', text: await encryptText(from, 'squinted at the beacon') };
    expect(await decryptText(to, (await reencryptRecord('notes', note, from, to)).text)).toBe('squinted at the beacon');
    const operator = { id: 'op1', name: await encryptText(from, 'Sam Shift'), createdAt: '2026-03-01T08:00:00Z' };
    expect(await decryptText(to, (await reencryptRecord('operators', operator, from, to)).name!)).toBe('Sam Shift');
    const study = { id: 's1', name: 'Aisle 7', description: '', createdAt: '2026-03-01T08:00:00Z', demo: true };
    expect(await reencryptRecord('studies', study, from, to)).toEqual(study);
  });

  it('leaves fields already under the new key as they are, so an interrupted change can run again', async () => {
    const { from, to } = await keys();
    const once = await reencryptRecord('participants', await participant(from), from, to);
    expect(await reencryptRecord('participants', once, from, to)).toEqual(once);
  });

  it('throws WrongKeyError for a field under neither key', async () => {
    const { from, to } = await keys();
    const stranger = await dataKeyFromBytes('dk-other', randomBytes(32));
    await expect(reencryptRecord('participants', await participant(stranger), from, to)).rejects.toBeInstanceOf(WrongKeyError);
  });
});
