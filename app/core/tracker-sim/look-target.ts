import type { Placement } from '../geometry/placement';
import type { TrackTable } from './track-table';

/**
 * What the simulated participant is looking at from a given host time on:
 *   point  a calibration, validation or drift-check target at a screen position (px);
 *   clip   a playing clip's tracked objects; stimulus time = (host time − clipStartHostS)·speed,
 *          sensor pixels placed on screen by `placement`;
 *   idle   nothing in particular: fixations around the screen centre.
 */
export type LookTarget =
  | { readonly kind: 'point'; readonly x: number; readonly y: number }
  | { readonly kind: 'clip'; readonly tracks: TrackTable; readonly placement: Placement; readonly clipStartHostS: number; readonly speed: number }
  | { readonly kind: 'idle' };

export type ClipLook = Extract<LookTarget, { kind: 'clip' }>;

/** The target, checked; a bad field throws a RangeError naming `target.<field>`. */
export function checkLookTarget(target: LookTarget): LookTarget {
  const finite = (name: string, v: number) => {
    if (!Number.isFinite(v)) throw new RangeError(`target.${name} must be a finite number, got ${v}`);
  };
  switch (target.kind) {
    case 'point':
      finite('x', target.x);
      finite('y', target.y);
      return target;
    case 'clip':
      finite('clipStartHostS', target.clipStartHostS);
      if (!(Number.isFinite(target.speed) && target.speed > 0)) throw new RangeError(`target.speed must be a finite number > 0, got ${target.speed}`);
      return target;
    case 'idle':
      return target;
    default:
      throw new RangeError(`target.kind must be 'point', 'clip' or 'idle', got ${String((target as { kind: unknown }).kind)}`);
  }
}
