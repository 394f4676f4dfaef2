import { describe, expect, it } from 'vitest';
import { angleBetween, screenPxToDeg, type ScreenPoint } from '../../../../app/core/geometry';
import type { TrackerRecord } from '../../../../app/core/tracker-sim';
import { at, centroid, DISPLAY, fitLine, point, rmsS2S, simulate, stdAround, STILL_EYE } from './helpers';

const dist = (a: ScreenPoint, b: ScreenPoint) => angleBetween(DISPLAY, a, b);
const valid = (records: readonly TrackerRecord[]) => records.filter((r) => r.sample.left!.valid);

describe('measurement noise', () => {
  // A still eye on a fixed point: whatever moves in the reported gaze is the tracker's noise.
  function fixation(noiseDeg: number, x: number, y: number): TrackerRecord[] {
    return valid(simulate({ rateHz: 1000, seed: 31, noiseDeg, eyeMotion: STILL_EYE }, 40, [{ atS: 0, target: point(x, y) }]).filter((r) => r.hostS > 11.5));
  }

  for (const [noiseDeg, x, y, where] of [[0.02, 960, 540, 'at the centre'], [0.1, 960, 540, 'at the centre'], [0.05, 1650, 150, '18° off-centre']] as const) {
    it(`has an RMS of noiseDeg = ${noiseDeg}° ${where}, as white noise does: RMS-S2S/STD ≈ √2 (REFERENCES.md section 3, Holmqvist et al. 2012)`, () => {
      const records = fixation(noiseDeg, x, y);
      const eye = records[0]!.trueGaze;
      expect(records.every((r) => r.trueGaze.x === eye.x && r.trueGaze.y === eye.y)).toBe(true);
      for (const side of ['left', 'right'] as const) {
        const gaze = records.map((r) => at(r.sample[side]!));
        // Around the true gaze: the noise level itself; around the centroid: the STD of REFERENCES.
        expect(stdAround(gaze, eye, dist) / noiseDeg).toBeCloseTo(1, 1);
        const std = stdAround(gaze, centroid(gaze), dist);
        expect(Math.abs(std / noiseDeg - 1)).toBeLessThan(0.02);
        // numpy's 200k-sample white noise gives 1.41573 (REFERENCES.md section 3); ours has about 38k samples.
        expect(Math.abs(rmsS2S(gaze, dist) / std - Math.SQRT2)).toBeLessThan(0.015);
      }
    });
  }

  it('is independent between the eyes and absent at noiseDeg 0', () => {
    const records = fixation(0.05, 700, 400);
    const l = records.map((r) => at(r.sample.left!).x - r.trueGaze.x);
    const r = records.map((rec) => at(rec.sample.right!).x - rec.trueGaze.x);
    const corr = l.reduce((s, v, i) => s + v * r[i]!, 0) / Math.sqrt(l.reduce((s, v) => s + v * v, 0) * r.reduce((s, v) => s + v * v, 0));
    expect(Math.abs(corr)).toBeLessThan(0.03);
    expect(fixation(0, 700, 400).every((rec) => rec.sample.left!.x === rec.trueGaze.x && rec.sample.left!.y === rec.trueGaze.y)).toBe(true);
  });
});

describe('accuracy offset and drift', () => {
  const everywhere = [{ atS: 0, target: point(100, 100) }, { atS: 2, target: point(1800, 950) }, { atS: 4, target: { kind: 'idle' } as const }];

  it('shows the accuracy offset as a constant bias of accuracyOffsetDeg, wherever the gaze is', () => {
    const records = valid(simulate({ rateHz: 200, seed: 6, noiseDeg: 0, accuracyOffsetDeg: 0.8 }, 10, everywhere));
    for (const r of records) for (const side of ['left', 'right'] as const) expect(dist(r.trueGaze, at(r.sample[side]!))).toBeCloseTo(0.8, 9);
    // Constant in direction too: the same per-axis offset at the same place, early and late.
    const still = valid(simulate({ rateHz: 200, seed: 6, noiseDeg: 0, accuracyOffsetDeg: 0.8, eyeMotion: STILL_EYE }, 60, [{ atS: 0, target: point(960, 540) }]));
    const offset = (r: TrackerRecord) => {
      const a = screenPxToDeg(DISPLAY, at(r.sample.left!));
      const t = screenPxToDeg(DISPLAY, r.trueGaze);
      return [a.x - t.x, a.y - t.y];
    };
    const early = offset(still.find((r) => r.hostS > 12)!);
    const late = offset(still.at(-1)!);
    expect(late[0]).toBeCloseTo(early[0]!, 9);
    expect(late[1]).toBeCloseTo(early[1]!, 9);
  });

  it('grows the drift at driftDegPerMin from the first sample, in a direction fixed by the seed', () => {
    const records = valid(simulate({ rateHz: 200, seed: 6, noiseDeg: 0, driftDegPerMin: 1.5 }, 180, everywhere));
    for (const r of records) expect(dist(r.trueGaze, at(r.sample.left!))).toBeCloseTo((1.5 * (r.hostS - 10)) / 60, 9);
    const direction = (seed: number) => {
      const r = valid(simulate({ rateHz: 50, seed, noiseDeg: 0, driftDegPerMin: 6, eyeMotion: STILL_EYE }, 30)).at(-1)!;
      const a = screenPxToDeg(DISPLAY, at(r.sample.left!));
      const t = screenPxToDeg(DISPLAY, r.trueGaze);
      return Math.atan2(a.y - t.y, a.x - t.x);
    };
    expect(direction(6)).toBe(direction(6));
    expect(Math.abs(direction(6) - direction(7))).toBeGreaterThan(0.01);
  });

  it('shows through the noise as a linear trend of the mean offset', () => {
    const records = valid(simulate({ rateHz: 500, seed: 9, driftDegPerMin: 1, noiseDeg: 0.05 }, 240));
    const windows = Array.from({ length: 24 }, (_, w) => records.filter((r) => r.hostS >= 10 + 10 * w && r.hostS < 20 + 10 * w));
    // The offset of the mean gaze (REFERENCES.md section 3), per axis near the centre, so the noise averages out.
    const meanOffset = windows.map((ws) => {
      const d = ws.map((r) => [screenPxToDeg(DISPLAY, at(r.sample.left!)), screenPxToDeg(DISPLAY, r.trueGaze)] as const);
      return Math.hypot(d.reduce((s, [a, t]) => s + a.x - t.x, 0) / ws.length, d.reduce((s, [a, t]) => s + a.y - t.y, 0) / ws.length);
    });
    const fit = fitLine(windows.map((_, w) => (5 + 10 * w) / 60), meanOffset);
    expect(fit.slope).toBeCloseTo(1, 1);
    expect(Math.abs(fit.slope - 1)).toBeLessThan(0.03);
  });

  it('adds the accuracy offset and the drift as angles', () => {
    const records = valid(simulate({ rateHz: 100, seed: 2, noiseDeg: 0, accuracyOffsetDeg: 0.5, driftDegPerMin: 2 }, 120));
    const first = dist(records[0]!.trueGaze, at(records[0]!.sample.left!));
    expect(first).toBeCloseTo(0.5, 9);
    const later = records.map((r) => dist(r.trueGaze, at(r.sample.left!)));
    // |a + d(t)| lies between |a − |d|| and a + |d|.
    records.forEach((r, i) => {
      const d = (2 * (r.hostS - 10)) / 60;
      expect(later[i]!).toBeGreaterThanOrEqual(Math.abs(0.5 - d) - 1e-9);
      expect(later[i]!).toBeLessThanOrEqual(0.5 + d + 1e-9);
    });
  });
});
