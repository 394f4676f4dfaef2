import { describe, expect, it } from 'vitest';
import { angleBetween } from '../../../../../app/core/geometry/display-geometry';
import { screenPoint } from '../../../../../app/core/geometry/units';
import { pointQuality } from '../../../../../app/core/quality';
import { meanErrorDeg, pairsFromValidations } from '../../../../../app/core/quality/correction';
import type { ValidationRecord } from '../../../../../app/core/study/records';

const display = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 };

/** A validation whose points' gaze sat exactly at `gaze` (every sample there). */
function validation(points: { target: { x: number; y: number }; gaze: { x: number; y: number } | null }[]): ValidationRecord {
  const results = points.map(({ target, gaze }) =>
    pointQuality(target, gaze ? [0, 1, 2].map((i) => ({ hostNs: i, x: gaze.x, y: gaze.y, valid: true })) : [{ hostNs: 0, x: Number.NaN, y: Number.NaN, valid: false }], 3, display),
  );
  return { id: 'v-1', sessionId: 's', trialId: 't', kind: 'validation', at: '2026-03-02T10:00:00.000Z', hostNs: 5e9, points: results, meanAccuracyDeg: null, maxAccuracyDeg: null, accepted: false };
}

describe('pairsFromValidations', () => {
  const v = validation([
    { target: { x: 192, y: 108 }, gaze: { x: 230.5, y: 90.25 } },
    { target: { x: 1728, y: 972 }, gaze: { x: 1700, y: 1001 } },
    { target: { x: 960, y: 540 }, gaze: null },
  ]);

  it('recovers each point’s mean gaze in px from its target and its offsets in degrees, and leaves out points without gaze', () => {
    const pairs = pairsFromValidations([v], display);
    expect(pairs).toHaveLength(2);
    expect(pairs[0]!.gaze.x).toBeCloseTo(230.5, 9);
    expect(pairs[0]!.gaze.y).toBeCloseTo(90.25, 9);
    expect(pairs[1]!.gaze.x).toBeCloseTo(1700, 9);
    expect(pairs[1]!.target).toEqual({ x: 1728, y: 972 });
    expect(pairs.every((p) => p.hostNs === 5e9)).toBe(true);
  });

  it('the mean error without a correction is the mean of the points’ accuracy (the angle seen from the eye)', () => {
    const pairs = pairsFromValidations([v], display);
    const accuracy = v.points.slice(0, 2).map((p) => p.accuracyDeg!);
    expect(meanErrorDeg(pairs, display, null)).toBeCloseTo((accuracy[0]! + accuracy[1]!) / 2, 9);
    expect(accuracy[0]).toBeCloseTo(angleBetween(display, screenPoint(230.5, 90.25), screenPoint(192, 108)), 12);
    expect(meanErrorDeg([], display, null)).toBeNull();
    // A correction that puts every gaze on its target leaves no error.
    expect(meanErrorDeg(pairs, display, (x, y) => pairs.find((p) => p.gaze.x === x && p.gaze.y === y)!.target)).toBe(0);
  });
});
