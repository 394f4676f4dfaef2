import type { TargetResult } from '../study/records';

/** Where the gaze sat relative to a drift-check target: degrees, right and down positive, and the angle between them. */
export interface DriftOffset {
  readonly dxDeg: number;
  readonly dyDeg: number;
  readonly offsetDeg: number;
}

/** The offset at one drift-check target; null when its window had no valid gaze. */
export function driftOffset(point: TargetResult): DriftOffset | null {
  if (point.accuracyDeg === null || point.dxDeg === null || point.dyDeg === null) return null;
  return { dxDeg: point.dxDeg, dyDeg: point.dyDeg, offsetDeg: point.accuracyDeg };
}

/** The offset of a drift check with one or a few targets: the mean over the targets with valid gaze. */
export function meanDriftOffset(points: readonly TargetResult[]): DriftOffset | null {
  const offsets = points.map(driftOffset).filter((o): o is DriftOffset => o !== null);
  if (offsets.length === 0) return null;
  const mean = (key: keyof DriftOffset) => offsets.reduce((sum, o) => sum + o[key], 0) / offsets.length;
  return { dxDeg: mean('dxDeg'), dyDeg: mean('dyDeg'), offsetDeg: mean('offsetDeg') };
}

/** A drift check against the protocol's threshold: accepted when its offset is at most driftDeg. */
export function summarizeDriftCheck(points: readonly TargetResult[], t: { driftDeg: number }): { offset: DriftOffset | null; accepted: boolean; reasons: string[] } {
  if (!(Number.isFinite(t.driftDeg) && t.driftDeg > 0)) throw new RangeError(`thresholds.driftDeg must be a number > 0, got ${t.driftDeg}`);
  const offset = meanDriftOffset(points);
  if (!offset) return { offset, accepted: false, reasons: ['no valid gaze samples at the drift-check target'] };
  if (offset.offsetDeg > t.driftDeg) return { offset, accepted: false, reasons: [`drift ${offset.offsetDeg.toFixed(2)}° exceeds ${t.driftDeg.toFixed(2)}°`] };
  return { offset, accepted: true, reasons: [] };
}
