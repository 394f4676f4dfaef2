import { describe, expect, it } from 'vitest';
import { angleBetween, placeSensor, screenPoint, sensorPoint, sensorToScreen, type Placement, type ScreenPoint } from '../../../../app/core/geometry';
import { formatTracksTsv, type TrackRow } from '../../../../app/core/sim/track-rows';
import { WarehouseScene } from '../../../../app/core/sim/warehouse-scene';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';
import { DEFAULT_EYE_MOTION, parseTracksTsv, TrackTable, type LookTarget, type TrackerRecord } from '../../../../app/core/tracker-sim';
import { ClipViewer } from '../../../../app/core/tracker-sim/clip-viewer';
import { CENTRE, DISPLAY, runs, simulate, speeds } from './helpers';

/** The angle from a screen point to the nearest point of a sensor box on screen (0 inside it). */
function angleToBox(p: ScreenPoint, box: TrackRow, placement: Placement): number {
  const tl = sensorToScreen(placement, sensorPoint(box.x0, box.y0));
  const br = sensorToScreen(placement, sensorPoint(box.x1, box.y1));
  const nearest = screenPoint(Math.min(Math.max(p.x, tl.x), br.x), Math.min(Math.max(p.y, tl.y), br.y));
  return angleBetween(DISPLAY, p, nearest);
}

const sensor = { width: 640, height: 480 };
const placement = placeSensor(sensor, DISPLAY, 'fit');

describe('watching a clip', () => {
  // Twenty seconds of the warehouse aisle's ground truth, through the TRACKS.tsv text.
  const scene = new WarehouseScene(sensor);
  const tracks = parseTracksTsv(formatTracksTsv(Array.from({ length: 20001 }, (_, ms) => scene.objectsAt(ms / 1000)).flat()), 'TRACKS.tsv');
  const clip: LookTarget = { kind: 'clip', tracks, placement, clipStartHostS: 11, speed: 1 };
  const records = simulate({ rateHz: 250, seed: 14 }, 21, [{ atS: 1, target: clip }]);
  const during = records.filter((r) => r.hostS > 11.5 && r.hostS < 31 && r.sample.left!.valid);
  const nearest = (r: TrackerRecord) => {
    let best = { objectId: -1, angle: Infinity };
    for (const box of tracks.objectsAt(r.hostS - 11)) {
      const angle = angleToBox(r.trueGaze, box, placement);
      if (angle < best.angle) best = { objectId: box.objectId, angle };
    }
    return best;
  };

  it('looks at the tracked objects: nearly every sample within 2° of some object’s box', () => {
    const reported = (r: TrackerRecord) => screenPoint(r.sample.left!.x, r.sample.left!.y);
    const near = during.filter((r) => tracks.objectsAt(r.hostS - 11).some((box) => angleToBox(reported(r), box, placement) < 2));
    expect(near.length / during.length).toBeGreaterThan(0.9);
  });

  it('switches from object to object every so often (dwells of 0.3-2 s), watching several of them', () => {
    const watched = during.map((r) => nearest(r).objectId);
    // Runs of one nearest object lasting at least 0.3 s: the dwells.
    const dwells: { objectId: number; samples: number }[] = [];
    for (const id of watched) {
      const last = dwells.at(-1);
      if (last?.objectId === id) last.samples++;
      else dwells.push({ objectId: id, samples: 1 });
    }
    const long = dwells.filter((d) => d.samples >= 0.3 * 250);
    const switches = long.filter((d, i) => i > 0 && d.objectId !== long[i - 1]!.objectId).length;
    expect(new Set(long.map((d) => d.objectId)).size).toBeGreaterThanOrEqual(4);
    // About 19.5 s / 0.8 s mean dwell ≈ 24 dwells.
    expect(switches).toBeGreaterThan(8);
    expect(switches).toBeLessThan(40);
  });

  it('follows the clip’s stimulus time, (host time − clip start)·speed, and looks at the image centre when nothing is on it', () => {
    // One still box that is there only from 2 to 3 s of stimulus time: at half speed, 4 to 6 s after the clip starts.
    const rows: TrackRow[] = Array.from({ length: 1001 }, (_, ms) => ({ tS: 2 + ms / 1000, objectId: 4, kind: 'person', cx: 100, cy: 100, x0: 96, y0: 92, x1: 104, y1: 108 }));
    const halfSpeed: LookTarget = { kind: 'clip', tracks: TrackTable.fromRows(rows), placement, clipStartHostS: 12, speed: 0.5 };
    const run = simulate({ rateHz: 250, seed: 3, noiseDeg: 0 }, 10, [{ atS: 0, target: halfSpeed }]);
    const person = sensorToScreen(placement, sensorPoint(100, 100));
    const imageCentre = sensorToScreen(placement, sensorPoint(319.5, 239.5));
    const gazeAt = (h: number) => run.find((r) => r.hostS >= h)!.trueGaze;
    for (const h of [11, 13, 15.5]) expect(angleBetween(DISPLAY, gazeAt(h), imageCentre)).toBeLessThan(1);
    for (const h of [16.6, 17.2, 17.9]) expect(angleBetween(DISPLAY, gazeAt(h), person)).toBeLessThan(1);
    expect(angleBetween(DISPLAY, gazeAt(19.5), imageCentre)).toBeLessThan(1);
  });
});

