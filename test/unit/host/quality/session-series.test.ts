import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { sessionQualityResponse } from '../../../../app/contract/schemas/quality';
import { ManualClock } from '../../../../app/core/clock/host-clock';
import type { FrameRecord, GazeRecord } from '../../../../app/core/recording/records';
import { qualityHandlers } from '../../../../app/host/handlers/quality-handlers';
import { readSessionSeries } from '../../../../app/host/quality/session-series';
import { SessionRecorder } from '../../../../app/host/recording/session-recorder';

// A 25 s recording at 100 Hz whose losses are counted by hand (common practice, no source):
//   bin 0 (0–10 s):   samples 500–549 invalid (a blink)            → 950 of 1000 valid,  5 %
//   bin 1 (10–20 s):  samples 1200–1299 never arrived (a dropout)  → 900 of 1000,       10 %
//   bin 2 (20–25 s):  every tenth sample invalid                   → 450 of 500,        10 %
//   whole recording:  2300 valid of the 2500 expected                                     8 %
// Frames every 20 ms from 1 s before the first sample, every 100th late.
const root = mkdtempSync(join(tmpdir(), 'gz-quality-series-'));
const FIRST_NS = 2e9;
let dir: string;

function sample(k: number): GazeRecord {
  const invalid = (k >= 500 && k < 550) || (k >= 2000 && k % 10 === 0);
  const eye = invalid ? { x: Number.NaN, y: Number.NaN, valid: false, pupil: null } : { x: 900 + (k % 50), y: 500 + (k % 30), valid: true, pupil: 3.1 };
  const hostNs = FIRST_NS + k * 1e7;
  return { seq: k, trackerTimeS: 100 + k / 100, arrivalNs: hostNs + 3e6, hostNs, left: eye, right: null };
}

const frame = (f: number): FrameRecord => ({ frame: f, stageTimeMs: 500 + f * 20, hostNs: 1e9 + f * 2e7, clip: null, stimulusUs: null, eventsDrawn: 0, late: f % 100 === 0, photodiode: null });

beforeAll(async () => {
  dir = join(root, 'aisle-session');
  const clock = new ManualClock(1e9);
  const rec = await SessionRecorder.create(dir, { sessionId: 'aisle-session', display: { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 } }, { clock, timer: () => ({ cancel: () => undefined }) });
  rec.appendMessage({ hostNs: FIRST_NS, kind: 'tracker_hello', data: { protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 100, eyes: 'left', screen: null, pupilUnit: 'mm', source: 'bench tracker', peer: 'test' } });
  for (let k = 0; k < 2500; k++) if (k < 1200 || k >= 1300) rec.appendGaze(sample(k));
  rec.appendFrames(Array.from({ length: 1301 }, (_, f) => frame(f)));
  await rec.close();
});

describe('readSessionSeries: data loss and late frames per bin from a recording', () => {
  it('counts invalid and missing samples against the nominal rate, per 10 s bin and overall', async () => {
    const s = await readSessionSeries(dir);
    expect(s.firstSampleHostNs).toBe(FIRST_NS);
    expect(s.rateHz).toBe(100);
    expect(s.samples).toBe(2400);
    expect(s.dataLoss.binS).toBe(10);
    expect(s.dataLoss.valid).toEqual([950, 900, 450]);
    s.dataLoss.expected.forEach((e, i) => expect(e).toBeCloseTo([1000, 1000, 500][i]!, 6));
    s.dataLoss.pct.forEach((p, i) => expect(p).toBeCloseTo([5, 10, 10][i]!, 6));
    expect(s.dataLoss.overallPct).toBeCloseTo(8, 6);
  });

  it('bins frames on the same grid, keeping frames before the first sample in the totals only', async () => {
    const s = await readSessionSeries(dir);
    expect(s.lateFrames.frames).toEqual([500, 500, 251]);
    expect(s.lateFrames.late).toEqual([5, 5, 3]);
    expect(s.lateFrames.totalFrames).toBe(1301);
    expect(s.lateFrames.totalLate).toBe(14);
  });

  it('gives the gaze series in seconds from the first sample with NaN for invalid samples, and takes another bin width', async () => {
    const s = await readSessionSeries(dir, { binS: 5 });
    expect(s.gaze.timeS.length).toBe(2400);
    expect(s.gaze.timeS[0]).toBe(0);
    expect(s.gaze.timeS[1200]).toBeCloseTo(13, 9); // sample 1300, after the dropout
    expect(s.gaze.x[1]).toBe(901);
    expect(Number.isNaN(s.gaze.x[500]!)).toBe(true);
    expect(Number.isNaN(s.gaze.y[549]!)).toBe(true);
    expect(s.dataLoss.valid).toEqual([500, 450, 400, 500, 450]);
    await expect(readSessionSeries(dir, { binS: 0 })).rejects.toThrow(/binS must be a number > 0, got 0/);
  });
});

describe('getSessionQuality: the series over the contract', () => {
  const handlers = qualityHandlers(root);
  const context = { page: 'console' as const, connectionId: 'console-1' };

  it('answers with a response the contract accepts, with the gaze only when asked', async () => {
    const plain = await handlers.getSessionQuality({ sessionId: 'aisle-session' }, context);
    expect(sessionQualityResponse.safeParse(plain).success).toBe(true);
    expect(plain).not.toHaveProperty('gaze');
    expect(plain).toMatchObject({ firstSampleHostNs: FIRST_NS, samples: 2400, dataLoss: { valid: [950, 900, 450] } });
    const withGaze = await handlers.getSessionQuality({ sessionId: 'aisle-session', gaze: true, binS: 20 }, context);
    expect(sessionQualityResponse.safeParse(withGaze).success).toBe(true);
    expect((withGaze as { gaze: { x: Float32Array } }).gaze.x).toBeInstanceOf(Float32Array);
    expect((withGaze as { dataLoss: { valid: number[] } }).dataLoss.valid).toEqual([1850, 450]);
  });

  it('is not_found for a session without a recording and bad_input for a path', async () => {
    expect(await handlers.getSessionQuality({ sessionId: 'nobody' }, context)).toMatchObject({ ok: false, code: 'not_found' });
    expect(await handlers.getSessionQuality({ sessionId: '../aisle-session' }, context)).toMatchObject({ ok: false, code: 'bad_input', path: 'request.sessionId' });
  });
});
