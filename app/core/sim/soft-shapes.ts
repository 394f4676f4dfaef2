/**
 * Flat-valued shapes with soft edges half a pixel either side of the outline (drawn by
 * draw-shape.ts). Coordinates are sensor pixels with pixel (x, y) sampled at its integer position, the
 * same convention as event coordinates.
 */
export type Shape =
  | { readonly kind: 'box'; readonly cx: number; readonly cy: number; readonly hx: number; readonly hy: number; readonly radius: number; readonly value: number }
  | { readonly kind: 'disc'; readonly cx: number; readonly cy: number; readonly radius: number; readonly value: number }
  | { readonly kind: 'capsule'; readonly ax: number; readonly ay: number; readonly bx: number; readonly by: number; readonly radius: number; readonly value: number }
  /** Emitted light added on top: value * (1 - (d/radius)^2)^2 within `radius` of the centre. */
  | { readonly kind: 'glow'; readonly cx: number; readonly cy: number; readonly radius: number; readonly value: number };

/** A closed box in continuous pixel coordinates. */
export interface Bounds {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/** A pixel region [x0, x1) x [y0, y1) of a sensor, whose values sit row by row in `data`. */
export interface Raster {
  readonly data: Float32Array;
  readonly x0: number;
  readonly y0: number;
  readonly width: number;
  readonly height: number;
  /** The light level of every sensor pixel, row by row across the whole sensor width, scaling opaque shapes; null leaves them unlit. */
  readonly light: { readonly level: Float32Array; readonly sensorWidth: number } | null;
}

/** Half the width of the soft edge, pixels. */
export const HALF_EDGE = 0.5;

/** Everywhere the shape has any coverage lies inside these bounds. */
export function shapeBounds(s: Shape): Bounds {
  switch (s.kind) {
    case 'box':
      return { x0: s.cx - s.hx - HALF_EDGE, y0: s.cy - s.hy - HALF_EDGE, x1: s.cx + s.hx + HALF_EDGE, y1: s.cy + s.hy + HALF_EDGE };
    case 'disc':
      return { x0: s.cx - s.radius - HALF_EDGE, y0: s.cy - s.radius - HALF_EDGE, x1: s.cx + s.radius + HALF_EDGE, y1: s.cy + s.radius + HALF_EDGE };
    case 'glow':
      return { x0: s.cx - s.radius, y0: s.cy - s.radius, x1: s.cx + s.radius, y1: s.cy + s.radius };
    case 'capsule': {
      const pad = s.radius + HALF_EDGE;
      return { x0: Math.min(s.ax, s.bx) - pad, y0: Math.min(s.ay, s.by) - pad, x1: Math.max(s.ax, s.bx) + pad, y1: Math.max(s.ay, s.by) + pad };
    }
  }
}

export function unionBounds(a: Bounds, b: Bounds): Bounds {
  return { x0: Math.min(a.x0, b.x0), y0: Math.min(a.y0, b.y0), x1: Math.max(a.x1, b.x1), y1: Math.max(a.y1, b.y1) };
}

/** The shape drawn at `scale` about (originX, originY); facing -1 mirrors it left to right. */
export function placeShape(s: Shape, originX: number, originY: number, scale: number, facing: 1 | -1 = 1): Shape {
  const px = (x: number) => originX + facing * x * scale;
  const py = (y: number) => originY + y * scale;
  switch (s.kind) {
    case 'box':
      return { ...s, cx: px(s.cx), cy: py(s.cy), hx: s.hx * scale, hy: s.hy * scale, radius: s.radius * scale };
    case 'disc':
    case 'glow':
      return { ...s, cx: px(s.cx), cy: py(s.cy), radius: s.radius * scale };
    case 'capsule':
      return { ...s, ax: px(s.ax), ay: py(s.ay), bx: px(s.bx), by: py(s.by), radius: s.radius * scale };
  }
}
