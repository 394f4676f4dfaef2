import { placeShape, type Shape } from './soft-shapes';

const box = (cx: number, cy: number, hx: number, hy: number, radius: number, value: number): Shape => ({ kind: 'box', cx, cy, hx, hy, radius, value });
const disc = (cx: number, cy: number, radius: number, value: number): Shape => ({ kind: 'disc', cx, cy, radius, value });
const bar = (ax: number, ay: number, bx: number, by: number, radius: number, value: number): Shape => ({ kind: 'capsule', ax, ay, bx, by, radius, value });

/**
 * A counterbalance forklift seen side on, facing right, in reference pixels about the
 * point on the ground midway under it; about 200 px long and 125 px tall at scale 1. Drawn
 * back to front: mast and guard behind the body, wheels and forks in front.
 */
const FORKLIFT: readonly Shape[] = [
  box(60, -68, 4, 64, 1, 70), // mast
  box(66, -30, 4, 16, 1, 88), // carriage
  bar(-40, -60, -34, -121, 3, 58), // overhead guard, rear post
  bar(16, -60, 24, -121, 3, 58), // front post
  box(-8, -122, 36, 4, 2, 58), // guard roof
  box(-14, -76, 10, 14, 4, 72), // driver
  disc(-12, -97, 9, 190), // helmet
  box(-8, -40, 62, 22, 7, 200), // body
  box(-62, -54, 14, 28, 6, 150), // counterweight
  box(-16, -58, 30, 4, 2, 120), // seat deck
  box(95, -7, 30, 2.5, 1, 96), // forks
  disc(-46, -16, 16, 26), // rear wheel
  disc(-46, -16, 6, 120), // rear hub
  disc(40, -14, 14, 26), // front wheel
  disc(40, -14, 5, 120), // front hub
];

/** A pallet with a carton, carried on the forks. */
const LOAD: readonly Shape[] = [
  box(95, -13, 29, 4, 0, 112), // pallet
  box(95, -39, 26, 22, 1.5, 168), // carton
  box(95, -39, 3.5, 22, 0, 132), // tape
];

export function forkliftShapes(x: number, groundY: number, scale: number, facing: 1 | -1, loaded: boolean): Shape[] {
  const parts = loaded ? [...FORKLIFT.slice(0, 11), ...LOAD, ...FORKLIFT.slice(11)] : FORKLIFT;
  return parts.map((s) => placeShape(s, x, groundY, scale, facing));
}
