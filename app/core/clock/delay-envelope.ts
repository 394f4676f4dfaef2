/**
 * Window minima of the delay envelope as a line fit wants them: x = tracker time − originTS
 * and y = delay − originDS, small numbers whatever the clocks read.
 */
export interface EnvelopePoints {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly originTS: number;
  readonly originDS: number;
}

/**
 * The lower envelope of apparent arrival delays, d = arrival host time − tracker time, kept
 * as one point per time window: the sample with the least delay in that window (it carries
 * the least transport jitter), streamed as samples arrive. Windows are cut on the tracker's
 * clock, counted from the first sample. The latest `maxWindows` closed windows are kept;
 * the window the latest samples fall in stays open until a sample of a later window
 * arrives. A late sample (out of order) still lowers its window's minimum while that
 * window is kept, and is otherwise ignored (as is one older than the first sample).
 *
 * With a skew the delay drifts across a window (50 ppm is 50 µs per second), which would
 * favour samples at one end of it over the least-jittered one. So the least delay is taken
 * after removing `trendSlope`, the drift per tracker second that the caller's latest fit
 * found; the point kept is the sample itself, untouched.
 */
export class DelayEnvelope {
  private readonly closedIndex: number[] = [];
  private readonly closedT: number[] = [];
  private readonly closedD: number[] = [];
  private originT = NaN;
  private openIndex = -1;
  private openT = NaN;
  private openD = Infinity;
  private latestT = NaN;
  private closedVersion = 0;
  /** d(delay)/d(tracker time) assumed when choosing each window's least-delay sample. */
  trendSlope = 0;

  constructor(
    readonly windowS: number,
    readonly maxWindows: number,
  ) {
    if (!(Number.isFinite(windowS) && windowS > 0)) throw new RangeError(`windowS must be a positive number of seconds, got ${windowS}`);
    if (!(Number.isInteger(maxWindows) && maxWindows >= 1)) throw new RangeError(`maxWindows must be a positive integer, got ${maxWindows}`);
  }

  add(trackerTimeS: number, arrivalHostS: number): void {
    if (!Number.isFinite(trackerTimeS)) throw new RangeError(`trackerTimeS must be a finite number of seconds, got ${trackerTimeS}`);
    if (!Number.isFinite(arrivalHostS)) throw new RangeError(`arrivalHostS must be a finite number of seconds, got ${arrivalHostS}`);
    const d = arrivalHostS - trackerTimeS;
    if (Number.isNaN(this.originT)) this.originT = trackerTimeS;
    if (!(trackerTimeS <= this.latestT)) this.latestT = trackerTimeS;
    const index = Math.floor((trackerTimeS - this.originT) / this.windowS);
    if (index === this.openIndex) {
      if (this.detrended(trackerTimeS, d) < this.detrended(this.openT, this.openD)) [this.openT, this.openD] = [trackerTimeS, d];
    } else if (index > this.openIndex) {
      if (this.openD < Infinity) this.close();
      [this.openIndex, this.openT, this.openD] = [index, trackerTimeS, d];
    } else {
      this.lowerClosed(index, trackerTimeS, d);
    }
  }

  /** Closed windows so far (at most maxWindows). */
  get closedWindows(): number {
    return this.closedT.length;
  }

  /** Bumped whenever a closed window is added, dropped or lowered: a fit of the closed windows is stale when it changes. */
  get version(): number {
    return this.closedVersion;
  }

  /** Every window's point, the open window's last, as absolute tracker times and delays. */
  windowPoints(): { trackerTimeS: number[]; delayS: number[] } {
    const withOpen = this.openD < Infinity;
    return {
      trackerTimeS: withOpen ? [...this.closedT, this.openT] : [...this.closedT],
      delayS: withOpen ? [...this.closedD, this.openD] : [...this.closedD],
    };
  }

  /** The latest tracker time seen (the largest, whatever the arrival order); NaN before any sample. */
  get latestTrackerS(): number {
    return this.latestT;
  }

  /** The closed windows' points in window order, relative to the first sample and the first point's delay (see EnvelopePoints). */
  points(): EnvelopePoints {
    const n = this.closedT.length;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const originDS = n > 0 ? this.closedD[0]! : 0;
    for (let i = 0; i < n; i++) {
      x[i] = this.closedT[i]! - this.originT;
      y[i] = this.closedD[i]! - originDS;
    }
    return { x, y, originTS: this.originT, originDS };
  }

  reset(): void {
    this.closedIndex.length = 0;
    this.closedT.length = 0;
    this.closedD.length = 0;
    this.originT = NaN;
    this.openIndex = -1;
    this.openT = NaN;
    this.openD = Infinity;
    this.latestT = NaN;
    this.trendSlope = 0;
    this.closedVersion++;
  }

  private detrended(t: number, d: number): number {
    return d - this.trendSlope * (t - this.originT);
  }

  private close(): void {
    this.closedIndex.push(this.openIndex);
    this.closedT.push(this.openT);
    this.closedD.push(this.openD);
    if (this.closedT.length > this.maxWindows) {
      this.closedIndex.shift();
      this.closedT.shift();
      this.closedD.shift();
    }
    this.closedVersion++;
  }

  private lowerClosed(index: number, t: number, d: number): void {
    // Window indices in the ring increase; a late sample usually belongs to one of the last few.
    let lo = 0;
    let hi = this.closedIndex.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (this.closedIndex[mid]! < index) lo = mid + 1;
      else hi = mid;
    }
    if (this.closedIndex[lo] !== index || this.detrended(t, d) >= this.detrended(this.closedT[lo]!, this.closedD[lo]!)) return;
    this.closedT[lo] = t;
    this.closedD[lo] = d;
    this.closedVersion++;
  }
}
