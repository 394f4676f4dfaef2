import { mmToScreenPx, screenPxToMm, type DisplayGeometry } from '../geometry/display-geometry';
import { degToRad, type ScreenPoint } from '../geometry/units';

/**
 * The screen point seen when the ray from the eye through `p` is turned by a small angle:
 * `rightDeg` along the screen's horizontal and `downDeg` along the direction at right
 * angles to it, both in the plane perpendicular to the ray (the local frame of the gaze).
 * The turn is exact: the angle between the two rays is hypot(rightDeg, downDeg), wherever
 * `p` lies on the screen, so an error stated in degrees keeps its size off-centre, and
 * its pixel size follows from the geometry at the gaze position.
 */
export function offsetByAngle(g: DisplayGeometry, p: ScreenPoint, rightDeg: number, downDeg: number): ScreenPoint {
  const sizeDeg = Math.hypot(rightDeg, downDeg);
  if (sizeDeg === 0) return p;
  const mm = screenPxToMm(g, p);
  const d = g.distanceMm;
  const n = Math.hypot(mm.x, mm.y, d);
  // r: the gaze ray; e1: horizontal and perpendicular to r; e2 = r × e1 (points down at the centre).
  const rx = mm.x / n;
  const ry = mm.y / n;
  const rz = d / n;
  const m = Math.hypot(rz, rx);
  const e1x = rz / m;
  const e1z = -rx / m;
  const e2x = ry * e1z;
  const e2y = rz * e1x - rx * e1z;
  const e2z = -ry * e1x;
  const theta = degToRad(sizeDeg);
  const ux = rightDeg / sizeDeg;
  const uy = downDeg / sizeDeg;
  const c = Math.cos(theta);
  const s = Math.sin(theta);
  const qx = c * rx + s * (ux * e1x + uy * e2x);
  const qy = c * ry + s * uy * e2y;
  const qz = c * rz + s * (ux * e1z + uy * e2z);
  if (!(qz > 0)) throw new RangeError(`an offset of ${sizeDeg}° turns the gaze away from the screen`);
  return mmToScreenPx(g, (qx / qz) * d, (qy / qz) * d);
}
