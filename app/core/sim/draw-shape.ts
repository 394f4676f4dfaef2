import { HALF_EDGE, shapeBounds, type Raster, type Shape } from './soft-shapes';

/*
 * Shapes are drawn from their signed distance d (negative inside): coverage =
 * clamp(0.5 - d, 0, 1), a one-pixel linear ramp centred on the outline, so a moving edge
 * changes pixels gradually and events come from edges (common practice, no source;
 * distance functions after Quilez, "2D distance functions", iquilezles.org). Each row is
 * split analytically: pixels where d <= -0.5 (the shape eroded by half a pixel) are filled
 * at once, and only the few along the outline have their distance computed.
 */

/** Signed distance from (x, y) to the outline of an opaque shape. */
function signedDistance(s: Exclude<Shape, { kind: 'glow' }>, x: number, y: number): number {
  switch (s.kind) {
    case 'disc':
      return Math.sqrt((x - s.cx) * (x - s.cx) + (y - s.cy) * (y - s.cy)) - s.radius;
    case 'box': {
      const qx = Math.abs(x - s.cx) - (s.hx - s.radius);
      const qy = Math.abs(y - s.cy) - (s.hy - s.radius);
      const ox = Math.max(qx, 0);
      const oy = Math.max(qy, 0);
      return Math.sqrt(ox * ox + oy * oy) + Math.min(Math.max(qx, qy), 0) - s.radius;
    }
    case 'capsule': {
      const px = x - s.ax;
      const py = y - s.ay;
      const bx = s.bx - s.ax;
      const by = s.by - s.ay;
      const length2 = bx * bx + by * by;
      const h = length2 > 0 ? Math.min(1, Math.max(0, (px * bx + py * by) / length2)) : 0;
      const ex = px - bx * h;
      const ey = py - by * h;
      return Math.sqrt(ex * ex + ey * ey) - s.radius;
    }
  }
}

/** Draws the shape into the raster where they overlap: opaque shapes, lit by the raster's light, blend by coverage; glows add. */
export function drawShape(s: Shape, raster: Raster): void {
  // Full cover is the shape eroded by half a pixel, any cover the shape grown by half a pixel.
  switch (s.kind) {
    case 'disc':
      drawRows(s, raster, (y, out) => discRow(s.cx, s.cy, s.radius - HALF_EDGE, y, out), (y, out) => discRow(s.cx, s.cy, s.radius + HALF_EDGE, y, out));
      return;
    case 'box':
      drawRows(
        s,
        raster,
        (y, out) => roundedBoxRow(s.cx, s.cy, s.hx - HALF_EDGE, s.hy - HALF_EDGE, Math.max(0, s.radius - HALF_EDGE), y, out),
        (y, out) => roundedBoxRow(s.cx, s.cy, s.hx + HALF_EDGE, s.hy + HALF_EDGE, s.radius + HALF_EDGE, y, out),
      );
      return;
    case 'capsule':
      drawRows(s, raster, (y, out) => capsuleRow(s, s.radius - HALF_EDGE, y, out), (y, out) => capsuleRow(s, s.radius + HALF_EDGE, y, out));
      return;
    case 'glow':
      drawGlow(s, raster);
  }
}

/** The part [lo, hi] of one pixel row inside a shape; empty rows are [Infinity, -Infinity], so hulls need no special case. */
interface Span {
  lo: number;
  hi: number;
}
type RowSpan = (y: number, out: Span) => void;
const innerSpan: Span = { lo: Infinity, hi: -Infinity };
const outerSpan: Span = { lo: Infinity, hi: -Infinity };

/**
 * Row by row within the shape's bounds: pixels of the inner span are fully covered and
 * filled at once; the rest of the outer span blends by coverage.
 */
function drawRows(s: Exclude<Shape, { kind: 'glow' }>, raster: Raster, inner: RowSpan, outer: RowSpan): void {
  const b = shapeBounds(s);
  const right = raster.x0 + raster.width - 1;
  if (b.x1 < raster.x0 || b.x0 > right) return;
  const ya = Math.max(raster.y0, Math.ceil(b.y0));
  const yb = Math.min(raster.y0 + raster.height - 1, Math.floor(b.y1));
  const { data, light } = raster;
  for (let y = ya; y <= yb; y++) {
    outer(y, outerSpan);
    const xa = Math.max(raster.x0, Math.ceil(outerSpan.lo));
    const xb = Math.min(right, Math.floor(outerSpan.hi));
    if (xa > xb) continue;
    inner(y, innerSpan);
    const full = innerSpan.lo <= innerSpan.hi;
    const fa = full ? Math.max(xa, Math.ceil(innerSpan.lo)) : xb + 1;
    const fb = full ? Math.min(xb, Math.floor(innerSpan.hi)) : xb;
    const row = (y - raster.y0) * raster.width - raster.x0;
    const lightRow = light ? y * light.sensorWidth : 0;
    for (let x = xa; x <= Math.min(fa - 1, xb); x++) blend(data, row + x, litValue(s.value, light, lightRow + x), HALF_EDGE - signedDistance(s, x, y));
    if (fa <= fb && light) fillLit(data, row + fa, row + fb + 1, s.value, light.level, lightRow + fa);
    else if (fa <= fb) data.fill(s.value, row + fa, row + fb + 1);
    for (let x = Math.max(fb + 1, xa); x <= xb; x++) blend(data, row + x, litValue(s.value, light, lightRow + x), HALF_EDGE - signedDistance(s, x, y));
  }
}

