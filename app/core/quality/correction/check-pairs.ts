import { angleBetween, checkDisplayGeometry, degToScreenPx, screenPxToDeg, type DisplayGeometry } from '../../geometry/display-geometry';
import { screenPoint } from '../../geometry/units';
import type { ValidationRecord } from '../../study/records';
import type { CorrectionMap, CorrectionPair } from './models';

/**
 * The check points of validations and drift checks as (gaze, target, time) pairs: each
 * point's mean gaze in screen px is recovered exactly from its target and its per-axis
 * offset in degrees (dxDeg, dyDeg: screenPxToDeg is invertible per axis). Points without
 * valid gaze are left out. The time is the check's start (its record's hostNs).
 */
export function pairsFromValidations(validations: readonly ValidationRecord[], g: DisplayGeometry): CorrectionPair[] {
  checkDisplayGeometry(g);
  return validations.flatMap((v) =>
    v.points.flatMap((p) => {
      if (p.dxDeg === null || p.dyDeg === null) return [];
      const t = screenPxToDeg(g, screenPoint(p.x, p.y));
      const gaze = degToScreenPx(g, t.x + p.dxDeg, t.y + p.dyDeg);
      return [{ gaze: { x: gaze.x, y: gaze.y }, target: { x: p.x, y: p.y }, hostNs: v.hostNs }];
    }),
  );
}

/**
 * The mean angle (degrees, seen from the eye) between each pair's gaze and its target:
 * as recorded with `map` null, or corrected by `map`. Null without pairs.
 */
export function meanErrorDeg(pairs: readonly CorrectionPair[], g: DisplayGeometry, map: CorrectionMap | null): number | null {
  if (pairs.length === 0) return null;
  const errors = pairs.map((p) => {
    const gaze = map ? map(p.gaze.x, p.gaze.y, p.hostNs) : p.gaze;
    return angleBetween(g, screenPoint(gaze.x, gaze.y), screenPoint(p.target.x, p.target.y));
  });
  return errors.reduce((s, e) => s + e, 0) / errors.length;
}