describe('choosing what to watch', () => {
  it('prefers larger and moving objects, in proportion to size·(1 + speed / 5°/s), never picking the same one twice in a row', () => {
    // A small still box, a large still box, and a small box circling at 100 sensor px/s; rows every 10 ms.
    const box = (tS: number, objectId: number, cx: number, cy: number, half: number): TrackRow => ({ tS, objectId, kind: 'parcel', cx, cy, x0: cx - half, y0: cy - half, x1: cx + half, y1: cy + half });
    const rows = Array.from({ length: 60001 }, (_, k) => {
      const tS = k / 100;
      return [box(tS, 1, 150, 150, 5), box(tS, 2, 450, 150, 10), box(tS, 3, 320 + 100 * Math.cos(tS), 330 + 100 * Math.sin(tS), 5)];
    }).flat();
    const viewer = new ClipViewer({ kind: 'clip', tracks: TrackTable.fromRows(rows), placement, clipStartHostS: 0, speed: 1 }, DISPLAY, DEFAULT_EYE_MOTION, new Xoshiro128(5), 'test');
    const picks: number[] = [];
    for (let k = 0; k < 60000; k++) {
      const key = viewer.aimAt(k / 100).key;
      if (key !== `test:${picks.at(-1)}`) picks.push(Number(key.split(':')[1]));
    }
    expect(picks.every((id, i) => i === 0 || id !== picks[i - 1])).toBe(true);
    // Dwells of 0.8 s on average: about 750 picks in 600 s.
    expect(picks.length).toBeGreaterThan(650);
    expect(picks.length).toBeLessThan(850);

    // Pulls by the documented rule: size √(w·h) in degrees, times 1 + speed/5; the circling box moves 100 px/s.
    const onScreen = (x: number, y: number) => sensorToScreen(placement, sensorPoint(x, y));
    const size = (cx: number, cy: number, half: number) => Math.sqrt(angleBetween(DISPLAY, onScreen(cx - half, cy), onScreen(cx + half, cy)) * angleBetween(DISPLAY, onScreen(cx, cy - half), onScreen(cx, cy + half)));
    const speed = angleBetween(DISPLAY, onScreen(320, 330), onScreen(321, 330)) * 100;
    const pull = [size(150, 150, 5), size(450, 150, 10), size(320, 330, 5) * (1 + speed / 5)];
    // Picking among the others in proportion to their pulls is a Markov chain: P(i → j) = w_j / (W − w_i).
    // Its stationary shares, by power iteration, are how often each object should be chosen.
    const total = pull.reduce((a, b) => a + b);
    let share = [1 / 3, 1 / 3, 1 / 3];
    for (let it = 0; it < 200; it++) share = pull.map((wj, j) => share.reduce((s, si, i) => s + (i === j ? 0 : (si * wj) / (total - pull[i]!)), 0));
    const observed = [1, 2, 3].map((id) => picks.filter((p) => p === id).length / picks.length);
    observed.forEach((o, i) => expect(Math.abs(o - share[i]!)).toBeLessThan(0.05));
    expect(observed[1]!).toBeGreaterThan(observed[0]!);
    expect(observed[2]!).toBeGreaterThan(observed[0]!);
  });
});

describe('idle', () => {
  it('fixates one spot after another around the screen centre', () => {
    const records = simulate({ rateHz: 250, seed: 19 }, 60).filter((r) => r.sample.left!.valid);
    const away = records.map((r) => angleBetween(DISPLAY, CENTRE, screenPoint(r.sample.left!.x, r.sample.left!.y)));
    // 2° SD per axis: the distance is Rayleigh, beyond 8° (4 SD) with probability e^-8.
    expect(away.filter((a) => a > 8).length / away.length).toBeLessThan(0.001);
    const meanX = records.reduce((s, r) => s + r.trueGaze.x, 0) / records.length;
    const meanY = records.reduce((s, r) => s + r.trueGaze.y, 0) / records.length;
    expect(angleBetween(DISPLAY, CENTRE, screenPoint(meanX, meanY))).toBeLessThan(1);
    const v = speeds(records, (r) => r.trueGaze);
    const saccades = runs(records.length, (i) => v[i]! > 40).length;
    // About 75 dwells of 0.8 s in a minute, nearly all of them ending in a saccade to the next spot.
    expect(saccades).toBeGreaterThan(50);
    expect(saccades).toBeLessThan(200);
  });
});
