import type { SensorSize } from '../events/event-batch';
import { Xoshiro128 } from '../random/xoshiro128';
import { drawShape } from './draw-shape';
import type { Raster, Shape } from './soft-shapes';
import { AISLE } from './warehouse-layout';

/** The rack, boxes, floor and lights never change between seeds: the picture is part of the scene. */
const LAYOUT_SEED = 0x5a11e;

/** The static part of the scene, kept so that moving things can be composited over it. */
export interface WarehouseBackground {
  /** Intensity of the static scene, row by row. */
  readonly image: Float32Array;
  /** The light level at each pixel, which scales whatever is drawn there. */
  readonly illumination: Float32Array;
}

export function renderBackground(sensor: SensorSize): WarehouseBackground {
  const { width, height } = sensor;
  const raster: Raster = { data: new Float32Array(width * height), x0: 0, y0: 0, width, height, light: null };
  const rng = new Xoshiro128(LAYOUT_SEED);
  for (const shape of staticShapes(width, height, rng)) drawShape(shape, raster);
  const image = raster.data;
  const illumination = new Float32Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      illumination[i] = lighting(x / width, y / height);
      image[i] = image[i]! * (1 + 0.03 * (rng.next() * 2 - 1)) * illumination[i]!;
    }
  }
  return { image, illumination };
}

/** Pools of light under the ceiling lamps over a dimmer ambient level, darker towards the corners (u, v: fractions of the sensor's sides). */
function lighting(u: number, v: number): number {
  let pools = 0;
  for (const lu of AISLE.lampU) pools += Math.exp(-((u - lu) ** 2) / (2 * 0.12 ** 2));
  const vignette = 0.25 * ((u - 0.5) ** 2 + (v - 0.5) ** 2);
  return Math.max(0.3, 0.55 + 0.4 * pools * (0.75 + 0.25 * v) - vignette);
}

function staticShapes(width: number, height: number, rng: Xoshiro128): Shape[] {
  const box = boxInFractions(width, height);
  const shapes: Shape[] = [
    box(-0.01, -0.01, 1.01, AISLE.floorV, 62), // back wall
    box(-0.01, -0.01, 1.01, AISLE.ceilingBottomV, 34),
    ...AISLE.lampU.map((u) => box(u - 0.06, AISLE.lampV - 0.008, u + 0.06, AISLE.lampV + 0.008, 255)),
  ];
  for (let level = 1; level < AISLE.beamV.length; level++) shapes.push(...shelfBoxes(AISLE.beamV[level]!, AISLE.beamV[level - 1]!, rng, box));
  for (const u of AISLE.uprightU) shapes.push(box(u - AISLE.uprightHalfWidthU, AISLE.beamV[0] - 0.01, u + AISLE.uprightHalfWidthU, AISLE.floorV, 95));
  for (const v of AISLE.beamV) shapes.push(box(-0.01, v, 1.01, v + 2 * AISLE.beamHalfHeightV, 175));
  shapes.push(box(-0.01, AISLE.floorV, 1.01, 1.01, 128));
  for (const v of AISLE.walkwayLineV) shapes.push(box(-0.01, v, 1.01, v + 0.006, 205));
  for (let u = 0.05; u < 1; u += 0.1) shapes.push(box(u - 0.004, AISLE.railBottomV, u + 0.004, AISLE.conveyorLegBottomV, 70));
  shapes.push(box(-0.01, AISLE.beltTopV, 1.01, AISLE.beltBottomV, 38), box(-0.01, AISLE.beltBottomV, 1.01, AISLE.railBottomV, 105));
  return shapes;
}

/** Cartons standing on one beam, filling each bay between uprights with gaps of their own. */
function shelfBoxes(beamV: number, beamAboveV: number, rng: Xoshiro128, box: BoxInFractions): Shape[] {
  const shapes: Shape[] = [];
  const maxHeight = beamV - beamAboveV - 2 * AISLE.beamHalfHeightV - 0.012;
  for (let bay = 0; bay + 1 < AISLE.uprightU.length; bay++) {
    let u = AISLE.uprightU[bay]! + AISLE.uprightHalfWidthU + 0.006;
    const end = AISLE.uprightU[bay + 1]! - AISLE.uprightHalfWidthU - 0.006;
    for (let w = 0.03 + 0.04 * rng.next(); u + w <= end; w = 0.03 + 0.04 * rng.next()) {
      const h = maxHeight * (0.45 + 0.55 * rng.next());
      const value = 110 + 80 * rng.next();
      shapes.push(box(u, beamV - h, u + w, beamV, value), box(u + w * 0.44, beamV - h, u + w * 0.56, beamV, value - 35));
      if (rng.next() < 0.5) shapes.push(box(u + w * 0.12, beamV - h * 0.55, u + w * 0.36, beamV - h * 0.3, 225));
      u += w + 0.004 + 0.012 * rng.next();
    }
  }
  return shapes;
}

type BoxInFractions = (u0: number, v0: number, u1: number, v1: number, value: number) => Shape;

/** A sharp-cornered box given by its corners as fractions of the sensor's sides. */
function boxInFractions(width: number, height: number): BoxInFractions {
  return (u0, v0, u1, v1, value) => ({
    kind: 'box', cx: ((u0 + u1) / 2) * width, cy: ((v0 + v1) / 2) * height, hx: ((u1 - u0) / 2) * width, hy: ((v1 - v0) / 2) * height, radius: 0, value,
  });
}
