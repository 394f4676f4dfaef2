import type { SensorSize } from '../events/event-batch';
import { checkSensor } from './check-sensor';
import { drawShape } from './draw-shape';
import { shapeBounds, unionBounds, type Bounds, type Raster, type Shape } from './soft-shapes';
import type { TrackRow } from './track-rows';
import { renderBackground, type WarehouseBackground } from './warehouse-background';
import { BEACON_ROTATION_HZ, DEFAULT_OBJECT_GROUPS, FLICKER_HZ, sceneObjectsAt, WAREHOUSE_OBJECT_GROUPS, type SceneObject, type WarehouseObjectGroup } from './warehouse-objects';

export interface WarehouseSceneOptions {
  /** The groups of moving things to show; all but the flickering light by default. */
  readonly objects?: readonly WarehouseObjectGroup[];
}

/** A pixel region [x0, x1) x [y0, y1) of the sensor. */
export interface PixelRect {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/** A part of the scene that flashes, for a photosensitivity note beside the clip. */
export interface FlashingPart {
  readonly objectId: number;
  readonly kind: 'beacon' | 'flickering-light';
  readonly description: string;
  readonly flashesPerSecond: number;
  /** Where it flashes, sensor pixels (as in the track rows). */
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/**
 * The warehouse aisle as intensity images: a static rack, floor and lighting rendered
 * once, with forklifts, parcels, a walker, a beacon and (when asked for) a flickering light
 * composited over it at any time.
 * Only pixels that some object covers at either of two instants can differ between them
 * (changedRegions), which is what makes a 1 kHz simulation at 640x480 affordable.
 */
export class WarehouseScene {
  private readonly background: WarehouseBackground;
  private readonly groups: ReadonlySet<WarehouseObjectGroup>;
  private cached: { tS: number; objects: SceneObject[]; bounds: Bounds[] } | null = null;

  constructor(
    readonly sensor: SensorSize,
    options: WarehouseSceneOptions = {},
  ) {
    checkSensor(sensor);
    this.groups = checkGroups(options.objects);
    this.background = renderBackground(sensor);
  }

  /** The whole image at tS, row by row into `out` (width * height values). */
  render(tS: number, out: Float32Array): void {
    const { width, height } = this.sensor;
    if (out.length !== width * height) throw new RangeError(`out must hold ${width * height} pixels, got ${out.length}`);
    this.renderRegion(tS, { x0: 0, y0: 0, x1: width, y1: height }, out);
  }

  /** The image at tS inside `rect` only, row by row into `out` ((x1 - x0) * (y1 - y0) values). */
  renderRegion(tS: number, rect: PixelRect, out: Float32Array): void {
    const { width } = this.sensor;
    const { image, illumination } = this.background;
    const raster: Raster = { data: out, x0: rect.x0, y0: rect.y0, width: rect.x1 - rect.x0, height: rect.y1 - rect.y0, light: { level: illumination, sensorWidth: width } };
    // A plain loop rather than set(subarray()) per row: a view per row of every region, every frame, keeps the collector busy.
    for (let y = rect.y0, k = 0; y < rect.y1; y++) {
      for (let j = y * width + rect.x0, end = k + raster.width; k < end; k++, j++) out[k] = image[j]!;
    }
    const { objects, bounds } = this.objectsOf(tS);
    for (let k = 0; k < objects.length; k++) if (overlaps(bounds[k]!, rect)) for (const s of objects[k]!.shapes) drawShape(s, raster);
  }

  /**
   * Regions outside which the images at tPrevS and tS are identical: the cover at both
   * instants of each object that changed (one drawn the same at both, like the flickering
   * light between switchings, changes no pixel that no other object covers).
   */
  changedRegions(tPrevS: number, tS: number): PixelRect[] {
    const byId = ({ objects, bounds }: { objects: SceneObject[]; bounds: Bounds[] }) => new Map(objects.map((o, k) => [o.objectId, { shapes: o.shapes, bounds: bounds[k]! }]));
    const before = byId(this.objectsOf(tPrevS));
    const now = byId(this.objectsOf(tS));
    const rects: PixelRect[] = [];
    for (const id of new Set([...before.keys(), ...now.keys()])) {
      const was = before.get(id);
      const is = now.get(id);
      if (was && is && sameShapes(was.shapes, is.shapes)) continue;
      const a = was?.bounds;
      const b = is?.bounds;
      const rect = this.pixelsWithin(a && b ? unionBounds(a, b) : (a ?? b)!);
      if (rect) rects.push(rect);
    }
    return rects;
  }

