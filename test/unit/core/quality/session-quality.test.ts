import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { QUALITY_FLAGS, sessionQuality, type SessionQualityInput } from '../../../../app/core/quality';
import type { SessionRecord, TargetResult, ValidationRecord } from '../../../../app/core/study/records';

const FIRST_NS = 7e9;
const thresholds = { validationMeanDeg: 1.0, validationMaxDeg: 1.5, driftDeg: 1.5 };

const session: SessionRecord = {
  id: 'aisle-session-1',
  studyId: 'aisle-study',
  participantId: 'aisle-participant-4',
  protocolId: 'aisle-protocol',
  protocolVersion: 1,
  operatorId: 'op',
  startedAt: '2026-01-05T09:00:00.000Z',
  endedAt: null,
  state: 'completed',
  counterbalance: { kind: 'none', seed: null, row: null },
  display: { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 },
  gazeSource: 'simulated',
  demo: false,
};

const point = (over: Partial<TargetResult>): TargetResult => ({ x: 960, y: 540, accuracyDeg: 0.5, precisionRmsS2SDeg: 0.02, precisionSdDeg: 0.03, dataLossPct: 0, samples: 500, dxDeg: 0.3, dyDeg: -0.4, ...over });

let n = 0;
function record(kind: ValidationRecord['kind'], atS: number, points: TargetResult[], accepted: boolean, sessionId = session.id): ValidationRecord {
  const accuracies = points.map((p) => p.accuracyDeg).filter((a): a is number => a !== null);
  const mean = accuracies.length ? accuracies.reduce((a, b) => a + b, 0) / accuracies.length : null;
  return { id: `v${n++}`, sessionId, trialId: `t${n}`, kind, at: '2026-01-05T09:00:00.000Z', hostNs: FIRST_NS + atS * 1e9, points, meanAccuracyDeg: mean, maxAccuracyDeg: accuracies.length ? Math.max(...accuracies) : null, accepted };
}

const drift = (atS: number, offsetDeg: number) => record('drift_check', atS, [point({ accuracyDeg: offsetDeg, dxDeg: offsetDeg, dyDeg: 0 })], offsetDeg <= thresholds.driftDeg);

function input(over: Partial<SessionQualityInput>): SessionQualityInput {
  return { session, validations: [record('validation', 20, [point({})], true)], firstSampleHostNs: FIRST_NS, dataLoss: { binS: 10, pct: [4, 6], overallPct: 5 }, lateFrames: { frames: 1000, late: 3 }, thresholds, ...over };
}

