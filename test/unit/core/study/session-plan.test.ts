import { describe, expect, it } from 'vitest';
import { seededShuffle } from '../../../../app/core/study/counterbalance';
import type { ProtocolStep } from '../../../../app/core/study/records';
import { planSession, type PlannedStep } from '../../../../app/core/study/session-plan';
import { protocol } from './study-records';

const aisle = ['forklift-crossing', 'conveyor-parcels', 'warning-beacon', 'person-walking'];
const block = (name: string, stimulusIds: string[]): ProtocolStep => ({ kind: 'block', name, stimulusIds });
/** A compact picture of a plan: clip ids, "DC" for drift checks, step kinds otherwise. */
const shape = (steps: PlannedStep[]): string[] => steps.map((s) => (s.kind === 'clip' ? s.stimulusId! : s.kind === 'drift_check' ? 'DC' : s.kind));
const clipsOf = (steps: PlannedStep[]): string[] => steps.filter((s) => s.kind === 'clip').map((s) => s.stimulusId!);

describe('planSession: expansion', () => {
  it('expands every kind of step with its fields and numbers the steps from 0', () => {
    const p = protocol({
      steps: [{ kind: 'calibrate' }, { kind: 'validate' }, block('aisle', aisle.slice(0, 2)), { kind: 'clip', stimulusId: 'aisle-empty' }, { kind: 'drift_check' }, { kind: 'rest', seconds: 30 }, { kind: 'message', text: 'Thank you.' }],
    });
    const { steps, counterbalance } = planSession(p, { enrolment: 3, seed: 9 });
    expect(steps).toEqual([
      { index: 0, kind: 'calibrate', stimulusId: null, seconds: null, text: null, block: null },
      { index: 1, kind: 'validate', stimulusId: null, seconds: null, text: null, block: null },
      { index: 2, kind: 'clip', stimulusId: 'forklift-crossing', seconds: null, text: null, block: 'aisle' },
      { index: 3, kind: 'clip', stimulusId: 'conveyor-parcels', seconds: null, text: null, block: 'aisle' },
      { index: 4, kind: 'clip', stimulusId: 'aisle-empty', seconds: null, text: null, block: null },
      { index: 5, kind: 'drift_check', stimulusId: null, seconds: null, text: null, block: null },
      { index: 6, kind: 'rest', stimulusId: null, seconds: 30, text: null, block: null },
      { index: 7, kind: 'message', stimulusId: null, seconds: null, text: 'Thank you.', block: null },
    ]);
    expect(counterbalance).toEqual({ kind: 'none', seed: null, row: null });
  });

  it('refuses an enrolment below 1 and a seed outside 32 bits', () => {
    const p = protocol();
    expect(() => planSession(p, { enrolment: 0, seed: 1 })).toThrow(/enrolment/);
    expect(() => planSession(p, { enrolment: 1, seed: -1 })).toThrow(/seed/);
    expect(() => planSession(p, { enrolment: 1, seed: 2 ** 32 })).toThrow(RangeError);
  });
});

describe('planSession: counterbalancing', () => {
  it('orders a block by the Williams-square row of the enrolment (Williams 1949) and records the row', () => {
    const p = protocol({ steps: [{ kind: 'calibrate' }, block('aisle', aisle)], counterbalancing: { kind: 'latin-square' } });
    // Rows of the 4-clip square: 0 1 3 2 / 1 2 0 3 / 2 3 1 0 / 3 0 2 1 (Williams 1949).
    const rows = [[0, 1, 3, 2], [1, 2, 0, 3], [2, 3, 1, 0], [3, 0, 2, 1]];
    for (let enrolment = 1; enrolment <= 8; enrolment++) {
      const { steps, counterbalance } = planSession(p, { enrolment, seed: 0 });
      const row = (enrolment - 1) % 4;
      expect(clipsOf(steps)).toEqual(rows[row].map((k) => aisle[k]));
      expect(counterbalance).toEqual({ kind: 'latin-square', seed: null, row });
    }
  });

  it('gives each block its own row of its own size; the first block’s row is recorded', () => {
    const odd = ['parcel-jam', 'beacon-close', 'forklift-reverse'];
    const p = protocol({ steps: [block('aisle', aisle), block('conveyor', odd)], counterbalancing: { kind: 'latin-square' } });
    const { steps, counterbalance } = planSession(p, { enrolment: 5, seed: 0 });
    // Enrolment 5: row 0 of the 4-clip square; row 4 of the 3-clip design, the mirror of row 1 (1 2 0).
    expect(clipsOf(steps)).toEqual([...aisle.slice(0, 2), aisle[3], aisle[2], odd[0], odd[2], odd[1]]);
    expect(counterbalance.row).toBe(0);
  });

  it('shuffles blocks from one xoshiro128** stream seeded per session (Durstenfeld 1964) and records the seed', () => {
    const eight = [...aisle, 'parcel-jam', 'beacon-close', 'forklift-reverse', 'aisle-empty'];
    const p = protocol({ steps: [block('first', eight), block('second', eight)], counterbalancing: { kind: 'seeded-shuffle', generator: 'xoshiro128**' } });
    const a = planSession(p, { enrolment: 1, seed: 77 });
    expect(a.counterbalance).toEqual({ kind: 'seeded-shuffle', seed: 77, row: null });
    const clips = clipsOf(a.steps);
    expect(clips.slice(0, 8)).toEqual(seededShuffle(eight, 77));
    // The second block continues the stream, so it is not a copy of the first block's order.
    expect(clips.slice(8)).not.toEqual(clips.slice(0, 8));
    expect([...clips.slice(8)].sort()).toEqual([...eight].sort());
    expect(planSession(p, { enrolment: 2, seed: 77 }).steps).toEqual(a.steps);
    expect(clipsOf(planSession(p, { enrolment: 1, seed: 78 }).steps)).not.toEqual(clips);
  });
});