  /** One track row for each object at least partly on the sensor at tS. */
  objectsAt(tS: number): TrackRow[] {
    return trackRows(this.sensor, this.objectsOf(tS).objects, tS);
  }

  /** The objects at tS; the last instant asked for is kept, since the simulator asks for each one twice. */
  private objectsOf(tS: number): { objects: SceneObject[]; bounds: Bounds[] } {
    if (!(Number.isFinite(tS) && tS >= 0)) throw new RangeError(`tS must be a finite time >= 0, got ${tS}`);
    if (this.cached?.tS !== tS) {
      const objects = sceneObjectsAt(this.sensor, this.groups, tS);
      this.cached = { tS, objects, bounds: objects.map(objectBounds) };
    }
    return this.cached;
  }

  /** The sensor pixels whose centres lie inside the bounds, or null when none do. */
  private pixelsWithin(b: Bounds): PixelRect | null {
    const x0 = Math.max(0, Math.ceil(b.x0));
    const y0 = Math.max(0, Math.ceil(b.y0));
    const x1 = Math.min(this.sensor.width, Math.floor(b.x1) + 1);
    const y1 = Math.min(this.sensor.height, Math.floor(b.y1) + 1);
    return x0 < x1 && y0 < y1 ? { x0, y0, x1, y1 } : null;
  }
}

const FLASHING = {
  beacon: { description: 'rotating warning beacon', flashesPerSecond: BEACON_ROTATION_HZ },
  'flickering-light': { description: 'failing fluorescent tube lighting the aisle', flashesPerSecond: FLICKER_HZ },
} as const;

/** The scene's flashing parts (the beacon and the flickering light, when shown); they stand still, so their places are those of t = 0. */
export function warehouseFlashingParts(sensor: SensorSize, options: WarehouseSceneOptions = {}): FlashingPart[] {
  checkSensor(sensor);
  const parts: FlashingPart[] = [];
  for (const { objectId, kind, x0, y0, x1, y1 } of trackRows(sensor, sceneObjectsAt(sensor, checkGroups(options.objects), 0), 0)) {
    if (kind === 'beacon' || kind === 'flickering-light') parts.push({ objectId, kind, ...FLASHING[kind], x0, y0, x1, y1 });
  }
  return parts;
}

function checkGroups(groups: readonly WarehouseObjectGroup[] = DEFAULT_OBJECT_GROUPS): ReadonlySet<WarehouseObjectGroup> {
  for (const g of groups) {
    if (!WAREHOUSE_OBJECT_GROUPS.includes(g)) throw new RangeError(`objects must list some of ${WAREHOUSE_OBJECT_GROUPS.join(', ')}, got ${String(g)}`);
  }
  return new Set(groups);
}

function trackRows(sensor: SensorSize, objects: readonly SceneObject[], tS: number): TrackRow[] {
  const { width, height } = sensor;
  const rows: TrackRow[] = [];
  for (const o of objects) {
    const b = objectBounds(o);
    const x0 = Math.max(0, b.x0);
    const y0 = Math.max(0, b.y0);
    const x1 = Math.min(width - 1, b.x1);
    const y1 = Math.min(height - 1, b.y1);
    if (x0 > x1 || y0 > y1) continue;
    rows.push({ tS, objectId: o.objectId, kind: o.kind, cx: (x0 + x1) / 2, cy: (y0 + y1) / 2, x0, y0, x1, y1 });
  }
  return rows;
}

function sameShapes(a: readonly Shape[], b: readonly Shape[]): boolean {
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) {
    const x = a[k]! as Record<string, number | string>;
    const y = b[k]! as Record<string, number | string>;
    for (const key in x) if (x[key] !== y[key]) return false;
  }
  return true;
}

/** Whether any pixel of the rect lies within the bounds. */
const overlaps = (b: Bounds, rect: PixelRect): boolean => b.x1 >= rect.x0 && b.x0 <= rect.x1 - 1 && b.y1 >= rect.y0 && b.y0 <= rect.y1 - 1;

function objectBounds(o: SceneObject): Bounds {
  return o.shapes.map(shapeBounds).reduce(unionBounds);
}
