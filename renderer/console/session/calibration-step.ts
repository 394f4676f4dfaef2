import type { GazeloomApi, Result } from '../../../app/contract';
import { angleBetween, screenPxToDeg, type DisplayGeometry } from '../../../app/core/geometry/display-geometry';
import { validationLayout } from '../../../app/core/quality';
import { applyRawCalibration, fitRawCalibration, type RawCalibrationParams } from '../../../app/core/quality/correction';
import { screenPoint } from '../../../app/core/geometry/units';
import { targetResult, type ProtocolRecord, type SessionRecord, type TargetResult } from '../../../app/core/study/records';

/** Gazeloom's fit of a raw-coordinate source: residual per calibration point, as shown and stored. */
export interface RawCalibrationResult {
  readonly params: RawCalibrationParams;
  readonly residuals: { x: number; y: number; px: number | null; deg: number | null }[];
  readonly rmsDeg: number;
}

export interface CalibrationOutcome {
  readonly method: 'tracker' | 'polynomial2';
  readonly points: TargetResult[];
  readonly startedHostNs: number;
  readonly endedHostNs: number;
  /** Set when the source sends raw coordinates and Gazeloom fitted its own calibration. */
  readonly raw: RawCalibrationResult | null;
}

/**
 * The calibrate step. A tracker that calibrates itself is shown the protocol's layout (on
 * the stage, and as control messages on the feed). A source that sends raw coordinates is
 * calibrated by Gazeloom: any earlier mapping is cleared first (the fit needs the raw
 * means), at least 9 points are shown (the second-order polynomial has 6 terms per axis),
 * and the polynomial is fitted on each point's mean raw gaze. Each point's result then
 * holds its residual: accuracy as the angle from the mapped gaze to the target.
 */
export async function runCalibration(api: GazeloomApi, protocol: ProtocolRecord, session: SessionRecord): Promise<Result<CalibrationOutcome>> {
  const cleared = await api.setGazeCalibration({ params: null, calibrationId: null });
  if (!cleared.ok) return cleared;
  const raw = cleared.value.sourceUnits === 'raw';
  const points = validationLayout(raw ? (Math.max(protocol.validationLayout, 9) as 9 | 13) : protocol.validationLayout, session.display);
  const r = await api.runTargetProcedure({ purpose: 'calibration', points, order: 'random' });
  if (!r.ok) return r;
  const shown = r.value.points;
  const times = { startedHostNs: r.value.startedHostNs, endedHostNs: r.value.endedHostNs };
  if (r.value.gazeUnits !== 'raw') return { ok: true, value: { method: 'tracker', points: shown.map((p) => targetResult.parse(p)), raw: null, ...times } };
  const valid = shown.filter((p) => p.meanGaze !== null);
  let fit: ReturnType<typeof fitRawCalibration>;
  try {
    fit = fitRawCalibration(valid.map((p) => ({ raw: p.meanGaze!, target: { x: p.x, y: p.y } })), session.display);
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    return { ok: false, code: 'bad_input', message: `the raw-coordinate calibration could not be fitted: ${error.message}; repeat the calibration` };
  }
  const residualOf = new Map(valid.map((p, i) => [p, fit.residuals[i]!]));
  const results = shown.map((p) => withResidual(targetResult.parse(p), fit.params, p.meanGaze, session.display));
  const residuals = shown.map((p) => ({ x: p.x, y: p.y, px: residualOf.get(p)?.px ?? null, deg: residualOf.get(p)?.deg ?? null }));
  return { ok: true, value: { method: 'polynomial2', points: results, raw: { params: fit.params, residuals, rmsDeg: fit.rmsDeg }, ...times } };
}

/** A calibration point's result with its residual: the mapped mean gaze against the target, in degrees. */
function withResidual(point: TargetResult, params: RawCalibrationParams, rawMean: { x: number; y: number } | null, g: DisplayGeometry): TargetResult {
  if (!rawMean) return point;
  const mapped = applyRawCalibration(params, rawMean.x, rawMean.y);
  const m = screenPxToDeg(g, screenPoint(mapped.x, mapped.y));
  const t = screenPxToDeg(g, screenPoint(point.x, point.y));
  return { ...point, accuracyDeg: angleBetween(g, screenPoint(mapped.x, mapped.y), screenPoint(point.x, point.y)), dxDeg: m.x - t.x, dyDeg: m.y - t.y };
}

/** A short line about a finished calibration, for the console. */
export function describeCalibration(outcome: CalibrationOutcome): string {
  if (!outcome.raw) return `Calibration targets shown: ${outcome.points.length}.`;
  const fitted = outcome.raw.residuals.filter((r) => r.deg !== null).length;
  return `Calibration fitted by Gazeloom (second-order polynomial on ${fitted} of ${outcome.points.length} points): RMS residual ${outcome.raw.rmsDeg.toFixed(2)}°.`;
}
