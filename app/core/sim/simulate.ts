import type { EventBatch, SensorSize, TimeResolution } from '../events/event-batch';
import { Xoshiro128 } from '../random/xoshiro128';
import { DvsPixelModel } from './dvs-pixel-model';
import type { DvsParams } from './dvs-params';
import { EventBuffer } from './event-buffer';
import { toLogIntensity } from './log-intensity';
import type { TrackRow } from './track-rows';
import type { WarehouseObjectGroup } from './warehouse-objects';
import { WarehouseScene, warehouseFlashingParts, type FlashingPart } from './warehouse-scene';

export { formatTrackRows, formatTracksTsv, TRACKS_TSV_DECIMALS, TRACKS_TSV_HEADER, type ObjectKind, type TrackRow } from './track-rows';
export type { FlashingPart } from './warehouse-scene';

export interface SimulationOptions {
  readonly scene: 'warehouse';
  /** 640x480 by default. */
  readonly sensor?: SensorSize;
  readonly durationS: number;
  /** Seeds the pixel mismatch, the hot pixels and the noise; the scene itself is the same for every seed. */
  readonly seed: number;
  /** The groups of moving things to show; all but the flickering light by default. */
  readonly objects?: readonly WarehouseObjectGroup[];
  /** Mean ON and OFF threshold, natural-log units (0.2). */
  readonly contrastThreshold?: number;
  readonly thresholdMismatchSigma?: number;
  readonly refractoryUs?: number;
  readonly noiseRateHz?: number;
  readonly hotPixelCount?: number;
  readonly hotPixelRateHz?: number;
  /** The sensor clock tick timestamps are truncated to ('us'). */
  readonly timeResolution?: TimeResolution;
  /** Internal frames per second at which the scene is rendered; event times are interpolated between frames. Its period must be whole microseconds. */
  readonly internalRateHz?: number;
  /** Length of each yielded slice; a whole number of internal frames. */
  readonly sliceS?: number;
}

/** Events with tStartUs <= t < tEndUs in time order, and the track rows of every millisecond in that span (one per object on the sensor). */
export interface SimulationSlice {
  readonly tStartUs: number;
  readonly tEndUs: number;
  readonly events: EventBatch;
  readonly tracks: TrackRow[];
}

export const DEFAULT_SENSOR: SensorSize = { width: 640, height: 480 };
/** 1 kHz: the fastest forklift moves about a third of a pixel per frame, under the one-pixel soft edge. */
export const DEFAULT_INTERNAL_RATE_HZ = 1000;
export const DEFAULT_SLICE_S = 0.01;

/**
 * Simulates an event camera watching the warehouse aisle. The scene is rendered every
 * internal frame, but only inside the regions objects cover (the rest is static), and the
 * pixel model sees only the pixels whose intensity changed. Yields consecutive slices from
 * t = 0 to durationS, ready to be streamed to a file. Options are checked at once.
 */
export function simulateEvents(options: SimulationOptions): Generator<SimulationSlice, void, undefined> {
  if (options.scene !== 'warehouse') throw new RangeError(`scene must be 'warehouse', got ${String(options.scene)}`);
  const sensor = options.sensor ?? DEFAULT_SENSOR;
  const scene = new WarehouseScene(sensor, options.objects ? { objects: options.objects } : {});
  const params: Partial<DvsParams> = {
    contrastThresholdOn: options.contrastThreshold,
    contrastThresholdOff: options.contrastThreshold,
    thresholdMismatchSigma: options.thresholdMismatchSigma,
    refractoryUs: options.refractoryUs,
    noiseRateHz: options.noiseRateHz,
    hotPixelCount: options.hotPixelCount,
    hotPixelRateHz: options.hotPixelRateHz,
    timeResolution: options.timeResolution,
  };
  const model = new DvsPixelModel(sensor, params, new Xoshiro128(options.seed));
  const rate = options.internalRateHz ?? DEFAULT_INTERNAL_RATE_HZ;
  const frameUs = 1e6 / rate;
  if (!(Number.isInteger(frameUs) && frameUs > 0)) throw new RangeError(`internalRateHz must give a frame period of whole microseconds, got ${rate}`);
  const durationUs = wholeFrames(options.durationS, frameUs, 'durationS');
  const sliceUs = wholeFrames(options.sliceS ?? DEFAULT_SLICE_S, frameUs, 'sliceS');
  return run(scene, model, frameUs, sliceUs, durationUs);
}

