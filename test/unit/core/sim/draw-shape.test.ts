import { describe, expect, it } from 'vitest';
import { drawShape } from '../../../../app/core/sim/draw-shape';
import { shapeBounds, type Raster, type Shape } from '../../../../app/core/sim/soft-shapes';

const raster = (width: number, height: number, x0 = 0, y0 = 0): Raster => ({ data: new Float32Array(width * height), x0, y0, width, height, light: null });
const sum = (r: Raster) => r.data.reduce((s, v) => s + v, 0);

/** Coverage clamp(0.5 - d, 0, 1) evaluated at every pixel, from distance formulas written out here. */
function bruteForce(s: Exclude<Shape, { kind: 'glow' }>, r: Raster): Float32Array {
  const out = new Float32Array(r.data.length);
  for (let y = r.y0; y < r.y0 + r.height; y++) {
    for (let x = r.x0; x < r.x0 + r.width; x++) {
      let d: number;
      if (s.kind === 'disc') d = Math.hypot(x - s.cx, y - s.cy) - s.radius;
      else if (s.kind === 'box') {
        const qx = Math.abs(x - s.cx) - s.hx + s.radius;
        const qy = Math.abs(y - s.cy) - s.hy + s.radius;
        d = Math.hypot(Math.max(qx, 0), Math.max(qy, 0)) + Math.min(Math.max(qx, qy), 0) - s.radius;
      } else {
        const [ux, uy] = [s.bx - s.ax, s.by - s.ay];
        const h = ux === 0 && uy === 0 ? 0 : Math.min(1, Math.max(0, ((x - s.ax) * ux + (y - s.ay) * uy) / (ux * ux + uy * uy)));
        d = Math.hypot(x - s.ax - ux * h, y - s.ay - uy * h) - s.radius;
      }
      out[(y - r.y0) * r.width + (x - r.x0)] = Math.min(1, Math.max(0, 0.5 - d)) * s.value;
    }
  }
  return out;
}

describe('soft-edged shapes', () => {
  it('cover a disc and a box with a total equal to their area (box filtering preserves area, common practice)', () => {
    const disc = raster(40, 40);
    drawShape({ kind: 'disc', cx: 19.3, cy: 20.6, radius: 11.2, value: 1 }, disc);
    expect(Math.abs(sum(disc) - Math.PI * 11.2 ** 2) / (Math.PI * 11.2 ** 2)).toBeLessThan(0.002);
    const box = raster(40, 40);
    drawShape({ kind: 'box', cx: 20.25, cy: 18.5, hx: 9.5, hy: 6.2, radius: 0, value: 1 }, box);
    // Along straight edges the one-pixel ramp integrates exactly; only the four corners differ, by under a pixel together.
    expect(Math.abs(sum(box) - 19 * 12.4)).toBeLessThan(1);
  });

  it('ramp linearly across one pixel at an edge', () => {
    const r = raster(20, 1);
    drawShape({ kind: 'box', cx: 5, cy: 0, hx: 5.3, hy: 3, radius: 0, value: 100 }, r);
    // Right edge at x = 10.3: pixel 10 lies 0.3 inside (coverage 0.8), pixel 11 0.7 outside (none).
    expect(r.data[9]).toBe(100);
    expect(r.data[10]).toBeCloseTo(80, 4);
    expect(r.data[11]).toBe(0);
  });

  it('fill rows by spans with the same pixels as evaluating the coverage at every pixel', () => {
    const shapes: Exclude<Shape, { kind: 'glow' }>[] = [
      { kind: 'disc', cx: 12.4, cy: 9.7, radius: 6.3, value: 50 },
      { kind: 'disc', cx: 3.1, cy: 4.2, radius: 0.4, value: 50 },
      { kind: 'box', cx: 15.2, cy: 11.6, hx: 9.1, hy: 4.4, radius: 2.6, value: 70 },
      { kind: 'box', cx: 7.5, cy: 7.5, hx: 0.3, hy: 5, radius: 0.2, value: 70 },
      { kind: 'capsule', ax: 3.2, ay: 2.1, bx: 21.7, by: 17.4, radius: 2.2, value: 90 },
      { kind: 'capsule', ax: 10.2, ay: 1.5, bx: 10.2, by: 20.5, radius: 1.4, value: 90 },
      { kind: 'capsule', ax: 2, ay: 12.3, bx: 25, by: 12.3, radius: 3, value: 90 },
      { kind: 'capsule', ax: 8, ay: 8, bx: 8, by: 8, radius: 3.5, value: 90 },
    ];
    for (const s of shapes) {
      // An offset raster that cuts through the shape checks the clipping too.
      for (const r of [raster(30, 24), raster(9, 7, 8, 6)]) {
        drawShape(s, r);
        const expected = bruteForce(s, r);
        r.data.forEach((v, i) => expect(v).toBeCloseTo(expected[i]!, 4));
      }
    }
  });

  it('keep every covered pixel inside their bounds', () => {
    const s: Shape = { kind: 'capsule', ax: 5.5, ay: 4, bx: 14, by: 9.2, radius: 2.5, value: 1 };
    const r = raster(24, 16);
    drawShape(s, r);
    const b = shapeBounds(s);
    r.data.forEach((v, i) => {
      if (v === 0) return;
      const [x, y] = [i % 24, Math.floor(i / 24)];
      expect(x >= b.x0 && x <= b.x1 && y >= b.y0 && y <= b.y1).toBe(true);
    });
  });

  it('scale opaque shapes by the light where each pixel lies, blending the lit value at the edge', () => {
    const level = Float32Array.from({ length: 20 * 4 }, (_, i) => 0.5 + (i % 20) / 40);
    const unlit = raster(12, 2, 4, 1);
    const litRaster: Raster = { ...raster(12, 2, 4, 1), light: { level, sensorWidth: 20 } };
    const box: Shape = { kind: 'box', cx: 9, cy: 1.5, hx: 3.2, hy: 2, radius: 0, value: 100 };
    drawShape(box, unlit);
    drawShape(box, litRaster);
    // Pixel (x, y) of the region is data[(y - 1) * 12 + (x - 4)] and lit by level[y * 20 + x].
    for (const [x, y] of [[6, 1], [9, 2], [12, 1]] as const) {
      expect(litRaster.data[(y - 1) * 12 + (x - 4)]).toBeCloseTo(unlit.data[(y - 1) * 12 + (x - 4)]! * level[y * 20 + x]!, 4);
    }
    expect(unlit.data[(1 - 1) * 12 + (12 - 4)]).toBeCloseTo(70, 4); // edge at 12.2: coverage 0.7
  });

  it('add a glow that falls smoothly to nothing at its radius', () => {
    const r = raster(21, 21);
    r.data.fill(10);
    drawShape({ kind: 'glow', cx: 10, cy: 10, radius: 8, value: 40 }, r);
    expect(r.data[10 * 21 + 10]).toBe(50);
    expect(r.data[10 * 21 + 14]).toBeCloseTo(10 + 40 * (1 - 0.25) ** 2, 4);
    expect(r.data[10 * 21 + 18]).toBe(10);
    expect(r.data[0]).toBe(10);
  });
});