describe('planSession: drift check every N clips', () => {
  const plan = (steps: ProtocolStep[], every: number | null) => shape(planSession(protocol({ steps, driftCheckEvery: every }), { enrolment: 1, seed: 1 }).steps);
  const ids = (prefix: string, n: number) => Array.from({ length: n }, (_, k) => `${prefix}${k + 1}`);

  it('puts a drift check after every N-th clip of a block, counting each block from its start', () => {
    expect(plan([block('a', ids('a', 5)), { kind: 'validate' }], 2)).toEqual(['a1', 'a2', 'DC', 'a3', 'a4', 'DC', 'a5', 'validate']);
    expect(plan([block('a', ids('a', 3)), block('b', ids('b', 3))], 2)).toEqual(['a1', 'a2', 'DC', 'a3', 'b1', 'b2', 'DC', 'b3']);
    expect(plan([block('a', ids('a', 2)), block('b', ids('b', 2))], 2)).toEqual(['a1', 'a2', 'DC', 'b1', 'b2']);
    expect(plan([block('a', ids('a', 3)), block('b', ids('b', 1))], 1)).toEqual(['a1', 'DC', 'a2', 'DC', 'a3', 'DC', 'b1']);
  });

  it('adds none where the next step measures gaze anyway or no clip follows', () => {
    expect(plan([block('a', ids('a', 4)), { kind: 'validate' }, block('b', ids('b', 1))], 2)).toEqual(['a1', 'a2', 'DC', 'a3', 'a4', 'validate', 'b1']);
    expect(plan([block('a', ids('a', 2)), { kind: 'drift_check' }, block('b', ids('b', 1))], 2)).toEqual(['a1', 'a2', 'DC', 'b1']);
    expect(plan([block('a', ids('a', 2)), { kind: 'calibrate' }, block('b', ids('b', 1))], 2)).toEqual(['a1', 'a2', 'calibrate', 'b1']);
    expect(plan([block('a', ids('a', 4)), { kind: 'rest', seconds: 10 }, { kind: 'message', text: 'Done.' }], 2)).toEqual(['a1', 'a2', 'DC', 'a3', 'a4', 'rest', 'message']);
    // A rest is not a measurement: the drift check comes before it when a clip follows.
    expect(plan([block('a', ids('a', 2)), { kind: 'rest', seconds: 10 }, block('b', ids('b', 1))], 2)).toEqual(['a1', 'a2', 'DC', 'rest', 'b1']);
  });

  it('counts only clips of blocks, and adds nothing without driftCheckEvery', () => {
    const single = (id: string): ProtocolStep => ({ kind: 'clip', stimulusId: id });
    expect(plan([single('c1'), single('c2'), single('c3')], 1)).toEqual(['c1', 'c2', 'c3']);
    expect(plan([block('a', ids('a', 4)), { kind: 'validate' }], null)).toEqual(['a1', 'a2', 'a3', 'a4', 'validate']);
  });

  it('names the block of an inserted drift check and keeps the numbering continuous', () => {
    const { steps } = planSession(protocol({ steps: [block('aisle', aisle)], driftCheckEvery: 2 }), { enrolment: 1, seed: 1 });
    expect(steps[2]).toEqual({ index: 2, kind: 'drift_check', stimulusId: null, seconds: null, text: null, block: 'aisle' });
    expect(steps.map((s) => s.index)).toEqual([0, 1, 2, 3, 4]);
  });
});
