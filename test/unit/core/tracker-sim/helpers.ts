import { angleBetween, screenPoint, type DisplayGeometry, type ScreenPoint } from '../../../../app/core/geometry';
import type { EyeSample } from '../../../../app/core/gaze/gaze-sample';
import { SimulatedTracker, type EyeMotionParams, type LookTarget, type TrackerRecord, type TrackerSimOptions } from '../../../../app/core/tracker-sim';

/** A 53 x 29.8 cm, 1920 x 1080 screen at 60 cm (the screen of REFERENCES.md section 1). */
export const DISPLAY: DisplayGeometry = { widthMm: 530, heightMm: 298.125, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
export const CENTRE = screenPoint(960, 540);

/** An eye that holds still on its target: no fixational wander, no microsaccades. */
export const STILL_EYE: Partial<EyeMotionParams> = { fixationalSdDeg: 0, microsaccadeRateHz: 0 };
/** No blinks within any test's run. */
export const NO_BLINKS: Partial<EyeMotionParams> = { blinkIntervalMinS: 1e6, blinkIntervalMaxS: 1e6 };

type Options = Omit<TrackerSimOptions, 'display' | 'startHostS'> & { display?: DisplayGeometry; startHostS?: number };

/** Runs a tracker from startHostS (10 s by default) for durationS with looks set at offsets from the start. */
export function simulate(options: Options, durationS: number, looks: readonly { atS: number; target: LookTarget }[] = []): TrackerRecord[] {
  const startHostS = options.startHostS ?? 10;
  const tracker = new SimulatedTracker({ display: DISPLAY, ...options, startHostS });
  for (const { atS, target } of looks) tracker.setLook(target, startHostS + atS);
  return tracker.samplesUntil(startHostS + durationS);
}

export const point = (x: number, y: number): LookTarget => ({ kind: 'point', x, y });
export const at = (e: EyeSample): ScreenPoint => screenPoint(e.x, e.y);

/** Angular speed (deg/s) between consecutive records, by backward difference of the given positions; NaN for the first. */
export function speeds(records: readonly TrackerRecord[], position: (r: TrackerRecord) => ScreenPoint, g: DisplayGeometry = DISPLAY): number[] {
  return records.map((r, i) => (i === 0 ? Number.NaN : angleBetween(g, position(records[i - 1]!), position(r)) / (r.hostS - records[i - 1]!.hostS)));
}

/** Runs of consecutive indices where `inside` holds: [first, last] pairs. */
export function runs(n: number, inside: (i: number) => boolean): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    if (!inside(i)) continue;
    let j = i;
    while (j + 1 < n && inside(j + 1)) j++;
    out.push([i, j]);
    i = j;
  }
  return out;
}

/**
 * Precision measures of Holmqvist, Nyström & Mulvey (2012), "Eye tracker data quality:
 * what it is and how to measure it", Proc. ETRA, pp. 45-52, as REFERENCES.md section 3
 * defines them, over any points with a distance in degrees:
 *   RMS-S2S = √(mean θᵢ²), θᵢ the angle between successive samples;
 *   STD = √(mean d(pᵢ, p̄)²), the population form, around the centroid p̄.
 */
export function rmsS2S<P>(points: readonly P[], distance: (a: P, b: P) => number): number {
  let sum = 0;
  for (let i = 1; i < points.length; i++) sum += distance(points[i - 1]!, points[i]!) ** 2;
  return Math.sqrt(sum / (points.length - 1));
}

export function stdAround<P>(points: readonly P[], centroid: P, distance: (a: P, b: P) => number): number {
  return Math.sqrt(points.reduce((s, p) => s + distance(p, centroid) ** 2, 0) / points.length);
}

export function centroid(points: readonly ScreenPoint[]): ScreenPoint {
  return screenPoint(points.reduce((s, p) => s + p.x, 0) / points.length, points.reduce((s, p) => s + p.y, 0) / points.length);
}

/** Ordinary least squares y = a + b·x (common practice, no source). */
export function fitLine(x: readonly number[], y: readonly number[]): { intercept: number; slope: number } {
  const n = x.length;
  const mx = x.reduce((a, b) => a + b, 0) / n;
  const my = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i]! - mx) * (y[i]! - my);
    sxx += (x[i]! - mx) ** 2;
  }
  const slope = sxy / sxx;
  return { intercept: my - slope * mx, slope };
}
