import { angleBetween, degToScreenPx, screenPxToDeg, type DisplayGeometry } from '../geometry/display-geometry';
import { screenPoint, type ScreenPoint } from '../geometry/units';
import type { Xoshiro128 } from '../random/xoshiro128';
import type { Aim } from './aim';
import type { EyeMotionParams } from './eye-motion-params';
import { saccadeDurationS } from './main-sequence';
import { minimumJerkFraction } from './minimum-jerk';
import { OrnsteinUhlenbeck } from './ornstein-uhlenbeck';

interface Saccade {
  readonly startS: number;
  readonly durationS: number;
  readonly fromX: number;
  readonly fromY: number;
  readonly toX: number;
  readonly toY: number;
}

/**
 * Where the eye points, stepped from sample to sample. Positions are the eye's horizontal
 * and vertical angles (screenPxToDeg); amplitudes are true angles (angleBetween).
 *
 * - Fixation: the eye rests on an anchor with a slow Ornstein-Uhlenbeck wander around it.
 * - Smooth pursuit: the anchor moves at pursuitGain times the target's velocity, which the
 *   eye follows through a first-order lag of pursuitTimeConstantS.
 * - Saccades: the position follows a minimum-jerk profile over the main-sequence duration
 *   of its amplitude. A new target draws one after the onset latency when it is more than
 *   refixationThresholdDeg away; an error growing past refixationThresholdDeg (still
 *   target) or catchUpThresholdDeg (moving target) draws a corrective or catch-up saccade
 *   after the corrective latency. Each aims where the target will be when it ends, and
 *   lands short by saccadeGain, scattered by saccadeScatter of its amplitude.
 * - Microsaccades: during steady fixation of a still target, at microsaccadeRateHz, to a
 *   spot scattered around it.
 */
export class EyeModel {
  private baseX = 0;
  private baseY = 0;
  private readonly wanderX: OrnsteinUhlenbeck;
  private readonly wanderY: OrnsteinUhlenbeck;
  /** Filtered target velocity (deg/s); the eye's smooth velocity is pursuitGain times it. */
  private targetVx = 0;
  private targetVy = 0;
  private saccade: Saccade | null = null;
  private pending: { readonly atS: number; readonly micro: boolean } | null = null;
  private aimKey: string | null = null;
  /** The target changed and no decision about it has been made yet (none is made during a saccade). */
  private newTarget = false;
  private aimX = 0;
  private aimY = 0;
  private lastS: number | null = null;

  constructor(
    private readonly g: DisplayGeometry,
    private readonly p: EyeMotionParams,
    private readonly rng: Xoshiro128,
  ) {
    const sdPerAxis = p.fixationalSdDeg / Math.SQRT2;
    this.wanderX = new OrnsteinUhlenbeck(sdPerAxis, p.fixationalTimeConstantS, rng);
    this.wanderY = new OrnsteinUhlenbeck(sdPerAxis, p.fixationalTimeConstantS, rng);
  }

  /** The eye's position (screen px it points at) at hostS, the next sample after the last one. */
  step(hostS: number, aim: Aim): ScreenPoint {
    const dt = this.lastS === null ? 0 : hostS - this.lastS;
    this.lastS = hostS;
    const a = screenPxToDeg(this.g, screenPoint(aim.x, aim.y));
    const sameTarget = aim.key === this.aimKey;
    if (!sameTarget) this.newTarget = true;
    const aimVx = sameTarget && dt > 0 ? (a.x - this.aimX) / dt : 0;
    const aimVy = sameTarget && dt > 0 ? (a.y - this.aimY) / dt : 0;
    this.aimKey = aim.key;
    this.aimX = a.x;
    this.aimY = a.y;
    const follow = dt > 0 ? 1 - Math.exp(-dt / this.p.pursuitTimeConstantS) : 0;
    this.targetVx += (aimVx - this.targetVx) * follow;
    this.targetVy += (aimVy - this.targetVy) * follow;

    if (this.saccade) {
      const s = this.saccade;
      const f = minimumJerkFraction((hostS - s.startS) / s.durationS);
      if (f < 1) return this.toScreen(s.fromX + f * (s.toX - s.fromX), s.fromY + f * (s.toY - s.fromY));
      const sinceEndS = hostS - s.startS - s.durationS;
      this.baseX = s.toX + this.p.pursuitGain * this.targetVx * sinceEndS;
      this.baseY = s.toY + this.p.pursuitGain * this.targetVy * sinceEndS;
      this.saccade = null;
    } else {
      this.baseX += this.p.pursuitGain * this.targetVx * dt;
      this.baseY += this.p.pursuitGain * this.targetVy * dt;
      this.wanderX.step(dt);
      this.wanderY.step(dt);
    }
    this.program(hostS, dt);
    if (this.pending && hostS >= this.pending.atS) this.launch(hostS, this.pending.micro);
    return this.toScreen(this.baseX + this.wanderX.value, this.baseY + this.wanderY.value);
  }

