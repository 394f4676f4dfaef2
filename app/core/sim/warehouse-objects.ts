import type { SensorSize } from '../events/event-batch';
import { beaconShapes } from './beacon';
import { flickeringLightShapes } from './flickering-light';
import { forkliftShapes } from './forklift';
import { firstParcelIndex, parcelsOnBelt, type Conveyor } from './parcels';
import { personShapes } from './person';
import { shuttlePosition, type ShuttleRun } from './shuttle-motion';
import type { Shape } from './soft-shapes';
import type { ObjectKind } from './track-rows';
import { AISLE, DEPTHS, REFERENCE_HEIGHT_PX } from './warehouse-layout';

/** The groups of moving things a clip can show; 'conveyor' is its stream of parcels. */
export type WarehouseObjectGroup = 'forklift' | 'conveyor' | 'beacon' | 'person' | 'flickering-light';
export const WAREHOUSE_OBJECT_GROUPS: readonly WarehouseObjectGroup[] = ['forklift', 'conveyor', 'beacon', 'person', 'flickering-light'];
/** What a clip shows when nobody chooses: everything but the flickering light, which is a flash hazard shown only when asked for. */
export const DEFAULT_OBJECT_GROUPS: readonly WarehouseObjectGroup[] = ['forklift', 'conveyor', 'beacon', 'person'];

/** One moving thing at one instant, with its shapes in sensor pixels. */
export interface SceneObject {
  readonly objectId: number;
  readonly kind: ObjectKind;
  readonly shapes: readonly Shape[];
}

/** Track ids, fixed whichever groups are shown. Parcels count up from PARCEL_ID_BASE in the order they enter. */
export const OBJECT_IDS = { forklifts: [1, 2, 3], person: 4, beacon: 5, flickeringLight: 6 } as const;
export const PARCEL_ID_BASE = 100;

/** The beacon turns 1.5 times a second and so flashes 1.5 times a second, under the three flashes a second of WCAG 2.2, success criterion 2.3.1. */
export const BEACON_ROTATION_HZ = 1.5;

/** The failing tube goes on and off 8 times a second: 8 flashes a second over a large area, well above the three of WCAG 2.2, success criterion 2.3.1. */
export const FLICKER_HZ = 8;

/**
 * The forklifts, far lane to near: each slower the farther it is, shuttling across the
 * whole aisle and turning round partly out of view, so all three are in sight throughout.
 * Positions and speeds are fractions of the sensor width; a leg takes 4 to 9 s, so a 10 s
 * clip shows each forklift cross from side to side at least once. startS puts them in
 * motion at t = 0.
 */
const FORKLIFTS = [
  { depth: DEPTHS.farLane, facing: 1, loaded: false, run: { from: -0.06, to: 1.04, speed: 0.14, rampS: 1, startS: -1 } },
  { depth: DEPTHS.midLane, facing: -1, loaded: true, run: { from: 1.06, to: -0.06, speed: 0.2, rampS: 0.8, startS: -1 } },
  { depth: DEPTHS.nearLane, facing: 1, loaded: false, run: { from: -0.1, to: 1.08, speed: 0.34, rampS: 0.6, startS: -0.5 } },
] as const;

/** The walker: 1.8 steps a second along the walkway, one pass in about 10.6 s. */
const PERSON = { run: { from: 0.12, to: 0.88, speed: 0.075, rampS: 0.5, startS: -0.5 }, gaitCyclesPerS: 0.9 } as const;

/** Parcels every 0.24 sensor widths at 0.1 widths a second: a new one every 2.4 s. */
const BELT = { speed: 0.1, spacing: 0.24 } as const;

function conveyorFor(sensor: SensorSize): Conveyor {
  return {
    widthPx: sensor.width,
    beltTopY: DEPTHS.conveyor.groundV * sensor.height,
    scale: DEPTHS.conveyor.scale * (sensor.height / REFERENCE_HEIGHT_PX),
    speedPxPerS: BELT.speed * sensor.width,
    spacingPx: BELT.spacing * sensor.width,
  };
}

/** Everything that moves at tS, drawn in this order (far to near, then the flickering light's glow over them all). */
export function sceneObjectsAt(sensor: SensorSize, groups: ReadonlySet<WarehouseObjectGroup>, tS: number): SceneObject[] {
  const { width, height } = sensor;
  const unit = height / REFERENCE_HEIGHT_PX;
  const inPx = (run: ShuttleRun): ShuttleRun => ({ ...run, from: run.from * width, to: run.to * width, speed: run.speed * width });
  const objects: SceneObject[] = [];
  if (groups.has('beacon')) {
    objects.push({ objectId: OBJECT_IDS.beacon, kind: 'beacon', shapes: beaconShapes(AISLE.beaconU * width, AISLE.beamV[0] * height, unit, tS, BEACON_ROTATION_HZ) });
  }
  if (groups.has('conveyor')) {
    const conveyor = conveyorFor(sensor);
    const base = PARCEL_ID_BASE - firstParcelIndex(conveyor);
    for (const parcel of parcelsOnBelt(conveyor, tS)) objects.push({ objectId: base + parcel.index, kind: 'parcel', shapes: parcel.shapes });
  }
  if (groups.has('person')) {
    const x = shuttlePosition(inPx(PERSON.run), tS);
    const shapes = personShapes(x, DEPTHS.walkway.groundV * height, DEPTHS.walkway.scale * unit, 2 * Math.PI * PERSON.gaitCyclesPerS * tS);
    objects.push({ objectId: OBJECT_IDS.person, kind: 'person', shapes });
  }
  if (groups.has('forklift')) {
    FORKLIFTS.forEach((f, k) => {
      const x = shuttlePosition(inPx(f.run), tS);
      objects.push({ objectId: OBJECT_IDS.forklifts[k]!, kind: 'forklift', shapes: forkliftShapes(x, f.depth.groundV * height, f.depth.scale * unit, f.facing, f.loaded) });
    });
  }
  if (groups.has('flickering-light')) {
    const shapes = flickeringLightShapes(AISLE.flickeringLightU * width, AISLE.lampV * height, unit, tS, FLICKER_HZ);
    objects.push({ objectId: OBJECT_IDS.flickeringLight, kind: 'flickering-light', shapes });
  }
  return objects;
}
