import { OFF, ON, type SensorSize } from '../events/event-batch';
import type { Xoshiro128 } from '../random/xoshiro128';
import { checkSensor } from './check-sensor';
import { MIN_CONTRAST_THRESHOLD, resolveDvsParams, type DvsParams } from './dvs-params';
import type { EventBuffer } from './event-buffer';
import { IntervalEvents } from './interval-events';

/**
 * A streaming event-camera pixel array (Lichtsteiner, Posch and Delbruck 2008; Gallego et
 * al. 2020, eq. 1). Each pixel keeps a reference log intensity; whenever the log intensity
 * has moved by the pixel's threshold C from it, the pixel fires an event of that sign and
 * the reference moves by exactly C, so one interval can hold several crossings. Between
 * two frames the log intensity is taken as linear in time, which places each crossing at
 * an interpolated timestamp. Crossings inside the refractory window after the pixel's last
 * emitted event are dropped, but the reference still moves. Background activity and hot
 * pixels are added as independent Poisson processes and do not touch the reference.
 */
export class DvsPixelModel {
  readonly params: DvsParams;
  /** The per-pixel ON and OFF thresholds after mismatch. */
  readonly thresholdsOn: Float64Array;
  readonly thresholdsOff: Float64Array;
  /** Indices (y * width + x) of the hot pixels, ascending. */
  readonly hotPixels: Uint32Array;
  private readonly pixelCount: number;
  private readonly reference: Float64Array;
  private readonly previous: Float64Array;
  private readonly lastEventUs: Float64Array;
  private readonly pending: IntervalEvents;
  private ready = false;

  constructor(
    readonly sensor: SensorSize,
    params: Partial<DvsParams>,
    private readonly rng: Xoshiro128,
  ) {
    checkSensor(sensor);
    this.pixelCount = sensor.width * sensor.height;
    this.params = resolveDvsParams(params, this.pixelCount);
    const { contrastThresholdOn, contrastThresholdOff, thresholdMismatchSigma } = this.params;
    this.thresholdsOn = new Float64Array(this.pixelCount);
    this.thresholdsOff = new Float64Array(this.pixelCount);
    for (let i = 0; i < this.pixelCount; i++) {
      this.thresholdsOn[i] = Math.max(MIN_CONTRAST_THRESHOLD, contrastThresholdOn + thresholdMismatchSigma * rng.nextGaussian());
      this.thresholdsOff[i] = Math.max(MIN_CONTRAST_THRESHOLD, contrastThresholdOff + thresholdMismatchSigma * rng.nextGaussian());
    }
    this.hotPixels = pickDistinct(rng, this.params.hotPixelCount, this.pixelCount);
    this.reference = new Float64Array(this.pixelCount);
    this.previous = new Float64Array(this.pixelCount);
    this.lastEventUs = new Float64Array(this.pixelCount);
    this.pending = new IntervalEvents(sensor.width, this.pixelCount, this.params.timeResolution);
  }

  /** Starts every pixel at rest: its reference is the given log intensity and it has never fired. */
  reset(initialLogIntensity: Float32Array | Float64Array): void {
    this.checkFrame(initialLogIntensity, 'initialLogIntensity');
    this.reference.set(initialLogIntensity);
    this.previous.set(initialLogIntensity);
    this.lastEventUs.fill(-Infinity);
    this.ready = true;
  }

  /**
   * Advances from the frame at tPrevUs (the last one given) to `logIntensity` at tNowUs and
   * appends the interval's events to `out` in time order (ties by pixel index, then OFF
   * before ON); returns how many. `changedPixels`, when given, lists every pixel whose log
   * intensity may differ from the last frame: the others are promised unchanged and are
   * not visited (a pixel listed twice is harmless).
   */
  step(logIntensity: Float32Array | Float64Array, tPrevUs: number, tNowUs: number, out: EventBuffer, changedPixels?: Uint32Array): number {
    if (!this.ready) throw new Error('DvsPixelModel.step called before reset');
    this.checkFrame(logIntensity, 'logIntensity');
    if (!(Number.isFinite(tPrevUs) && Number.isFinite(tNowUs) && tNowUs > tPrevUs)) {
      throw new RangeError(`tNowUs must be finite and after tPrevUs, got tPrevUs=${tPrevUs}, tNowUs=${tNowUs}`);
    }
    this.pending.begin(tPrevUs, tNowUs);
    const spanUs = tNowUs - tPrevUs;
    if (changedPixels) {
      for (let k = 0; k < changedPixels.length; k++) {
        const i = changedPixels[k]!;
        this.cross(i, logIntensity[i]!, tPrevUs, spanUs);
      }
    } else {
      for (let i = 0; i < this.pixelCount; i++) this.cross(i, logIntensity[i]!, tPrevUs, spanUs);
    }
    this.addNoise(tPrevUs, tNowUs);
    return this.pending.flush(out);
  }

  /** The crossings of one pixel, as in the reference model: reference += C per event. */
  private cross(i: number, lNow: number, tPrevUs: number, spanUs: number): void {
    const lPrev = this.previous[i]!;
    this.previous[i] = lNow;
    let reference = this.reference[i]!;
    const cOn = this.thresholdsOn[i]!;
    const cOff = this.thresholdsOff[i]!;
    let d = lNow - reference;
    if (d < cOn && d > -cOff) return;
    const slope = lNow - lPrev;
    const refractoryUs = this.params.refractoryUs;
    let last = this.lastEventUs[i]!;
    for (;;) {
      let target: number;
      let polarity: number;
      if (d >= cOn) {
        target = reference + cOn;
        polarity = ON;
      } else if (d <= -cOff) {
        target = reference - cOff;
        polarity = OFF;
      } else break;
      const tc = slope !== 0 ? Math.max(tPrevUs, tPrevUs + ((target - lPrev) / slope) * spanUs) : tPrevUs + spanUs;
      if (tc - last >= refractoryUs) {
        this.pending.add(tc, i, polarity);
        last = tc;
      }
      reference = target;
      d = lNow - reference;
    }
    this.reference[i] = reference;
    this.lastEventUs[i] = last;
  }

  /** Poisson arrivals by exponential gaps; restarting at tPrevUs each interval is exact because the process is memoryless. */
  private addNoise(tPrevUs: number, tNowUs: number): void {
    const noisePerUs = (this.params.noiseRateHz * this.pixelCount) / 1e6;
    if (noisePerUs > 0) {
      for (let t = tPrevUs + this.rng.nextExponential(noisePerUs); t <= tNowUs; t += this.rng.nextExponential(noisePerUs)) {
        this.pending.add(t, this.rng.nextInt(this.pixelCount), this.rng.nextInt(2));
      }
    }
    const hotPerUs = (this.params.hotPixelRateHz * this.hotPixels.length) / 1e6;
    if (hotPerUs > 0) {
      for (let t = tPrevUs + this.rng.nextExponential(hotPerUs); t <= tNowUs; t += this.rng.nextExponential(hotPerUs)) {
        this.pending.add(t, this.hotPixels[this.rng.nextInt(this.hotPixels.length)]!, ON);
      }
    }
  }

  private checkFrame(frame: Float32Array | Float64Array, name: string): void {
    if (frame.length !== this.pixelCount) throw new RangeError(`${name} must hold ${this.pixelCount} pixels (${this.sensor.width}x${this.sensor.height}), got ${frame.length}`);
  }
}

function pickDistinct(rng: Xoshiro128, count: number, n: number): Uint32Array {
  const chosen = new Set<number>();
  while (chosen.size < count) chosen.add(rng.nextInt(n));
  return Uint32Array.from(chosen).sort();
}
