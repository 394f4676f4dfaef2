import { checkDisplayGeometry, degToScreenPx, type DisplayGeometry } from '../geometry/display-geometry';

export type LayoutSize = 5 | 9 | 13;

/**
 * The validation layouts as unit positions in [-1, 1]² (x right, y down), in this order:
 *   5   the centre, then the four corners (top-left, top-right, bottom-left, bottom-right);
 *   9   a 3 × 3 grid, row by row from the top-left;
 *   13  the 9-point grid, then the centres of its four quadrants (at ±½), in corner order.
 */
export function unitLayout(n: LayoutSize): { u: number; v: number }[] {
  const corners = [
    { u: -1, v: -1 },
    { u: 1, v: -1 },
    { u: -1, v: 1 },
    { u: 1, v: 1 },
  ];
  if (n === 5) return [{ u: 0, v: 0 }, ...corners];
  const grid = [-1, 0, 1].flatMap((v) => [-1, 0, 1].map((u) => ({ u, v })));
  if (n === 9) return grid;
  if (n === 13) return [...grid, ...corners.map(({ u, v }) => ({ u: u / 2, v: v / 2 }))];
  throw new RangeError(`n must be 5, 9 or 13, got ${String(n)}`);
}

/**
 * The layout as fractions of an area (0 at its left or top edge, 1 at the right or bottom),
 * the outer points marginFrac in from each edge.
 */
export function layoutFractions(n: LayoutSize, marginFrac = 0.1): { x: number; y: number }[] {
  if (!(Number.isFinite(marginFrac) && marginFrac >= 0 && marginFrac < 0.5)) throw new RangeError(`marginFrac must be in [0, 0.5), got ${marginFrac}`);
  const half = 0.5 - marginFrac;
  return unitLayout(n).map(({ u, v }) => ({ x: 0.5 + u * half, y: 0.5 + v * half }));
}

/**
 * The layout in screen pixels over an area: the whole screen, or the stimulus area (the
 * placed sensor image, with its left and top on the screen).
 */
export function validationLayout(n: LayoutSize, area: { widthPx: number; heightPx: number; left?: number; top?: number }, marginFrac = 0.1): { x: number; y: number }[] {
  if (!(area.widthPx > 0 && area.heightPx > 0)) throw new RangeError(`area must have a positive size, got ${area.widthPx} x ${area.heightPx}`);
  const left = area.left ?? 0;
  const top = area.top ?? 0;
  return layoutFractions(n, marginFrac).map((f) => ({ x: left + f.x * area.widthPx, y: top + f.y * area.heightPx }));
}

/**
 * The layout in screen pixels from positions in degrees from the screen centre: the outer
 * points at ±extentDeg.x horizontally and ±extentDeg.y vertically (each axis's angle as
 * atan of the offset over the viewing distance, as in app/core/geometry's screenPxToDeg).
 */
export function validationLayoutDeg(n: LayoutSize, g: DisplayGeometry, extentDeg: { x: number; y: number }): { x: number; y: number }[] {
  checkDisplayGeometry(g);
  for (const key of ['x', 'y'] as const) {
    if (!(Number.isFinite(extentDeg[key]) && extentDeg[key] >= 0 && extentDeg[key] < 60)) throw new RangeError(`extentDeg.${key} must be in [0, 60), got ${extentDeg[key]}`);
  }
  return unitLayout(n).map(({ u, v }) => degToScreenPx(g, u * extentDeg.x, v * extentDeg.y));
}
