import type { ProtocolRecord, SessionRecord, ValidationRecord } from '../study/records';
import { meanDriftOffset } from './drift';
import { driftRateDegPerMin } from './drift-rate';
import { summarizeValidation } from './validation-summary';

/**
 * The flags a session's quality can raise, in the order they are listed:
 *   validation_failed  the session's latest validation was not accepted by the protocol's thresholds
 *   no_validation      the session has no validation at all
 *   drift_exceeded     a drift check's offset exceeded the protocol's drift threshold
 *   drift_rate_high    the drift rate (least-squares line over the drift checks) exceeded driftRateDegPerMin
 *   data_loss_high     the session's data loss over its whole recording exceeded dataLossPct
 *   late_frames_high   the stage's late frames exceeded lateFramesPct of the frames it presented
 */
export const QUALITY_FLAGS = ['validation_failed', 'no_validation', 'drift_exceeded', 'drift_rate_high', 'data_loss_high', 'late_frames_high'] as const;
export type QualityFlag = (typeof QUALITY_FLAGS)[number];

/**
 * Limits beyond the protocol's own thresholds, with their defaults:
 *   dataLossPct 20: loss above 20–30 % is a usual reason to reject (Holmqvist, Nyström and Mulvey 2012, ETRA)
 *   driftRateDegPerMin 0.5: Gazeloom's default, no source (at that rate gaze drifts past the usual 1° limit in two minutes)
 *   lateFramesPct 1: the playback target of under 1 % late frames (common practice, no source)
 */
export const DEFAULT_QUALITY_LIMITS = { dataLossPct: 20, driftRateDegPerMin: 0.5, lateFramesPct: 1 } as const;

export type QualityThresholds = ProtocolRecord['thresholds'] & { dataLossPct?: number; driftRateDegPerMin?: number; lateFramesPct?: number };

export interface SessionQualityInput {
  readonly session: SessionRecord;
  /** Validations and drift checks; only the session's own are used. */
  readonly validations: readonly ValidationRecord[];
  /** Host time of the session's first gaze sample: the zero of every time_s (null without a recording). */
  readonly firstSampleHostNs: number | null;
  /** Data loss over the whole recording (overallPct) and per bin, or null without a recording. */
  readonly dataLoss: { readonly binS: number; readonly pct: readonly (number | null)[]; readonly overallPct: number | null } | null;
  /** The frame log's totals, or null without a frame log. */
  readonly lateFrames: { readonly frames: number; readonly late: number } | null;
  readonly thresholds: QualityThresholds;
}

export interface ValidationQuality {
  /** Seconds from the session's first sample to the validation's start; null without a recording. */
  readonly time_s: number | null;
  readonly mean_accuracy_deg: number | null;
  readonly max_accuracy_deg: number | null;
  /** Means over the points that have the measure. */
  readonly precision_rms_s2s_deg: number | null;
  readonly precision_sd_deg: number | null;
  readonly data_loss_pct: number | null;
  readonly accepted: boolean;
}

export interface DriftQuality {
  readonly time_s: number | null;
  /** Mean offset over the check's targets with valid gaze (null when none had any), degrees, right and down positive. */
  readonly dx_deg: number | null;
  readonly dy_deg: number | null;
  readonly offset_deg: number | null;
}

/** One session's quality, snake_case because the command line prints it as it is. */
export interface SessionQuality {
  readonly session: string;
  readonly participant: string;
  readonly validations: ValidationQuality[];
  readonly drift: DriftQuality[];
  readonly drift_rate_deg_per_min: number | null;
  readonly data_loss_pct: number | null;
  readonly late_frames_pct: number | null;
  readonly flags: QualityFlag[];
}

function limit(value: number | undefined, fallback: number, name: string): number {
  const v = value ?? fallback;
  if (!(Number.isFinite(v) && v >= 0)) throw new RangeError(`thresholds.${name} must be a number >= 0, got ${v}`);
  return v;
}

/**
 * A session's validations, drift checks, drift rate, data loss and late frames against the
 * thresholds, with the flags they raise. Validation figures are the records' own (mean and
 * largest accuracy, accepted) with precision and data loss averaged over the points; the
 * drift rate is the least-squares slope over the drift checks that had valid gaze.
 */
export function sessionQuality(input: SessionQualityInput): SessionQuality {
  const { session, thresholds: t } = input;
  const limits = {
    dataLossPct: limit(t.dataLossPct, DEFAULT_QUALITY_LIMITS.dataLossPct, 'dataLossPct'),
    driftRateDegPerMin: limit(t.driftRateDegPerMin, DEFAULT_QUALITY_LIMITS.driftRateDegPerMin, 'driftRateDegPerMin'),
    lateFramesPct: limit(t.lateFramesPct, DEFAULT_QUALITY_LIMITS.lateFramesPct, 'lateFramesPct'),
  };
  const first = input.firstSampleHostNs;
  const timeS = (hostNs: number): number | null => (first === null ? null : (hostNs - first) / 1e9);
  const own = input.validations.filter((v) => v.sessionId === session.id).sort((a, b) => a.hostNs - b.hostNs);

  const validationRecords = own.filter((v) => v.kind === 'validation');
  const validations = validationRecords.map((v): ValidationQuality => {
    const s = summarizeValidation(v.points, t);
    return { time_s: timeS(v.hostNs), mean_accuracy_deg: v.meanAccuracyDeg, max_accuracy_deg: v.maxAccuracyDeg, precision_rms_s2s_deg: s.meanPrecisionRmsS2SDeg, precision_sd_deg: s.meanPrecisionSdDeg, data_loss_pct: s.dataLossPct, accepted: v.accepted };
  });
  const checks = own.filter((v) => v.kind === 'drift_check');
  const drift = checks.map((v): DriftQuality => {
    const o = meanDriftOffset(v.points);
    return { time_s: timeS(v.hostNs), dx_deg: o?.dxDeg ?? null, dy_deg: o?.dyDeg ?? null, offset_deg: o?.offsetDeg ?? null };
  });
  const measured = checks.map((v, i) => ({ hostNs: v.hostNs, offset: drift[i]!.offset_deg })).filter((d): d is { hostNs: number; offset: number } => d.offset !== null);
  // Times from the first measured check keep the least-squares sums small.
  const rate = driftRateDegPerMin(
    measured.map((d) => (d.hostNs - measured[0]!.hostNs) / 1e9),
    measured.map((d) => d.offset),
  );

  const dataLossPct = input.dataLoss?.overallPct ?? null;
  const frames = input.lateFrames;
  const lateFramesPct = frames && frames.frames > 0 ? (frames.late / frames.frames) * 100 : null;
  const raised = new Set<QualityFlag>();
  if (validationRecords.length === 0) raised.add('no_validation');
  else if (!validationRecords.at(-1)!.accepted) raised.add('validation_failed');
  if (measured.some((d) => d.offset > t.driftDeg)) raised.add('drift_exceeded');
  if (rate !== null && Math.abs(rate) > limits.driftRateDegPerMin) raised.add('drift_rate_high');
  if (dataLossPct !== null && dataLossPct > limits.dataLossPct) raised.add('data_loss_high');
  if (lateFramesPct !== null && lateFramesPct > limits.lateFramesPct) raised.add('late_frames_high');

  return {
    session: session.id,
    participant: session.participantId,
    validations,
    drift,
    drift_rate_deg_per_min: rate,
    data_loss_pct: dataLossPct,
    late_frames_pct: lateFramesPct,
    flags: QUALITY_FLAGS.filter((f) => raised.has(f)),
  };
}
