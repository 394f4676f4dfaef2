import { degToRad, radToDeg, type Deg, type Mm, type ScreenPoint, type ScreenPx } from './units';

/**
 * A flat screen seen by one eye on the normal through the screen's centre, at the viewing
 * distance. Angles are computed from the eye's position, never from a constant number of
 * pixels per degree, so they stay right away from the centre (Holmqvist et al. 2011,
 * "Eye Tracking: A Comprehensive Guide to Methods and Measures", OUP).
 */
export interface DisplayGeometry {
  readonly widthMm: number;
  readonly heightMm: number;
  readonly widthPx: number;
  readonly heightPx: number;
  readonly distanceMm: number;
}

export function checkDisplayGeometry(g: DisplayGeometry): DisplayGeometry {
  for (const key of ['widthMm', 'heightMm', 'widthPx', 'heightPx', 'distanceMm'] as const) {
    if (!(Number.isFinite(g[key]) && g[key] > 0)) throw new RangeError(`display.${key} must be a positive number, got ${g[key]}`);
  }
  return g;
}

/** Millimetres from the screen centre (x right, y down) of a screen pixel position. */
export function screenPxToMm(g: DisplayGeometry, p: ScreenPoint): { x: Mm; y: Mm } {
  return {
    x: ((p.x - g.widthPx / 2) * (g.widthMm / g.widthPx)) as Mm,
    y: ((p.y - g.heightPx / 2) * (g.heightMm / g.heightPx)) as Mm,
  };
}

export function mmToScreenPx(g: DisplayGeometry, xMm: number, yMm: number): ScreenPoint {
  return {
    x: (xMm * (g.widthPx / g.widthMm) + g.widthPx / 2) as ScreenPx,
    y: (yMm * (g.heightPx / g.heightMm) + g.heightPx / 2) as ScreenPx,
  };
}

/** The visual angle between two screen points: atan2(|a×b|, a·b) with a, b the rays from the eye. */
export function angleBetween(g: DisplayGeometry, p: ScreenPoint, q: ScreenPoint): Deg {
  const a = screenPxToMm(g, p);
  const b = screenPxToMm(g, q);
  const d = g.distanceMm;
  // a = (ax, ay, d), b = (bx, by, d)
  const cx = a.y * d - d * b.y;
  const cy = d * b.x - a.x * d;
  const cz = a.x * b.y - a.y * b.x;
  const dot = a.x * b.x + a.y * b.y + d * d;
  return radToDeg(Math.atan2(Math.hypot(cx, cy, cz), dot));
}

/**
 * Horizontal and vertical angles of a screen point seen from the eye (its direction as
 * atan of the offset over the distance, per axis): the coordinates that validation
 * layouts are given in and that per-axis offsets (dx, dy in degrees) use.
 */
export function screenPxToDeg(g: DisplayGeometry, p: ScreenPoint): { x: Deg; y: Deg } {
  const mm = screenPxToMm(g, p);
  return { x: radToDeg(Math.atan(mm.x / g.distanceMm)), y: radToDeg(Math.atan(mm.y / g.distanceMm)) };
}

/** Inverse of screenPxToDeg. */
export function degToScreenPx(g: DisplayGeometry, xDeg: number, yDeg: number): ScreenPoint {
  return mmToScreenPx(g, Math.tan(degToRad(xDeg)) * g.distanceMm, Math.tan(degToRad(yDeg)) * g.distanceMm);
}

/** Visual angle subtended by a size S seen straight on at distance D: 2·atan(S / 2D). */
export const visualAngleOfSize = (sizeMm: number, distanceMm: number): Deg => radToDeg(2 * Math.atan(sizeMm / (2 * distanceMm)));

/** Pixels per degree at the screen centre: (px/mm)·2D·tan(0.5°). */
export const pixelsPerDegreeAtCentre = (g: DisplayGeometry): number => (g.widthPx / g.widthMm) * 2 * g.distanceMm * Math.tan(degToRad(0.5));
