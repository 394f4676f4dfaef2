import { describe, expect, it } from 'vitest';
import { applyCorrection, correctionMap, fitCorrection, type CorrectionPair } from '../../../../../app/core/quality/correction';
import { hasNumpy, numpyReference, storedReference, type MapSet } from './reference';

const pairsOf = (m: Pick<MapSet, 'from' | 'to'>): CorrectionPair[] => m.from.map(([x, y], i) => ({ gaze: { x, y }, target: { x: m.to[i]![0], y: m.to[i]![1] }, hostNs: 0 }));

function expectLikeNumpy(m: MapSet) {
  const fit = fitCorrection(m.kind, pairsOf(m));
  const p = fit.params as { centre: { x: number; y: number }; scale: { x: number; y: number }; ax: number[]; ay: number[] };
  expect([p.centre.x, p.centre.y, p.scale.x, p.scale.y]).toEqual(m.centre.concat(m.scale).map((v) => expect.closeTo(v, 9)));
  p.ax.forEach((v, k) => expect(v, `${m.name} ax[${k}]`).toBeCloseTo(m.ax[k]!, 8));
  p.ay.forEach((v, k) => expect(v, `${m.name} ay[${k}]`).toBeCloseTo(m.ay[k]!, 8));
  fit.residualsPx.forEach((r, i) => expect(r, `${m.name} residual ${i}`).toBeCloseTo(m.residuals_px[i]!, 8));
}

describe('fitCorrection: affine and second-order polynomial maps (Cerrolaza, Villanueva and Cabeza 2012, ACM TOCHI)', () => {
  it('match numpy.linalg.lstsq on the same points (stored fixture)', () => {
    const [affine, poly] = storedReference().maps;
    expectLikeNumpy(affine!);
    expectLikeNumpy(poly!);
  });

  it.skipIf(!hasNumpy)('match numpy.linalg.lstsq run live on perturbed point sets', () => {
    const base = storedReference().maps.slice(0, 2);
    const sets = base.map((m, s) => ({ kind: m.kind, from: m.from.map(([x, y], i) => [x + Math.sin(i + s) * 7, y + Math.cos(3 * i) * 5] as [number, number]), to: m.to }));
    for (const m of numpyReference({ maps: sets, matrices: [] }).maps) expectLikeNumpy(m);
  });

  it('recover a known map exactly from points it generated', () => {
    const truth = (x: number, y: number) => ({ x: 3 + 1.01 * x - 0.02 * y + 1e-5 * x * y + 2e-5 * x * x, y: -7 + 0.99 * y + 0.01 * x - 3e-5 * y * y });
    const grid = [100, 500, 900, 1300, 1700].flatMap((x) => [100, 400, 700, 1000].map((y) => ({ x, y })));
    const pairs = grid.map((g) => ({ gaze: g, target: truth(g.x, g.y), hostNs: 0 }));
    const fit = fitCorrection('polynomial2', pairs);
    expect(fit.rmsResidualPx).toBeLessThan(1e-9);
    const c = applyCorrection({ model: 'polynomial2', params: fit.params }, 812, 333, 0);
    expect(c.x).toBeCloseTo(truth(812, 333).x, 8);
    expect(c.y).toBeCloseTo(truth(812, 333).y, 8);
  });

  it('refuse too few or degenerate points with a RangeError that says what is needed', () => {
    const grid = storedReference().maps[0]!;
    const pairs = pairsOf(grid);
    expect(() => fitCorrection('affine', pairs.slice(0, 2))).toThrow(/affine needs at least 3 check points/);
    expect(() => fitCorrection('polynomial2', pairs.slice(0, 5))).toThrow(/polynomial2 needs at least 6 check points/);
    // Six points on a circle lie on one conic: x² + y² = r² ties the six terms together.
    const circle = Array.from({ length: 6 }, (_, i) => ({ gaze: { x: 960 + 300 * Math.cos(i), y: 540 + 300 * Math.sin(i) }, target: { x: i, y: i }, hostNs: 0 }));
    expect(() => fitCorrection('polynomial2', circle)).toThrow(/determine only 5 of its 6 terms/);
    const row = [0, 1, 2].map((i) => ({ gaze: { x: 100 * i, y: 50 }, target: { x: 0, y: 0 }, hostNs: 0 }));
    expect(() => fitCorrection('affine', row)).toThrow(/spread in both x and y.*horizontal line/);
    expect(() => fitCorrection('offset', [])).toThrow(/at least one check point/);
    expect(() => fitCorrection('offset', [{ gaze: { x: Number.NaN, y: 0 }, target: { x: 0, y: 0 }, hostNs: 0 }])).toThrow(/pairs\[0\]\.gaze\.x must be finite/);
  });
});

describe('offset models', () => {
  const pairs: CorrectionPair[] = [
    { gaze: { x: 110, y: 95 }, target: { x: 100, y: 100 }, hostNs: 1e9 },
    { gaze: { x: 506, y: 497 }, target: { x: 500, y: 500 }, hostNs: 1e9 },
    { gaze: { x: 530, y: 480 }, target: { x: 500, y: 500 }, hostNs: 61e9 },
  ];

  it('a constant offset is the mean of target − gaze, added to every sample', () => {
    const fit = fitCorrection('offset', pairs);
    expect(fit.params).toEqual({ dx: (-10 - 6 - 30) / 3, dy: (5 + 3 + 20) / 3 });
    expect(applyCorrection({ model: 'offset', params: { dx: -2, dy: 3 } }, 10, 10, 0)).toEqual({ x: 8, y: 13 });
  });

  it('an interpolated offset has one knot per check and is linear in time between them, constant outside', () => {
    const fit = fitCorrection('offset_interpolated', pairs);
    expect(fit.params).toEqual({ knots: [{ hostNs: 1e9, dx: -8, dy: 4 }, { hostNs: 61e9, dx: -30, dy: 20 }] });
    const record = { model: 'offset_interpolated' as const, params: fit.params };
    expect(applyCorrection(record, 0, 0, 31e9)).toEqual({ x: -19, y: 12 });
    expect(applyCorrection(record, 0, 0, 0)).toEqual({ x: -8, y: 4 });
    expect(applyCorrection(record, 0, 0, 1e12)).toEqual({ x: -30, y: 20 });
    // Each check's points are corrected by their own knot: residuals are the spread about it.
    expect(fit.residualsPx[2]).toBe(0);
    expect(fit.residualsPx[0]).toBeCloseTo(Math.hypot(2, 1), 12);
  });

  it('a stored record whose params do not fit its model is refused, naming the field', () => {
    expect(() => correctionMap({ model: 'offset', params: { dx: 1 } })).toThrow(/params\.dy/);
    expect(() => correctionMap({ model: 'affine', params: { centre: { x: 0, y: 0 }, scale: { x: 1, y: 1 }, ax: [1, 2], ay: [1, 2, 3] } })).toThrow(/params\.ax/);
    expect(() => correctionMap({ model: 'offset_interpolated', params: { knots: [{ hostNs: 2, dx: 0, dy: 0 }, { hostNs: 1, dx: 0, dy: 0 }] } })).toThrow(/increasing hostNs/);
  });
});
