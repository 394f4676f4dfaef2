/**
 * Solid angle of a screen rectangle seen from the eye, which sits on the normal through the
 * screen centre at distance d. For a rectangle with one corner at the foot of that normal
 * and the other at (x, y), Omega = atan(x y / (d sqrt(d^2 + x^2 + y^2))) (the solid angle of
 * a rectangular pyramid's corner section; formula from memory, checked against numerical
 * integration by scipy in the tests); any rectangle is the signed sum of four such corners.
 */
function cornerSolidAngle(x: number, y: number, d: number): number {
  return Math.atan((x * y) / (d * Math.sqrt(d * d + x * x + y * y)));
}

/** Steradians of [x0, x1] x [y0, y1] in mm from the screen centre, seen from distance d mm. */
export function rectangleSolidAngle(x0: number, y0: number, x1: number, y1: number, distanceMm: number): number {
  return cornerSolidAngle(x1, y1, distanceMm) - cornerSolidAngle(x0, y1, distanceMm) - cornerSolidAngle(x1, y0, distanceMm) + cornerSolidAngle(x0, y0, distanceMm);
}

/** Steradians of a cone of the given full angle: 2 pi (1 - cos(half angle)). A 10-degree field is 0.0239 sr. */
export const coneSolidAngle = (diameterDeg: number): number => 2 * Math.PI * (1 - Math.cos((diameterDeg / 2) * (Math.PI / 180)));