function fillLit(data: Float32Array, start: number, end: number, value: number, level: Float32Array, levelStart: number): void {
  for (let i = start, j = levelStart; i < end; i++, j++) data[i] = value * level[j]!;
}

const litValue = (value: number, light: Raster['light'], i: number): number => (light ? value * light.level[i]! : value);

function blend(data: Float32Array, i: number, value: number, coverage: number): void {
  if (coverage <= 0) return;
  const old = data[i]!;
  data[i] = coverage >= 1 ? value : old + (value - old) * coverage;
}

function setSpan(out: Span, lo: number, hi: number): void {
  out.lo = lo;
  out.hi = hi;
}

function discRow(cx: number, cy: number, radius: number, y: number, out: Span): void {
  const dy = y - cy;
  if (radius <= 0 || Math.abs(dy) > radius) return setSpan(out, Infinity, -Infinity);
  const half = Math.sqrt(radius * radius - dy * dy);
  setSpan(out, cx - half, cx + half);
}

function roundedBoxRow(cx: number, cy: number, hx: number, hy: number, radius: number, y: number, out: Span): void {
  const qy = Math.abs(y - cy) - (hy - radius);
  if (hx <= 0 || hy <= 0 || qy > radius) return setSpan(out, Infinity, -Infinity);
  const half = qy <= 0 ? hx : hx - radius + Math.sqrt(radius * radius - qy * qy);
  setSpan(out, cx - half, cx + half);
}

/** A capsule's row is the hull of its end discs' rows and its straight part's: the capsule is convex. */
function capsuleRow(s: Extract<Shape, { kind: 'capsule' }>, radius: number, y: number, out: Span): void {
  if (radius <= 0) return setSpan(out, Infinity, -Infinity);
  discRow(s.ax, s.ay, radius, y, out);
  let lo = out.lo;
  let hi = out.hi;
  discRow(s.bx, s.by, radius, y, out);
  lo = Math.min(lo, out.lo);
  hi = Math.max(hi, out.hi);
  const length = Math.sqrt((s.bx - s.ax) ** 2 + (s.by - s.ay) ** 2);
  if (length > 0) {
    // Along the axis (x - ax) ux + (y - ay) uy must lie in [0, length], across it (x - ax) uy - (y - ay) ux in [-radius, radius].
    const ux = (s.bx - s.ax) / length;
    const uy = (s.by - s.ay) / length;
    linearRange(ux, (y - s.ay) * uy - s.ax * ux, 0, length, out);
    const alongLo = out.lo;
    const alongHi = out.hi;
    linearRange(uy, -(y - s.ay) * ux - s.ax * uy, -radius, radius, out);
    if (Math.max(alongLo, out.lo) <= Math.min(alongHi, out.hi)) {
      lo = Math.min(lo, Math.max(alongLo, out.lo));
      hi = Math.max(hi, Math.min(alongHi, out.hi));
    }
  }
  setSpan(out, lo, hi);
}

/** The x with min <= k x + c <= max. */
function linearRange(k: number, c: number, min: number, max: number, out: Span): void {
  if (k === 0) return c >= min && c <= max ? setSpan(out, -Infinity, Infinity) : setSpan(out, Infinity, -Infinity);
  const a = (min - c) / k;
  const b = (max - c) / k;
  setSpan(out, Math.min(a, b), Math.max(a, b));
}

function drawGlow(s: Extract<Shape, { kind: 'glow' }>, raster: Raster): void {
  const b = shapeBounds(s);
  const ya = Math.max(raster.y0, Math.ceil(b.y0));
  const yb = Math.min(raster.y0 + raster.height - 1, Math.floor(b.y1));
  const xa = Math.max(raster.x0, Math.ceil(b.x0));
  const xb = Math.min(raster.x0 + raster.width - 1, Math.floor(b.x1));
  for (let y = ya; y <= yb; y++) {
    const row = (y - raster.y0) * raster.width - raster.x0;
    for (let x = xa; x <= xb; x++) {
      const r2 = ((x - s.cx) ** 2 + (y - s.cy) ** 2) / (s.radius * s.radius);
      if (r2 < 1) raster.data[row + x] = raster.data[row + x]! + s.value * (1 - r2) * (1 - r2);
    }
  }
}

