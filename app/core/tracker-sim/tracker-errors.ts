import type { DisplayGeometry } from '../geometry/display-geometry';
import type { ScreenPoint } from '../geometry/units';
import type { Xoshiro128 } from '../random/xoshiro128';
import { offsetByAngle } from './angular-offset';

export interface TrackerErrorLevels {
  /** RMS angular distance of the reported gaze from the true gaze (both axes together): Gaussian, σ = noiseDeg/√2 per axis. */
  readonly noiseDeg: number;
  readonly driftDegPerMin: number;
  readonly accuracyOffsetDeg: number;
}

/**
 * What the tracker gets wrong, in degrees of visual angle turned exactly at the gaze
 * position (offsetByAngle), so the pixel size of each error follows from the geometry:
 *  - a constant accuracy offset of accuracyOffsetDeg, in a direction fixed by the seed;
 *  - a drift growing at driftDegPerMin from the first sample, in another fixed direction;
 *  - white measurement noise, drawn per axis and per eye.
 */
export class TrackerErrors {
  private readonly accuracy: { readonly x: number; readonly y: number };
  private readonly drift: { readonly x: number; readonly y: number };
  private readonly noisePerAxisDeg: number;

  constructor(
    private readonly g: DisplayGeometry,
    levels: TrackerErrorLevels,
    directions: Xoshiro128,
    private readonly noise: Xoshiro128,
    private readonly startS: number,
  ) {
    const towards = (size: number) => {
      const angle = 2 * Math.PI * directions.next();
      return { x: size * Math.cos(angle), y: size * Math.sin(angle) };
    };
    this.accuracy = towards(levels.accuracyOffsetDeg);
    this.drift = towards(levels.driftDegPerMin / 60);
    this.noisePerAxisDeg = levels.noiseDeg / Math.SQRT2;
  }

  /** The true gaze with the accuracy offset and the drift accumulated by hostS. */
  biased(trueGaze: ScreenPoint, hostS: number): ScreenPoint {
    const elapsedS = hostS - this.startS;
    return offsetByAngle(this.g, trueGaze, this.accuracy.x + this.drift.x * elapsedS, this.accuracy.y + this.drift.y * elapsedS);
  }

  /** One eye's reading of a biased gaze point: new noise on every call. */
  measured(biased: ScreenPoint): ScreenPoint {
    return offsetByAngle(this.g, biased, this.noisePerAxisDeg * this.noise.nextGaussian(), this.noisePerAxisDeg * this.noise.nextGaussian());
  }
}
