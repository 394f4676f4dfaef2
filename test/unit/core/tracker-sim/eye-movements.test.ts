import { describe, expect, it } from 'vitest';
import { angleBetween, degToScreenPx, placeSensor, sensorPoint, sensorToScreen, type ScreenPoint } from '../../../../app/core/geometry';
import { formatTracksTsv, type TrackRow } from '../../../../app/core/sim/track-rows';
import { parseTracksTsv, type LookTarget } from '../../../../app/core/tracker-sim';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { at, centroid, DISPLAY, fitLine, NO_BLINKS, point, rmsS2S, runs, simulate, speeds, stdAround, STILL_EYE } from './helpers';

const RATE_HZ = 1000;

describe('saccades', () => {
  // Forty targets 1-25° apart, each shown for 1.2 s; noise-free output of a still eye, so
  // the gaze moves only during saccades and any movement between samples marks one.
  const rng = new Xoshiro128(77);
  const looks = Array.from({ length: 40 }, (_, i) => {
    const p = degToScreenPx(DISPLAY, (rng.next() - 0.5) * 36, (rng.next() - 0.5) * 20);
    return { atS: 0.5 + 1.2 * i, target: point(p.x, p.y) };
  });
  const records = simulate({ rateHz: RATE_HZ, seed: 12, noiseDeg: 0, eyeMotion: { ...STILL_EYE, ...NO_BLINKS } }, 49, looks);
  const v = speeds(records, (r) => at(r.sample.left!));
  const saccades = runs(records.length, (i) => v[i]! > 0).map(([i, j]) => ({
    onsetS: records[i - 1]!.hostS,
    amplitudeDeg: angleBetween(DISPLAY, at(records[i - 1]!.sample.left!), at(records[j]!.sample.left!)),
    durationS: (j - i + 1) / RATE_HZ,
    peakDegPerS: Math.max(...v.slice(i, j + 1)),
  }));

  it('last the main-sequence duration D = 2.2·A + 21 ms (Carpenter 1988), to the sample', () => {
    expect(saccades.length).toBeGreaterThanOrEqual(40);
    // The gaze moves on every sample after onset until the first sample at or past onset + D.
    for (const s of saccades) {
      const expectedS = (2.2 * s.amplitudeDeg + 21) / 1000;
      expect(s.durationS - expectedS).toBeGreaterThanOrEqual(-1e-9);
      expect(s.durationS - expectedS).toBeLessThan(1 / RATE_HZ + 1e-9);
    }
    // And a straight-line fit of duration on amplitude recovers the coefficients (half a sample of bias removed).
    const fit = fitLine(saccades.map((s) => s.amplitudeDeg), saccades.map((s) => (s.durationS - 0.5 / RATE_HZ) * 1000));
    expect(fit.slope).toBeCloseTo(2.2, 1);
    expect(Math.abs(fit.intercept - 21)).toBeLessThan(0.5);
    expect(Math.max(...saccades.map((s) => s.amplitudeDeg))).toBeGreaterThan(15);
  });

  it('have a minimum-jerk velocity profile: peak velocity 1.875·A/D (Flash & Hogan 1985), growing with amplitude', () => {
    for (const s of saccades.filter((x) => x.amplitudeDeg > 2)) {
      const d = (2.2 * s.amplitudeDeg + 21) / 1000;
      expect(s.peakDegPerS / ((1.875 * s.amplitudeDeg) / d)).toBeCloseTo(1, 1);
    }
    const big = saccades.filter((s) => s.amplitudeDeg > 15).map((s) => s.peakDegPerS);
    const small = saccades.filter((s) => s.amplitudeDeg < 5).map((s) => s.peakDegPerS);
    // About 500°/s for 20° and 100-300°/s for a few degrees: the shape of the main sequence.
    expect(Math.min(...big)).toBeGreaterThan(Math.max(...small));
    expect(Math.min(...big)).toBeGreaterThan(400);
  });

  it('start about 200 ms after a target appears (Carpenter 1988, value from memory), then small corrections bring the eye onto it', () => {
    for (const { atS, target } of looks) {
      const onsetS = 10 + atS;
      const first = saccades.find((s) => s.onsetS >= onsetS - 1e-9);
      if (target.kind !== 'point' || !first || first.amplitudeDeg < 1) continue;
      expect(first.onsetS - onsetS).toBeGreaterThanOrEqual(0.1);
      expect(first.onsetS - onsetS).toBeLessThan(0.32);
      const settled = records.find((r) => r.hostS >= onsetS + 1.15)!;
      expect(angleBetween(DISPLAY, at(settled.sample.left!), at({ x: target.x, y: target.y, valid: true, pupil: null }))).toBeLessThan(0.4);
    }
  });

  it('make microsaccades during steady fixation, at about 1 a second (Martinez-Conde et al. 2004, value from memory)', () => {
    const target = point(1200, 400);
    const eyeMotion = { ...NO_BLINKS, fixationalSdDeg: 0 };
    const fixating = simulate({ rateHz: RATE_HZ, seed: 3, noiseDeg: 0, eyeMotion }, 70, [{ atS: 0, target }]).filter((r) => r.hostS > 20);
    const fv = speeds(fixating, (r) => r.trueGaze);
    const micro = runs(fixating.length, (i) => fv[i]! > 0);
    // Poisson with a mean of 60 in 60 s: within about 3 standard deviations.
    expect(micro.length).toBeGreaterThan(36);
    expect(micro.length).toBeLessThan(84);
    const away = fixating.map((r) => angleBetween(DISPLAY, r.trueGaze, at({ x: 1200, y: 400, valid: true, pupil: null })));
    expect(Math.max(...away)).toBeLessThan(0.5);
  });

  it('wander during fixation as a slow, correlated drift of fixationalSdDeg, not as white noise (REFERENCES.md section 3: white noise has RMS-S2S/STD = √2)', () => {
    const eyeMotion = { ...NO_BLINKS, microsaccadeRateHz: 0 };
    const fixating = simulate({ rateHz: RATE_HZ, seed: 4, noiseDeg: 0, eyeMotion }, 70, [{ atS: 0, target: point(800, 600) }]).filter((r) => r.hostS > 20);
    const gaze = fixating.map((r) => r.trueGaze);
    const dist = (a: ScreenPoint, b: ScreenPoint) => angleBetween(DISPLAY, a, b);
    const std = stdAround(gaze, centroid(gaze), dist);
    expect(std).toBeGreaterThan(0.04);
    expect(std).toBeLessThan(0.06);
    expect(rmsS2S(gaze, dist) / std).toBeLessThan(0.2);
  });
});