describe('sessionQuality: a session against its thresholds', () => {
  it('reports each validation with its record figures, precision and data loss averaged over the points, times from the first sample', () => {
    const v = record('validation', 12.5, [point({ accuracyDeg: 0.4, precisionRmsS2SDeg: 0.02, precisionSdDeg: 0.05, dataLossPct: 10 }), point({ accuracyDeg: 0.8, precisionRmsS2SDeg: null, precisionSdDeg: 0.07, dataLossPct: 30 })], true);
    const q = sessionQuality(input({ validations: [v] }));
    expect(q.session).toBe('aisle-session-1');
    expect(q.participant).toBe('aisle-participant-4');
    expect(q.validations).toHaveLength(1);
    const got = q.validations[0]!;
    expect(got.time_s).toBeCloseTo(12.5, 9);
    expect(got.mean_accuracy_deg).toBeCloseTo(0.6, 12);
    expect(got.max_accuracy_deg).toBe(0.8);
    expect(got.precision_rms_s2s_deg).toBe(0.02); // the one point that has it
    expect(got.precision_sd_deg).toBeCloseTo(0.06, 12);
    expect(got.data_loss_pct).toBe(20);
    expect(got.accepted).toBe(true);
    expect(q.data_loss_pct).toBe(5);
    expect(q.late_frames_pct).toBeCloseTo(0.3, 12);
    expect(q.flags).toEqual([]);
  });

  it('gives drift-check offsets and the drift rate equal to numpy.polyfit on the same checks (quality_reference.py, numpy 1.24)', () => {
    const stored = JSON.parse(readFileSync(join(__dirname, '../../../fixtures/quality/quality_reference.json'), 'utf8')) as { drift: { t: number[]; offset: number[]; rate_deg_per_min: number }[] };
    const set = stored.drift[0]!;
    const q = sessionQuality(input({ validations: set.t.map((t, i) => drift(t, set.offset[i]!)), thresholds: { ...thresholds, driftDeg: 100, driftRateDegPerMin: 10 } }));
    expect(q.drift.map((d) => d.offset_deg)).toEqual(set.offset);
    expect(q.drift.map((d) => d.dx_deg)).toEqual(set.offset);
    q.drift.forEach((d, i) => expect(Math.abs(d.time_s! - set.t[i]!)).toBeLessThan(1e-6));
    expect(Math.abs(q.drift_rate_deg_per_min! - set.rate_deg_per_min)).toBeLessThan(1e-9);
  });

  it('flags drift_exceeded above the drift threshold only, and drift_rate_high above the rate limit', () => {
    const at = (offsets: number[]) => sessionQuality(input({ validations: [record('validation', 1, [point({})], true), ...offsets.map((o, i) => drift(60 + i * 60, o))] }));
    expect(at([0.5, 1.5]).flags).toEqual(['drift_rate_high']); // 1.5° is at the drift threshold, not above it; 1°/min is above 0.5
    expect(at([0.5, 1.5]).drift_rate_deg_per_min).toBeCloseTo(1, 12);
    expect(sessionQuality(input({ validations: [drift(60, 0.5), drift(120, 1.5)], thresholds: { ...thresholds, driftRateDegPerMin: 1.2 } })).flags).toEqual(['no_validation']);
    expect(at([0.5, 1.6]).flags).toEqual(['drift_exceeded', 'drift_rate_high']);
    expect(at([1.0, 1.2]).flags).toEqual([]); // 0.2°/min
    expect(at([1.6]).flags).toEqual(['drift_exceeded']);
    expect(at([1.6]).drift_rate_deg_per_min).toBeNull(); // one check gives no line
  });

  it('leaves checks without valid gaze out of the rate, with null offsets', () => {
    const empty = record('drift_check', 90, [point({ accuracyDeg: null, dxDeg: null, dyDeg: null })], false);
    const q = sessionQuality(input({ validations: [drift(30, 0.4), empty, drift(150, 0.6)] }));
    expect(q.drift[1]).toEqual({ time_s: 90, dx_deg: null, dy_deg: null, offset_deg: null });
    expect(q.drift_rate_deg_per_min).toBeCloseTo(0.1, 12);
  });

  it('flags validation_failed by the latest validation, and no_validation without any', () => {
    const failed = record('validation', 10, [point({ accuracyDeg: 2 })], false);
    const passed = record('validation', 30, [point({})], true);
    expect(sessionQuality(input({ validations: [passed, failed] })).flags).toEqual([]); // sorted by time: the repeat passed
    expect(sessionQuality(input({ validations: [record('validation', 40, [point({ accuracyDeg: 2 })], false), passed] })).flags).toEqual(['validation_failed']);
    expect(sessionQuality(input({ validations: [] })).flags).toEqual(['no_validation']);
    expect(sessionQuality(input({ validations: [record('validation', 5, [point({})], true, 'another-session')] })).flags).toEqual(['no_validation']);
  });

  it('flags data_loss_high above 20 % by default or the given limit, and late_frames_high above 1 %', () => {
    expect(sessionQuality(input({ dataLoss: { binS: 10, pct: [20], overallPct: 20 } })).flags).toEqual([]);
    expect(sessionQuality(input({ dataLoss: { binS: 10, pct: [20.5], overallPct: 20.5 } })).flags).toEqual(['data_loss_high']);
    expect(sessionQuality(input({ dataLoss: { binS: 10, pct: [12], overallPct: 12 }, thresholds: { ...thresholds, dataLossPct: 10 } })).flags).toEqual(['data_loss_high']);
    expect(sessionQuality(input({ lateFrames: { frames: 100, late: 1 } })).flags).toEqual([]);
    expect(sessionQuality(input({ lateFrames: { frames: 100, late: 2 } })).flags).toEqual(['late_frames_high']);
    expect(sessionQuality(input({ lateFrames: { frames: 0, late: 0 } })).late_frames_pct).toBeNull();
  });

  it('has null times and data loss without a recording, and lists flags in the vocabulary order', () => {
    const q = sessionQuality(input({ firstSampleHostNs: null, dataLoss: null, lateFrames: null, validations: [record('validation', 3, [point({ accuracyDeg: 2 })], false), drift(50, 2), drift(80, 4)] }));
    expect(q.validations[0]!.time_s).toBeNull();
    expect(q.drift.map((d) => d.time_s)).toEqual([null, null]);
    expect(q.data_loss_pct).toBeNull();
    expect(q.drift_rate_deg_per_min).toBeCloseTo(4, 12); // the rate needs no recording: 2° in 30 s
    expect(q.flags).toEqual(['validation_failed', 'drift_exceeded', 'drift_rate_high']);
    expect(QUALITY_FLAGS.filter((f) => q.flags.includes(f))).toEqual(q.flags);
  });

  it('refuses a negative or non-finite limit, naming it', () => {
    expect(() => sessionQuality(input({ thresholds: { ...thresholds, dataLossPct: -1 } }))).toThrow(/thresholds.dataLossPct must be a number >= 0, got -1/);
    expect(() => sessionQuality(input({ thresholds: { ...thresholds, lateFramesPct: Number.NaN } }))).toThrow(/lateFramesPct/);
  });
});
