import { Xoshiro128 } from '../random/xoshiro128';
import { placeShape, type Shape } from './soft-shapes';

/** Cartons carried right to left along a belt that runs across the whole sensor. */
export interface Conveyor {
  /** Sensor width; parcels enter past the right edge and leave past the left. */
  readonly widthPx: number;
  readonly beltTopY: number;
  readonly scale: number;
  readonly speedPxPerS: number;
  /** Distance between the centres of successive parcels. */
  readonly spacingPx: number;
}

/** Parcel n is the n-th to enter; parcel 0 is the first one wholly off the sensor's right edge at t = 0. */
export interface Parcel {
  readonly index: number;
  readonly shapes: Shape[];
}

const PARCEL_SEED = 0x9a7ce1;
/** Half the widest parcel, reference pixels. */
const MAX_HALF_WIDTH = 29;
/** A parcel whose centre is this far past an edge is out of view (the soft edge adds half a pixel). */
const outOfViewMargin = (conveyor: Conveyor): number => MAX_HALF_WIDTH * conveyor.scale + 1;

/** The parcels at least partly over the sensor at tS, their sizes and shades fixed by their index. */
export function parcelsOnBelt(conveyor: Conveyor, tS: number): Parcel[] {
  const margin = outOfViewMargin(conveyor);
  const travelled = conveyor.speedPxPerS * tS;
  // centre of parcel n: widthPx + margin - travelled + n * spacing; keep those within [-margin, widthPx + margin]
  const first = Math.ceil((travelled - conveyor.widthPx - 2 * margin) / conveyor.spacingPx);
  const last = Math.floor(travelled / conveyor.spacingPx);
  const parcels: Parcel[] = [];
  for (let n = first; n <= last; n++) {
    const centreX = conveyor.widthPx + margin - travelled + n * conveyor.spacingPx;
    parcels.push({ index: n, shapes: parcelShapes(n).map((s) => placeShape(s, centreX, conveyor.beltTopY, conveyor.scale)) });
  }
  return parcels;
}

/** Index of the first parcel over the sensor at t = 0, so that track ids can start from it. */
export function firstParcelIndex(conveyor: Conveyor): number {
  return Math.ceil((-conveyor.widthPx - 2 * outOfViewMargin(conveyor)) / conveyor.spacingPx);
}

function parcelShapes(index: number): Shape[] {
  const rng = new Xoshiro128(PARCEL_SEED + index);
  const hx = 17 + 12 * rng.next();
  const hy = 11 + 9 * rng.next();
  const value = 135 + 60 * rng.next();
  const shapes: Shape[] = [
    { kind: 'box', cx: 0, cy: -hy, hx, hy, radius: 1.5, value },
    { kind: 'box', cx: 0, cy: -hy, hx: 2.5, hy, radius: 0, value: value - 40 },
  ];
  if (rng.next() < 0.6) shapes.push({ kind: 'box', cx: -hx * 0.5, cy: -hy, hx: hx * 0.25, hy: hy * 0.3, radius: 0.5, value: 230 });
  return shapes;
}
