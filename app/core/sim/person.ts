import { placeShape, type Shape } from './soft-shapes';

/**
 * A walker in a high-visibility vest seen side on, in reference pixels about the point on
 * the ground under the hips; 100 px tall at scale 1. `gaitPhase` (radians) swings the legs
 * and the opposite arms, and the body rises at mid-stance and dips when the feet are apart.
 */
export function personShapes(x: number, groundY: number, scale: number, gaitPhase: number): Shape[] {
  const swing = Math.sin(gaitPhase);
  const hipY = -50 - 2 * (1 - Math.abs(swing));
  const limb = (ax: number, ay: number, bx: number, by: number, radius: number, value: number): Shape => ({ kind: 'capsule', ax, ay, bx, by, radius, value });
  const parts: Shape[] = [
    limb(0, hipY - 28, 11 * swing, hipY - 5, 3.2, 150), // far arm
    limb(0, hipY, -21 * swing, -4, 4.5, 40), // far leg
    limb(0, hipY, 21 * swing, -4, 4.5, 52), // near leg
    limb(0, hipY - 2, 0, hipY - 28, 9, 215), // torso with vest
    { kind: 'disc', cx: 0, cy: hipY - 42, radius: 7, value: 160 }, // head
    limb(0, hipY - 28, -11 * swing, hipY - 5, 3.2, 185), // near arm
  ];
  return parts.map((s) => placeShape(s, x, groundY, scale));
}
