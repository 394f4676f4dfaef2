import { describe, expect, it } from 'vitest';
import type { GazeloomApi } from '../../../../app/contract';
import type { RunTargetProcedureRequest, RunTargetProcedureResponse } from '../../../../app/contract/schemas/targets';
import { angleBetween } from '../../../../app/core/geometry/display-geometry';
import { screenPoint } from '../../../../app/core/geometry/units';
import { applyRawCalibration } from '../../../../app/core/quality/correction';
import { tables, type ProtocolRecord, type SessionRecord } from '../../../../app/core/study/records';
import { describeCalibration, runCalibration } from '../../../../renderer/console/session/calibration-step';

const display = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 };
const session = { id: 's-1', display } as SessionRecord;
const protocol = { validationLayout: 5 } as ProtocolRecord;
// A tracker's raw space: a smooth map of the screen (pupil-to-glint vector, no fixed unit).
const toRaw = (x: number, y: number) => ({ x: 0.12 * ((x - 960) / 960) - 0.02 + 1e-6 * x * (y / 1080), y: 0.08 * ((y - 540) / 540) + 0.01 });

/** The two channels the calibrate step uses, answered as the host would for a source of `units`. */
function fakeApi(units: 'raw' | 'screen_px', lost: (i: number) => boolean = () => false) {
  const calls: { channel: string; payload: unknown }[] = [];
  const api = {
    setGazeCalibration: async (payload: unknown) => {
      calls.push({ channel: 'setGazeCalibration', payload });
      return { ok: true, value: { sourceUnits: units, mapping: false } };
    },
    runTargetProcedure: async (request: RunTargetProcedureRequest) => {
      calls.push({ channel: 'runTargetProcedure', payload: request });
      const points = request.points.map((p, index) => ({ x: p.x, y: p.y, accuracyDeg: units === 'raw' ? null : 0.3, precisionRmsS2SDeg: null, precisionSdDeg: null, dataLossPct: lost(index) ? 100 : 0, samples: lost(index) ? 0 : 250, dxDeg: null, dyDeg: null, index, targetId: `t${index}`, onsetHostNs: index, meanGaze: lost(index) ? null : units === 'raw' ? toRaw(p.x, p.y) : p }));
      const response: RunTargetProcedureResponse = { sessionId: 's-1', purpose: 'calibration', points, seed: 1, gazeUnits: units, startedHostNs: 10, endedHostNs: 20 };
      return { ok: true, value: response };
    },
  } as unknown as GazeloomApi;
  return { api, calls };
}

describe('the calibrate step', () => {
  it('for a raw-coordinate source: clears the old mapping, shows at least 9 points, fits the polynomial and reports residuals per point', async () => {
    const { api, calls } = fakeApi('raw');
    const r = await runCalibration(api, protocol, session);
    if (!r.ok) throw new Error(r.message);
    expect(calls[0]).toEqual({ channel: 'setGazeCalibration', payload: { params: null, calibrationId: null } });
    expect((calls[1]!.payload as RunTargetProcedureRequest).points).toHaveLength(9);
    expect(r.value.method).toBe('polynomial2');
    const raw = r.value.raw!;
    expect(raw.residuals).toHaveLength(9);
    r.value.points.forEach((p, i) => {
      const mapped = applyRawCalibration(raw.params, toRaw(p.x, p.y).x, toRaw(p.x, p.y).y);
      expect(p.accuracyDeg).toBeCloseTo(angleBetween(display, screenPoint(mapped.x, mapped.y), screenPoint(p.x, p.y)), 12);
      expect(raw.residuals[i]!.deg).toBeCloseTo(p.accuracyDeg!, 12);
    });
    // The records are valid as stored.
    for (const p of r.value.points) expect(() => tables.calibrations.shape.points.element.parse(p)).not.toThrow();
    expect(describeCalibration(r.value)).toMatch(/fitted by Gazeloom \(second-order polynomial on 9 of 9 points\): RMS residual \d\.\d\d°/);
  });

  it('leaves points without valid gaze out of the fit, and says so when too few remain', async () => {
    const some = await runCalibration(fakeApi('raw', (i) => i === 4).api, protocol, session);
    if (!some.ok) throw new Error(some.message);
    expect(some.value.raw!.residuals[4]).toMatchObject({ px: null, deg: null });
    expect(describeCalibration(some.value)).toContain('on 8 of 9 points');
    const few = await runCalibration(fakeApi('raw', (i) => i > 3).api, protocol, session);
    expect(few).toMatchObject({ ok: false, code: 'bad_input', message: expect.stringMatching(/at least 6 calibration points with valid gaze.*repeat the calibration/) });
  });

  it('for a tracker that calibrates itself: the protocol’s layout, the tracker’s own results, nothing fitted', async () => {
    const { api, calls } = fakeApi('screen_px');
    const r = await runCalibration(api, protocol, session);
    if (!r.ok) throw new Error(r.message);
    expect((calls[1]!.payload as RunTargetProcedureRequest).points).toHaveLength(5);
    expect(r.value).toMatchObject({ method: 'tracker', raw: null });
    expect(calls.filter((c) => c.channel === 'setGazeCalibration')).toHaveLength(1);
    expect(describeCalibration(r.value)).toBe('Calibration targets shown: 5.');
  });
});