describe('smooth pursuit', () => {
  // A small parcel shuttling across the sensor at 200 px/s, about 12°/s on this screen.
  const rows: TrackRow[] = Array.from({ length: 12001 }, (_, ms) => {
    const phase = (ms / 1000) % 6;
    const cx = phase < 3 ? 20 + 200 * phase : 620 - 200 * (phase - 3);
    return { tS: ms / 1000, objectId: 100, kind: 'parcel', cx, cy: 240, x0: cx - 3, y0: 237, x1: cx + 3, y1: 243 };
  });
  const tracks = parseTracksTsv(formatTracksTsv(rows), 'TRACKS.tsv');
  const placement = placeSensor({ width: 640, height: 480 }, DISPLAY, 'fit');
  const clip: LookTarget = { kind: 'clip', tracks, placement, clipStartHostS: 10, speed: 1 };
  const records = simulate({ rateHz: RATE_HZ, seed: 2, noiseDeg: 0, eyeMotion: NO_BLINKS }, 12, [{ atS: 0, target: clip }]);
  const objectAt = (hostS: number) => {
    const r = tracks.objectAt(100, hostS - 10)!;
    return sensorToScreen(placement, sensorPoint(r.cx, r.cy));
  };
  const eyeSpeed = speeds(records, (r) => r.trueGaze);

  it('keeps the position error small once the target is acquired', () => {
    const errors = records.filter((r) => r.hostS > 11).map((r) => angleBetween(DISPLAY, r.trueGaze, objectAt(r.hostS)));
    const rms = Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length);
    // Gain 0.9 lets the error grow at about 1.2°/s until a catch-up saccade at 1.5°.
    expect(rms).toBeLessThan(1.2);
    expect(Math.max(...errors)).toBeLessThan(2.5);
  });

  it('follows the target at a gain a little below 1 (about 0.9; Lisberger et al. 1987, value from memory), with catch-up saccades', () => {
    // Smooth phases away from the turns (at 3, 6 and 9 s of the clip) and from saccades.
    const smooth = records.map((_, i) => i).filter((i) => {
      const phase = (records[i]!.hostS - 10) % 3;
      return records[i]!.hostS > 11 && phase > 0.7 && phase < 2.8 && eyeSpeed[i]! < 30;
    });
    // Horizontal displacements along the target's: the fixational wander averages out.
    const step = (i: number) => [records[i]!.trueGaze.x - records[i - 1]!.trueGaze.x, objectAt(records[i]!.hostS).x - objectAt(records[i - 1]!.hostS).x] as const;
    const gain = smooth.reduce((s, i) => s + step(i)[0] * Math.sign(step(i)[1]), 0) / smooth.reduce((s, i) => s + Math.abs(step(i)[1]), 0);
    expect(Math.abs(gain - 0.9)).toBeLessThan(0.02);
    const catchUps = runs(records.length, (i) => records[i]!.hostS > 11 && eyeSpeed[i]! > 40);
    expect(catchUps.length).toBeGreaterThanOrEqual(5);
    // Drawn once the error passes 1.5° (and fired a corrective latency later, as the error keeps growing).
    const onsetErrors = catchUps.map(([i]) => angleBetween(DISPLAY, records[i - 1]!.trueGaze, objectAt(records[i - 1]!.hostS))).sort((a, b) => a - b);
    const median = onsetErrors[onsetErrors.length >> 1]!;
    expect(median).toBeGreaterThan(1.4);
    expect(median).toBeLessThan(2);
  });
});
