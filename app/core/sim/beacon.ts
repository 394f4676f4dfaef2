import { placeShape, type Shape } from './soft-shapes';

/**
 * A rotating warning beacon on the rack's top beam, in reference pixels about its base.
 * The reflector turns about the vertical axis: its lit spot slides across the dome and is
 * brightest when it faces the camera, when its glow also lights the rack around it. Seen
 * from the camera it flashes once per turn.
 */
export function beaconShapes(x: number, baseY: number, scale: number, tS: number, rotationHz: number): Shape[] {
  const angle = 2 * Math.PI * rotationHz * tS;
  const facing = Math.max(0, Math.cos(angle));
  const domeRadius = 8;
  const spotRadius = 4.2;
  const parts: Shape[] = [
    { kind: 'box', cx: 0, cy: -3, hx: 7, hy: 3, radius: 1, value: 40 },
    { kind: 'disc', cx: 0, cy: -13, radius: domeRadius, value: 70 },
    { kind: 'disc', cx: (domeRadius - spotRadius) * Math.sin(angle), cy: -13, radius: spotRadius, value: 70 + 230 * facing * facing },
    { kind: 'glow', cx: 0, cy: -13, radius: 34, value: 90 * facing ** 4 },
  ];
  return parts.map((s) => placeShape(s, x, baseY, scale));
}
