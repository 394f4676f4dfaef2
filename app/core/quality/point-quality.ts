import { angleBetween, checkDisplayGeometry, screenPxToDeg, type DisplayGeometry } from '../geometry/display-geometry';
import { screenPoint, type ScreenPoint } from '../geometry/units';
import type { TargetResult } from '../study/records';
import { meanPosition, rmsAround, rmsSampleToSample } from './angular-rms';
import { dataLossPct } from './data-loss';
import type { TimedSample } from './sample-window';

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

function validPoint(s: TimedSample): ScreenPoint | null {
  return s.valid && Number.isFinite(s.x) && Number.isFinite(s.y) ? screenPoint(s.x, s.y) : null;
}

/** The window's valid samples and their mean position (screen px; null when none is valid). */
export function windowGaze(windowed: readonly TimedSample[]): { valid: ScreenPoint[]; mean: ScreenPoint | null } {
  const valid = windowed.map(validPoint).filter((p): p is ScreenPoint => p !== null);
  const mean = meanPosition(valid);
  return { valid, mean: mean ? screenPoint(mean.x, mean.y) : null };
}

/**
 * Accuracy, precision and data loss at one target from the samples of its window (screen
 * px), with angles seen from the eye at the viewing distance (atan2(|a×b|, a·b) of the two
 * rays, app/core/geometry), per Holmqvist, Nyström and Mulvey 2012 (ETRA):
 *   accuracyDeg         angle between the target and the mean position of the valid samples
 *   precisionRmsS2SDeg  RMS of the angles between successive samples, both valid
 *   precisionSdDeg      RMS of each valid sample's angle from the mean position
 *   dataLossPct         invalid (or missing) over `expected` samples
 *   dxDeg, dyDeg        the mean gaze's horizontal and vertical angle minus the target's
 *                       (atan of the offset from the centre over the distance, per axis;
 *                       right and down positive)
 * `samples` is the number of valid samples. Measures that need more samples than there
 * are (any with none valid; RMS-S2S without a valid pair) are null.
 */
export function pointQuality(target: { x: number; y: number }, windowed: readonly TimedSample[], expected: number, g: DisplayGeometry): TargetResult {
  checkDisplayGeometry(g);
  if (!Number.isFinite(target.x) || !Number.isFinite(target.y)) throw new RangeError(`target must be finite, got (${target.x}, ${target.y})`);
  const t = screenPoint(target.x, target.y);
  const angle = (a: ScreenPoint, b: ScreenPoint): number => angleBetween(g, a, b);
  const { valid, mean } = windowGaze(windowed);
  if (!mean) return pointWithoutAngles(target, 0, expected);
  const meanDeg = screenPxToDeg(g, mean);
  const targetDeg = screenPxToDeg(g, t);
  return {
    x: target.x,
    y: target.y,
    accuracyDeg: angle(mean, t),
    precisionRmsS2SDeg: finiteOrNull(rmsSampleToSample(windowed.map(validPoint), angle)),
    precisionSdDeg: rmsAround(valid, mean, angle),
    dataLossPct: dataLossPct(valid.length, expected),
    samples: valid.length,
    dxDeg: meanDeg.x - targetDeg.x,
    dyDeg: meanDeg.y - targetDeg.y,
  };
}

/**
 * A target's result when its samples cannot be turned into angles (none valid, or a tracker
 * sending raw coordinates before Gazeloom's calibration maps them): data loss only.
 */
export function pointWithoutAngles(target: { x: number; y: number }, valid: number, expected: number): TargetResult {
  return { x: target.x, y: target.y, accuracyDeg: null, precisionRmsS2SDeg: null, precisionSdDeg: null, dataLossPct: dataLossPct(valid, expected), samples: valid, dxDeg: null, dyDeg: null };
}
