import { combinedGaze } from '../../../../../app/core/gaze/gaze-sample';
import { expectedSampleCount, pointQuality, samplesInWindow, summarizeValidation, validationLayout, type TimedSample } from '../../../../../app/core/quality';
import type { ValidationRecord } from '../../../../../app/core/study/records';
import { SimulatedTracker } from '../../../../../app/core/tracker-sim';

/**
 * A simulated session with heavy drift (app/core/tracker-sim: a constant accuracy offset
 * plus a drift growing at driftDegPerMin in a seeded direction): checks run at chosen
 * minutes, each target held 1.5 s and measured over 300–1300 ms after its onset, as the
 * host's target procedure does. Every sample is kept as columns for correction tests.
 */
export const display = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 };
const RATE_HZ = 120;
const HOLD_S = 1.5;

export interface Check {
  readonly id: string;
  readonly kind: ValidationRecord['kind'];
  readonly atMin: number;
  readonly points: readonly { x: number; y: number }[];
}

export const grid9 = validationLayout(9, display);
/** The 13-point layout's four quadrant centres: places the 9-point fit never saw. */
export const quadrants = validationLayout(13, display).slice(9);
export const centre = [{ x: display.widthPx / 2, y: display.heightPx / 2 }];

export function simulateSession(checks: readonly Check[], o: { driftDegPerMin: number; accuracyOffsetDeg: number; seed: number }) {
  const tracker = new SimulatedTracker({ rateHz: RATE_HZ, seed: o.seed, display, startHostS: 0, noiseDeg: 0.03, driftDegPerMin: o.driftDegPerMin, accuracyOffsetDeg: o.accuracyOffsetDeg });
  const all: TimedSample[] = [];
  const take = (untilS: number): TimedSample[] => {
    const got = tracker.samplesUntil(untilS).map((r) => {
      const g = combinedGaze(r.sample);
      return g ? { hostNs: r.hostS * 1e9, x: g.x, y: g.y, valid: true } : { hostNs: r.hostS * 1e9, x: Number.NaN, y: Number.NaN, valid: false };
    });
    all.push(...got);
    return got;
  };
  const validations: ValidationRecord[] = [...checks]
    .sort((a, b) => a.atMin - b.atMin)
    .map((check) => {
      const startS = check.atMin * 60;
      take(startS);
      const points = check.points.map((p, i) => {
        const onsetS = startS + i * HOLD_S;
        tracker.setLook({ kind: 'point', x: p.x, y: p.y }, onsetS);
        const samples = take(onsetS + HOLD_S);
        return pointQuality(p, samplesInWindow(samples, onsetS * 1e9, 300, 1300), expectedSampleCount(300, 1300, RATE_HZ), display);
      });
      tracker.setLook({ kind: 'idle' }, startS + check.points.length * HOLD_S);
      const summary = summarizeValidation(points, { validationMeanDeg: 1, validationMaxDeg: 1.5 });
      return { id: check.id, sessionId: 'sim', trialId: `sim-trial-${check.id}`, kind: check.kind, at: '2026-03-02T10:00:00.000Z', hostNs: startS * 1e9, points, meanAccuracyDeg: summary.meanAccuracyDeg, maxAccuracyDeg: summary.maxAccuracyDeg, accepted: summary.accepted };
    });
  const columns = { hostNs: Float64Array.from(all, (s) => s.hostNs), x: Float64Array.from(all, (s) => s.x), y: Float64Array.from(all, (s) => s.y) };
  return { validations, columns };
}
