import { angleBetween, type DisplayGeometry } from '../geometry/display-geometry';
import { sensorToScreen } from '../geometry/placement';
import { sensorPoint, type ScreenPoint } from '../geometry/units';
import type { Xoshiro128 } from '../random/xoshiro128';
import type { TrackRow } from '../sim/track-rows';
import type { Aim, Viewer } from './aim';
import { drawDwellS } from './dwell-time';
import type { EyeMotionParams } from './eye-motion-params';
import type { ClipLook } from './look-target';

/** Stimulus seconds over which an object's speed is measured when choosing. */
const SPEED_WINDOW_S = 0.05;

/**
 * Watching a clip: the viewer picks one of the objects on the sensor, looks at a spot on
 * it (a fixed fraction of its box, within its central half, so the spot moves with it)
 * and stays for a dwell (drawDwellS), then picks again among the others. An object's
 * chance is proportional to its pull, size·(1 + speed / movingPreferenceDegPerS), with
 * size √(width·height) of its box in degrees and speed in degrees per host second, so
 * large and moving objects are watched more (no source). When the watched object leaves
 * the sensor the viewer picks again at once; with nothing on the sensor (before the clip
 * starts, after it ends) it looks at the centre of the clip's image.
 */
export class ClipViewer implements Viewer {
  private watched: { readonly objectId: number; readonly u: number; readonly v: number } | null = null;
  private untilS = -Infinity;
  private readonly centre: ScreenPoint;

  constructor(
    private readonly look: ClipLook,
    private readonly g: DisplayGeometry,
    private readonly p: EyeMotionParams,
    private readonly rng: Xoshiro128,
    private readonly keyPrefix: string,
  ) {
    const { sensor } = look.placement;
    this.centre = sensorToScreen(look.placement, sensorPoint((sensor.width - 1) / 2, (sensor.height - 1) / 2));
  }

  aimAt(hostS: number): Aim {
    const tS = (hostS - this.look.clipStartHostS) * this.look.speed;
    let box = this.watched ? this.look.tracks.objectAt(this.watched.objectId, tS) : null;
    if (box === null || hostS >= this.untilS) box = this.choose(hostS, tS);
    if (box === null || this.watched === null) return { key: `${this.keyPrefix}:none`, x: this.centre.x, y: this.centre.y };
    const spot = sensorToScreen(this.look.placement, sensorPoint(box.cx + this.watched.u * (box.x1 - box.x0), box.cy + this.watched.v * (box.y1 - box.y0)));
    return { key: `${this.keyPrefix}:${box.objectId}`, x: spot.x, y: spot.y };
  }

  private choose(hostS: number, tS: number): TrackRow | null {
    const present = this.look.tracks.objectsAt(tS);
    const previous = this.watched?.objectId ?? null;
    const others = present.length > 1 ? present.filter((o) => o.objectId !== previous) : present;
    if (others.length === 0) {
      this.watched = null;
      return null;
    }
    const pulls = others.map((o) => this.pull(o, tS));
    let pick = this.rng.next() * pulls.reduce((a, b) => a + b, 0);
    let k = 0;
    while (k < others.length - 1 && pick >= pulls[k]!) pick -= pulls[k++]!;
    const chosen = others[k]!;
    this.untilS = hostS + drawDwellS(this.p, this.rng);
    if (chosen.objectId !== previous) this.watched = { objectId: chosen.objectId, u: (this.rng.next() - 0.5) / 2, v: (this.rng.next() - 0.5) / 2 };
    return chosen;
  }

  private pull(o: TrackRow, tS: number): number {
    const onScreen = (x: number, y: number) => sensorToScreen(this.look.placement, sensorPoint(x, y));
    const widthDeg = angleBetween(this.g, onScreen(o.x0, o.cy), onScreen(o.x1, o.cy));
    const heightDeg = angleBetween(this.g, onScreen(o.cx, o.y0), onScreen(o.cx, o.y1));
    const sizeDeg = Math.max(0.1, Math.sqrt(widthDeg * heightDeg));
    const before = this.look.tracks.objectAt(o.objectId, tS - SPEED_WINDOW_S);
    const speedDegPerS = before ? (angleBetween(this.g, onScreen(before.cx, before.cy), onScreen(o.cx, o.cy)) * this.look.speed) / SPEED_WINDOW_S : 0;
    return sizeDeg * (1 + speedDegPerS / this.p.movingPreferenceDegPerS);
  }
}
