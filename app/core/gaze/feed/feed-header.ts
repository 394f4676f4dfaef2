import type { GazeHello } from '../gaze-sample';

/** The protocol version this host speaks, the value of a hello's "gazeloom_feed" field. */
export const FEED_PROTOCOL_VERSION = 1;

/**
 * What a hello line tells the receiver: the `GazeHello` every source reports, plus how a
 * TSV sample line is laid out (whether it starts with a sequence number). Pupil columns
 * are present in TSV exactly when the hello declares a pupil unit.
 */
export interface FeedHeader {
  readonly hello: GazeHello;
  readonly tsvSeq: boolean;
}

/** The eyes a sample carries, in wire order (left before right). */
export function eyesOf(hello: GazeHello): readonly ('l' | 'r')[] {
  return hello.eyes === 'both' ? ['l', 'r'] : hello.eyes === 'left' ? ['l'] : ['r'];
}

/** The number of tab-separated fields in one TSV sample line under this header. */
export function tsvFieldCount(header: FeedHeader): number {
  const perEye = header.hello.pupilUnit === null ? 3 : 4;
  return (header.tsvSeq ? 1 : 0) + 1 + eyesOf(header.hello).length * perEye;
}