  /** Decides whether a saccade is due: to a new target, to correct an error, or a microsaccade. */
  private program(hostS: number, dt: number): void {
    const errorDeg = Math.hypot(this.aimX - this.baseX, this.aimY - this.baseY);
    const moving = Math.hypot(this.targetVx, this.targetVy) >= this.p.pursuitMinSpeedDegPerS;
    if (this.newTarget) {
      this.newTarget = false;
      this.pending = errorDeg > this.p.refixationThresholdDeg ? { atS: hostS + this.latency(this.p.onsetLatencyMeanS, this.p.onsetLatencySdS), micro: false } : null;
    } else if (this.pending === null) {
      if (errorDeg > (moving ? this.p.catchUpThresholdDeg : this.p.refixationThresholdDeg)) {
        this.pending = { atS: hostS + this.latency(this.p.correctiveLatencyMeanS, this.p.correctiveLatencySdS), micro: false };
      } else if (!moving && this.p.microsaccadeRateHz > 0 && this.rng.next() < 1 - Math.exp(-this.p.microsaccadeRateHz * dt)) {
        this.pending = { atS: hostS, micro: true };
      }
    }
  }

  private launch(hostS: number, micro: boolean): void {
    this.pending = null;
    const fromX = this.baseX + this.wanderX.value;
    const fromY = this.baseY + this.wanderY.value;
    let toX: number;
    let toY: number;
    if (micro) {
      const scatter = this.p.microsaccadeScatterDeg / Math.SQRT2;
      toX = this.aimX + scatter * this.rng.nextGaussian();
      toY = this.aimY + scatter * this.rng.nextGaussian();
    } else {
      // Aim where the target will be when the saccade ends (one refinement of the duration).
      const guessS = saccadeDurationS(this.amplitude(fromX, fromY, this.aimX, this.aimY), this.p);
      const aheadX = this.aimX + this.targetVx * guessS;
      const aheadY = this.aimY + this.targetVy * guessS;
      const scatter = this.p.saccadeScatter * this.amplitude(fromX, fromY, aheadX, aheadY);
      toX = fromX + this.p.saccadeGain * (aheadX - fromX) + scatter * this.rng.nextGaussian();
      toY = fromY + this.p.saccadeGain * (aheadY - fromY) + scatter * this.rng.nextGaussian();
    }
    const durationS = saccadeDurationS(this.amplitude(fromX, fromY, toX, toY), this.p);
    this.saccade = { startS: hostS, durationS, fromX, fromY, toX, toY };
    this.baseX = fromX;
    this.baseY = fromY;
    this.wanderX.value = 0;
    this.wanderY.value = 0;
  }

  private latency(meanS: number, sdS: number): number {
    return Math.max(meanS / 2, meanS + sdS * this.rng.nextGaussian());
  }

  private amplitude(x0: number, y0: number, x1: number, y1: number): number {
    return angleBetween(this.g, degToScreenPx(this.g, x0, y0), degToScreenPx(this.g, x1, y1));
  }

  private toScreen(xDeg: number, yDeg: number): ScreenPoint {
    return degToScreenPx(this.g, xDeg, yDeg);
  }
}
