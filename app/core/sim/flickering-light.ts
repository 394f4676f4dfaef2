import { placeShape, type Shape } from './soft-shapes';

/**
 * A failing fluorescent tube under the ceiling, in reference pixels about its centre: it
 * switches fully on and off `flickerHz` times a second (lit for the first half of each
 * cycle), and when lit its light spreads over the rack below it. Seen from the camera the
 * tube and a large part of the aisle flash once per cycle.
 */
export function flickeringLightShapes(x: number, y: number, scale: number, tS: number, flickerHz: number): Shape[] {
  const lit = (tS * flickerHz) % 1 < 0.5;
  const parts: Shape[] = [
    { kind: 'box', cx: 0, cy: 0, hx: 40, hy: 4, radius: 2, value: lit ? 255 : 45 },
    { kind: 'glow', cx: 0, cy: 80, radius: 130, value: lit ? 45 : 0 },
  ];
  return parts.map((s) => placeShape(s, x, y, scale));
}