/** The scene's flashing parts (the beacon, the flickering light), to show beside the clip in the library. */
export function flashingParts(options: Pick<SimulationOptions, 'scene' | 'sensor' | 'objects'>): FlashingPart[] {
  if (options.scene !== 'warehouse') throw new RangeError(`scene must be 'warehouse', got ${String(options.scene)}`);
  return warehouseFlashingParts(options.sensor ?? DEFAULT_SENSOR, options.objects ? { objects: options.objects } : {});
}

function wholeFrames(seconds: number, frameUs: number, name: string): number {
  const us = Math.round(seconds * 1e6);
  if (!(Number.isFinite(seconds) && us > 0 && us % frameUs === 0)) throw new RangeError(`${name} must be a positive whole number of ${frameUs} µs frames, got ${seconds}`);
  return us;
}

function* run(scene: WarehouseScene, model: DvsPixelModel, frameUs: number, sliceUs: number, durationUs: number): Generator<SimulationSlice, void, undefined> {
  const sensor = new SensorState(scene, model);
  const events = new EventBuffer();
  for (let tStartUs = 0; tStartUs < durationUs; tStartUs += sliceUs) {
    const tEndUs = Math.min(durationUs, tStartUs + sliceUs);
    const tracks: TrackRow[] = [];
    for (let ms = Math.ceil(tStartUs / 1000); ms * 1000 < tEndUs; ms++) tracks.push(...scene.objectsAt(ms / 1000));
    for (let tUs = tStartUs + frameUs; tUs <= tEndUs; tUs += frameUs) sensor.advance(tUs - frameUs, tUs, events);
    yield { tStartUs, tEndUs, events: events.take(), tracks };
  }
}

/** What the pixel array last saw, updated one internal frame at a time (kept out of the generator, whose loops optimise poorly). */
class SensorState {
  private readonly intensity: Float32Array;
  private readonly logIntensity: Float32Array;
  private readonly region: Float32Array;
  private readonly changed: Uint32Array;

  constructor(
    private readonly scene: WarehouseScene,
    private readonly model: DvsPixelModel,
  ) {
    const pixels = scene.sensor.width * scene.sensor.height;
    this.intensity = new Float32Array(pixels);
    this.logIntensity = new Float32Array(pixels);
    this.region = new Float32Array(pixels);
    this.changed = new Uint32Array(pixels);
    scene.render(0, this.intensity);
    for (let i = 0; i < pixels; i++) this.logIntensity[i] = toLogIntensity(this.intensity[i]!);
    model.reset(this.logIntensity);
  }

  /** Renders the regions that can have changed, hands the pixels that did change to the model. */
  advance(tPrevUs: number, tUs: number, events: EventBuffer): void {
    const { scene, intensity, logIntensity, region, changed } = this;
    const width = scene.sensor.width;
    let count = 0;
    for (const rect of scene.changedRegions(tPrevUs / 1e6, tUs / 1e6)) {
      const w = rect.x1 - rect.x0;
      scene.renderRegion(tUs / 1e6, rect, region.subarray(0, w * (rect.y1 - rect.y0)));
      for (let y = rect.y0, k = 0; y < rect.y1; y++) {
        for (let i = y * width + rect.x0, end = k + w; k < end; k++, i++) {
          const value = region[k]!;
          if (value === intensity[i]) continue;
          intensity[i] = value;
          logIntensity[i] = toLogIntensity(value);
          changed[count++] = i;
        }
      }
    }
    this.model.step(logIntensity, tPrevUs, tUs, events, changed.subarray(0, count));
  }
}
