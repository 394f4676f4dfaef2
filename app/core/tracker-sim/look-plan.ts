import type { DisplayGeometry } from '../geometry/display-geometry';
import type { Xoshiro128 } from '../random/xoshiro128';
import type { Aim, Viewer } from './aim';
import { ClipViewer } from './clip-viewer';
import type { EyeMotionParams } from './eye-motion-params';
import { IdleViewer } from './idle-viewer';
import { checkLookTarget, type LookTarget } from './look-target';

/**
 * What the viewer looks at over time: a sequence of look targets, each from the host time
 * it was set at, queried in time order by the samples. Until the first target it is idle.
 * A target set at host time T applies to the samples taken at T or later that have not been
 * made yet, so it may not be set earlier than the last sample already made.
 */
export class LookPlan {
  private readonly pending: { readonly atS: number; readonly target: LookTarget }[] = [];
  private viewer: Viewer;
  private segment = 0;
  private lastQueryS = -Infinity;

  constructor(
    private readonly g: DisplayGeometry,
    private readonly p: EyeMotionParams,
    private readonly rng: Xoshiro128,
  ) {
    this.viewer = this.viewerFor({ kind: 'idle' });
  }

  set(target: LookTarget, atHostS: number): void {
    checkLookTarget(target);
    if (!Number.isFinite(atHostS)) throw new RangeError(`atHostS must be a finite number, got ${atHostS}`);
    const latest = Math.max(this.lastQueryS, this.pending.at(-1)?.atS ?? -Infinity);
    if (atHostS < latest) throw new RangeError(`atHostS (${atHostS}) must not be earlier than ${latest}, the last sample made or target set`);
    this.pending.push({ atS: atHostS, target });
  }

  aimAt(hostS: number): Aim {
    this.lastQueryS = hostS;
    let next: LookTarget | null = null;
    while (this.pending.length > 0 && this.pending[0]!.atS <= hostS) next = this.pending.shift()!.target;
    if (next) this.viewer = this.viewerFor(next);
    return this.viewer.aimAt(hostS);
  }

  private viewerFor(target: LookTarget): Viewer {
    const prefix = `${this.segment++}:${target.kind}`;
    switch (target.kind) {
      case 'point': {
        const aim: Aim = { key: prefix, x: target.x, y: target.y };
        return { aimAt: () => aim };
      }
      case 'clip':
        return new ClipViewer(target, this.g, this.p, this.rng, prefix);
      case 'idle':
        return new IdleViewer(this.g, this.p, this.rng, prefix);
    }
  }
}
