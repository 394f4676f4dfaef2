import { Xoshiro128 } from '../random/xoshiro128';
import { latinSquareRow, shuffleInPlace } from './counterbalance';
import type { ProtocolRecord, ProtocolStep, SessionRecord } from './records';

/** One step of a session's expanded plan; `index` is its trial's index. */
export interface PlannedStep {
  index: number;
  kind: 'calibrate' | 'validate' | 'drift_check' | 'clip' | 'rest' | 'message';
  stimulusId: string | null;
  seconds: number | null;
  text: string | null;
  /** The protocol block a clip (or a drift check inserted among its clips) belongs to. */
  block: string | null;
}

type Draft = Omit<PlannedStep, 'index'>;

const step = (kind: Draft['kind'], fields: Partial<Draft> = {}): Draft => ({ kind, stimulusId: null, seconds: null, text: null, block: null, ...fields });

/** Steps after which a drift check would add nothing: the eye is measured there anyway. */
const measuresGaze = (kind: Draft['kind']): boolean => kind === 'drift_check' || kind === 'validate' || kind === 'calibrate';

/**
 * Expands a protocol into the steps of one session.
 *
 * Blocks are put in counterbalanced order: 'latin-square' takes the Williams-square row of
 * the participant's enrolment number (each block uses row (enrolment − 1) mod its own row
 * count; the first block's row is recorded); 'seeded-shuffle' shuffles the blocks, in
 * protocol order, from one xoshiro128** stream seeded with `seed` (recorded); 'none' keeps
 * the protocol's order. With `driftCheckEvery` N, a drift check follows every N-th clip of a
 * block, unless the next step already measures gaze or no clip comes after it.
 */
export function planSession(protocol: ProtocolRecord, opts: { enrolment: number; seed: number }): { steps: PlannedStep[]; counterbalance: SessionRecord['counterbalance'] } {
  const { enrolment, seed } = opts;
  if (!Number.isInteger(enrolment) || enrolment < 1) throw new RangeError(`enrolment must be an integer from 1, got ${enrolment}`);
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw new RangeError(`seed must be an integer in 0..2^32-1, got ${seed}`);
  const cb = protocol.counterbalancing;
  const random = cb.kind === 'seeded-shuffle' ? new Xoshiro128(seed) : null;
  let firstRow: number | null = null;

  const orderBlock = (ids: readonly string[]): string[] => {
    if (cb.kind === 'latin-square') {
      const { row, order } = latinSquareRow(ids.length, enrolment);
      firstRow ??= row;
      return order.map((k) => ids[k]);
    }
    return random ? shuffleInPlace([...ids], random) : [...ids];
  };

  // Each protocol step becomes a group of drafts; drift checks are placed once the groups are known.
  const groups: { drafts: Draft[]; block: boolean }[] = protocol.steps.map((s: ProtocolStep) => {
    switch (s.kind) {
      case 'block':
        return { drafts: orderBlock(s.stimulusIds).map((id) => step('clip', { stimulusId: id, block: s.name })), block: true };
      case 'clip':
        return { drafts: [step('clip', { stimulusId: s.stimulusId })], block: false };
      case 'rest':
        return { drafts: [step('rest', { seconds: s.seconds })], block: false };
      case 'message':
        return { drafts: [step('message', { text: s.text })], block: false };
      default:
        return { drafts: [step(s.kind)], block: false };
    }
  });

  const flat = groups.flatMap((g) => g.drafts.map((draft, k) => ({ draft, blockPosition: g.block ? k + 1 : null })));
  const lastClip = flat.map((f) => f.draft.kind).lastIndexOf('clip');
  const every = protocol.driftCheckEvery;
  const drafts: Draft[] = [];
  flat.forEach(({ draft, blockPosition }, i) => {
    drafts.push(draft);
    const due = every !== null && blockPosition !== null && blockPosition % every === 0;
    const next = flat[i + 1]?.draft;
    if (due && i < lastClip && !(next && measuresGaze(next.kind))) drafts.push(step('drift_check', { block: draft.block }));
  });

  const counterbalance: SessionRecord['counterbalance'] = {
    kind: cb.kind,
    seed: cb.kind === 'seeded-shuffle' ? seed : null,
    row: cb.kind === 'latin-square' ? firstRow : null,
  };
  return { steps: drafts.map((d, index) => ({ index, ...d })), counterbalance };
}
