import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import type { GazeloomApi } from '../../../../app/contract';
import { latinSquareRow } from '../../../../app/core/study/counterbalance';
import type { RecordOf } from '../../../../app/core/study/records';
import { LabDatabase } from '../../../../renderer/db/lab-database';
import { LabStore } from '../../../../renderer/db/lab-store';
import { newProtocol } from '../../../../renderer/console/protocols/protocol-draft';
import { findResumable } from '../../../../renderer/console/session/session-resume';

const at = '2026-03-02T10:00:00.000Z';
const audit = { operatorId: null, action: 'test', summary: 'test records' };
const participant: RecordOf<'participants'> = {
  id: 'p1',
  studyId: 'study-aisle',
  code: 'K7M4XR9',
  enrolment: 2,
  createdAt: at,
  name: null,
  contact: null,
  birthDate: null,
  notes: null,
  demographics: { age: 30, sex: 'not_given', handedness: 'right', visionCorrection: 'none' },
  eligibility: { photosensitivityCleared: true, normalOrCorrectedVision: true, noNeurologicalCondition: true, checkedAt: at },
};
const clips = ['forklift', 'conveyor', 'beacon'];
/** The first clip of enrolment 2's Latin-square row. */
const firstClip = clips[latinSquareRow(3, 2).order[0]!]!;
const protocol: RecordOf<'protocols'> = { ...newProtocol('study-aisle', 'protocol-aisle', at), steps: [{ kind: 'calibrate' }, { kind: 'validate' }, { kind: 'block', name: 'Aisle', stimulusIds: clips }] };
const session = (id: string, state: RecordOf<'sessions'>['state']): RecordOf<'sessions'> => ({
  id,
  studyId: 'study-aisle',
  participantId: 'p1',
  protocolId: 'protocol-aisle',
  protocolVersion: 1,
  operatorId: 'op-1',
  startedAt: at,
  endedAt: null,
  state,
  counterbalance: { kind: 'latin-square', seed: null, row: 1 },
  display: { widthMm: 530, heightMm: 298, widthPx: 1920, heightPx: 1080, distanceMm: 600 },
  gazeSource: 'simulated tracker',
  demo: false,
});
const trial = (sessionId: string, index: number, kind: RecordOf<'trials'>['kind'], state: RecordOf<'trials'>['state'], stimulusId: string | null = null): RecordOf<'trials'> => ({
  id: `${sessionId}-trial-${index}`,
  sessionId,
  index,
  kind,
  stimulusId,
  state,
  startedHostNs: 1000 + index,
  endedHostNs: state === 'pending' ? null : 2000 + index,
  badReason: null,
});

/** The host as the console sees it: recording "attached" now, "recovered" resumable, "lost" not. */
const api = {
  getLiveStatus: async () => ({ ok: true, value: { recording: { sessionId: 'attached', dir: '/r/attached', samples: 1, frames: 0 } } }),
  listRecoveredSessions: async () => ({
    ok: true,
    value: { sessions: [{ sessionId: 'recovered', resumable: true }, { sessionId: 'lost', resumable: false }] },
  }),
} as unknown as GazeloomApi;

describe('sessions left running', () => {
  it('are offered for resumption at the next unfinished trial, as the host can carry them on', async () => {
    const store = new LabStore(new LabDatabase('resume-test', { indexedDB: new IDBFactory(), IDBKeyRange }));
    await store.putMany(
      [
        { table: 'participants', record: participant },
        { table: 'protocols', record: protocol },
        ...['attached', 'recovered', 'lost', 'mismatched'].map((id) => ({ table: 'sessions' as const, record: session(id, 'running') })),
        { table: 'sessions', record: session('finished', 'completed') },
        { table: 'trials', record: trial('recovered', 0, 'calibrate', 'done') },
        { table: 'trials', record: trial('recovered', 1, 'validate', 'done') },
        { table: 'trials', record: trial('recovered', 2, 'clip', 'pending', firstClip) },
        { table: 'trials', record: trial('mismatched', 0, 'clip', 'done', firstClip) },
      ],
      audit,
    );
    const offers = Object.fromEntries((await findResumable(api, store, 'study-aisle')).map((o) => [o.session.id, o]));
    expect(Object.keys(offers).sort()).toEqual(['attached', 'lost', 'mismatched', 'recovered']);
    expect(offers.attached!.how).toBe('attached');
    expect(offers.lost!.how).toBe('lost');
    // The recovered session's third step is the first clip of its Latin-square row; a drift check follows the block's second clip.
    const recovered = offers.recovered!;
    expect(recovered.how).toBe('recovered');
    expect(recovered.runner!.cursor).toBe(2);
    expect(recovered.runner!.steps[2]).toMatchObject({ kind: 'clip', stimulusId: firstClip, state: 'pending' });
    expect(recovered.runner!.steps.map((s) => `${s.kind}:${s.state}`)).toEqual(['calibrate:done', 'validate:done', 'clip:pending', 'clip:pending', 'drift_check:pending', 'clip:pending']);
    // Trials that do not fit the plan are reported, not resumed.
    expect(offers.mismatched).toMatchObject({ how: 'lost', runner: null });
    expect(offers.mismatched!.problem).toMatch(/does not belong to this session/);
  });
});
