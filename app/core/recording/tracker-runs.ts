import { fitTrackerClock, trackerToHostS, type TrackerClockMapping } from '../clock/tracker-clock-fit';
import { GrowableFloat64 } from '../gaze/feed/growable-float64';

/**
 * The batch clock fit of a whole recording, run by run. A run starts at every tracker hello
 * (a tracker or bridge that says hello again may have restarted its clock) and at every new
 * recording segment (a new host process). Each run's tracker times are fitted against the
 * arrival times on the session clock with fitTrackerClock, over every sample of the run,
 * so a sample is mapped with what was learnt after it as well as before (the live fit
 * recorded in GazeRecord.hostNs only knew the past).
 */
export interface RunFit {
  readonly samples: number;
  readonly mapping: TrackerClockMapping;
}

/**
 * Fit window: 1 s, as live, for runs of 20 s or more; shorter runs get span / 20 so the
 * skew is still fitted on about 20 windows, but never fewer than 20 samples per window.
 */
export function runFitWindowS(spanS: number, samples: number): number {
  if (!(spanS > 0) || samples < 2) return 1;
  return Math.min(1, Math.max(spanS / 20, (20 * spanS) / (samples - 1)));
}

export class TrackerRuns {
  private readonly starts: Float64Array;
  private readonly trackerTimes: GrowableFloat64[];
  private readonly arrivals: GrowableFloat64[];
  private fits: (RunFit | null)[] | null = null;

  /** `runStartsS`: session times at which a new run begins, in any order. */
  constructor(runStartsS: readonly number[]) {
    this.starts = Float64Array.from(runStartsS).sort();
    this.trackerTimes = Array.from({ length: this.starts.length + 1 }, () => new GrowableFloat64());
    this.arrivals = Array.from({ length: this.starts.length + 1 }, () => new GrowableFloat64());
  }

  /** The run a sample arriving at `arrivalS` belongs to: the number of run starts at or before it. */
  runOf(arrivalS: number): number {
    let lo = 0;
    let hi = this.starts.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (this.starts[mid]! <= arrivalS) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  add(trackerTimeS: number, arrivalS: number): void {
    const run = this.runOf(arrivalS);
    this.trackerTimes[run]!.push(trackerTimeS);
    this.arrivals[run]!.push(arrivalS);
    this.fits = null;
  }

  /** One fit per run (null for runs without samples). */
  fit(): readonly (RunFit | null)[] {
    this.fits ??= this.trackerTimes.map((times, run) => {
      if (times.length === 0) return null;
      const trackerTimeS = times.toArray();
      const arrivalHostS = this.arrivals[run]!.toArray();
      let first = trackerTimeS[0]!;
      let last = first;
      for (const t of trackerTimeS) [first, last] = [Math.min(first, t), Math.max(last, t)];
      return { samples: times.length, mapping: fitTrackerClock({ trackerTimeS, arrivalHostS }, { windowS: runFitWindowS(last - first, times.length) }) };
    });
    return this.fits;
  }

  /** A sample's tracker time on the session clock, by its run's fit. */
  toSessionS(trackerTimeS: number, arrivalS: number): number {
    const fit = this.fit()[this.runOf(arrivalS)];
    if (!fit) throw new RangeError(`no sample was added for the run of arrival ${arrivalS} s`);
    return trackerToHostS(fit.mapping, trackerTimeS);
  }
}
