import type { EyeSample, GazeHello, GazeSample } from '../gaze/gaze-sample';
import type { ScreenPoint } from '../geometry/units';
import { Xoshiro128 } from '../random/xoshiro128';
import { BlinkSchedule } from './blink-schedule';
import { EyeModel } from './eye-model';
import { LookPlan } from './look-plan';
import type { LookTarget } from './look-target';
import { OrnsteinUhlenbeck } from './ornstein-uhlenbeck';
import { TrackerClock } from './tracker-clock';
import { TrackerErrors } from './tracker-errors';
import { resolveTrackerSimOptions, type ResolvedTrackerSimOptions, type TrackerSimOptions } from './tracker-sim-options';

/** One sample of the tracker's grid, delivered or not. */
export interface TrackerRecord {
  /** True host time (s) at which the sample was taken. */
  readonly hostS: number;
  /** Host time (s) at which it reaches the host: hostS + latency. */
  readonly dueHostS: number;
  readonly sample: GazeSample;
  /** False for a lost sample (never for a blink). */
  readonly delivered: boolean;
  /** Where the eye really pointed (screen px), before the tracker's errors; defined during blinks too. */
  readonly trueGaze: ScreenPoint;
}

/** An eye during a blink: no position, no pupil. */
const CLOSED: EyeSample = { x: Number.NaN, y: Number.NaN, valid: false, pupil: null };

/**
 * A participant's eyes and an eye tracker, as a pure, seeded model: samples on the regular
 * grid of the tracker's clock (TrackerClock), with the eye movements of EyeModel towards
 * what the LookPlan says, blinks as invalid samples (sent, never omitted), the tracker's
 * errors (TrackerErrors), and lost samples. Each part draws from its own generator, split
 * from the seed, so changing one setting (say lossPct) leaves the others' draws unchanged.
 * Samples are in screen pixels; a blink's samples have x, y NaN, valid false, pupil null.
 */
export class SimulatedTracker {
  readonly options: ResolvedTrackerSimOptions;
  private readonly clock: TrackerClock;
  private readonly plan: LookPlan;
  private readonly eye: EyeModel;
  private readonly blinks: BlinkSchedule;
  private readonly errors: TrackerErrors;
  private readonly pupil: OrnsteinUhlenbeck;
  private readonly lossRng: Xoshiro128;
  private next = 0;

  constructor(options: TrackerSimOptions) {
    const o = resolveTrackerSimOptions(options);
    this.options = o;
    const root = new Xoshiro128(o.seed);
    const stream = () => new Xoshiro128(root.nextUint32());
    this.clock = new TrackerClock(o.startHostS, o.rateHz, o.offsetS, o.skewPpm);
    this.plan = new LookPlan(o.display, o.eyeMotion, stream());
    this.eye = new EyeModel(o.display, o.eyeMotion, stream());
    this.blinks = new BlinkSchedule(o.eyeMotion, stream(), o.startHostS);
    this.errors = new TrackerErrors(o.display, o, stream(), stream(), o.startHostS);
    this.pupil = new OrnsteinUhlenbeck(o.eyeMotion.pupilSdMm, o.eyeMotion.pupilTimeConstantS, stream());
    this.lossRng = stream();
  }

  /** The feed's hello for this tracker: screen pixels, its rate, eyes and screen, pupil in mm. */
  hello(): GazeHello {
    const { rateHz, eyes, display, seed } = this.options;
    return { protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz, eyes, screen: { widthPx: display.widthPx, heightPx: display.heightPx }, pupilUnit: 'mm', source: `gazeloom simulated tracker (seed ${seed})` };
  }

  /** Looks at `target` from host time atHostS on (not earlier than the last sample made). */
  setLook(target: LookTarget, atHostS: number): void {
    this.plan.set(target, atHostS);
  }

  /** Every grid sample taken up to hostS (inclusive) and not returned before, in order. */
  samplesUntil(hostS: number): TrackerRecord[] {
    const out: TrackerRecord[] = [];
    for (let h = this.clock.hostTimeOfSample(this.next); h <= hostS; h = this.clock.hostTimeOfSample(this.next)) out.push(this.take(h));
    return out;
  }

  private take(hostS: number): TrackerRecord {
    const k = this.next++;
    const o = this.options;
    const trueGaze = this.eye.step(hostS, this.plan.aimAt(hostS));
    const closed = this.blinks.isClosed(hostS);
    const lost = this.lossRng.next() * 100 < o.lossPct;
    const pupilMm = o.eyeMotion.pupilMeanMm + this.pupil.step(k === 0 ? 0 : 1 / o.rateHz);
    const biased = this.errors.biased(trueGaze, hostS);
    const eye = (recorded: boolean): EyeSample | null => {
      if (!recorded) return null;
      const p = this.errors.measured(biased);
      return closed ? CLOSED : { x: p.x, y: p.y, valid: true, pupil: pupilMm };
    };
    const left = eye(o.eyes !== 'right');
    const right = eye(o.eyes !== 'left');
    const sample: GazeSample = { seq: k, trackerTimeS: this.clock.timestampOfSample(k), left, right };
    return { hostS, dueHostS: hostS + o.latencyMs / 1000, sample, delivered: closed || !lost, trueGaze };
  }
}
