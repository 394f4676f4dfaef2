import { degToScreenPx, type DisplayGeometry } from '../geometry/display-geometry';
import type { Xoshiro128 } from '../random/xoshiro128';
import type { Aim, Viewer } from './aim';
import { drawDwellS } from './dwell-time';
import type { EyeMotionParams } from './eye-motion-params';

/**
 * Looking at nothing in particular: one spot after another around the screen centre (the
 * straight-ahead direction), each idleSpreadDeg SD per axis away from it, held for a dwell.
 */
export class IdleViewer implements Viewer {
  private aim: Aim | null = null;
  private untilS = -Infinity;
  private count = 0;

  constructor(
    private readonly g: DisplayGeometry,
    private readonly p: EyeMotionParams,
    private readonly rng: Xoshiro128,
    private readonly keyPrefix: string,
  ) {}

  aimAt(hostS: number): Aim {
    if (this.aim === null || hostS >= this.untilS) {
      const spot = degToScreenPx(this.g, this.p.idleSpreadDeg * this.rng.nextGaussian(), this.p.idleSpreadDeg * this.rng.nextGaussian());
      this.aim = { key: `${this.keyPrefix}:${this.count++}`, x: spot.x, y: spot.y };
      this.untilS = hostS + drawDwellS(this.p, this.rng);
    }
    return this.aim;
  }
}
