import { DelayEnvelope, type EnvelopePoints } from './delay-envelope';
import { MIN_ENVELOPE_POINTS, fitLowerEnvelope } from './envelope-line-fit';
import { windowMinima } from './window-minima';

/**
 * How a tracker's clock relates to the host clock: tracker = trackerRef + (1 + skew)(host −
 * hostRefS), with trackerRef = hostRefS + offsetS. "Host" here is the arrival time that a
 * sample would have had with only the minimum transport delay: that delay is a constant
 * part of every arrival and cannot be told apart from the clock offset, so it stays in
 * offsetS, and a mapped host time is the sample's true host time plus the minimum delay.
 */
export interface TrackerClockMapping {
  /** Tracker time minus (minimally delayed) host time at hostRefS, in seconds. */
  readonly offsetS: number;
  /** d(tracker)/d(host) − 1; 0 until the skew can be fitted (see skewFitted). */
  readonly skew: number;
  readonly hostRefS: number;
  /**
   * A scale of the mapping's error, in seconds, not a bound. With a fitted skew: the scatter
   * of the window minima about the fitted line (their residual standard deviation) plus the
   * line's standard error at the latest window, where new samples are being mapped. Offset
   * only: ASSUMED_SKEW_BOUND times the tracker time from the sample the offset was taken
   * from to the latest one (at least one window), the drift an unfitted skew could have
   * caused since. The constant minimum transport delay is in neither: it is part of the
   * mapping.
   */
  readonly uncertaintyS: number;
  /** Window minima the mapping rests on: the kept ones of a skew fit, else the windows holding data. */
  readonly windows: number;
  readonly skewFitted: boolean;
}

export interface TrackerClockFitOptions {
  /** Length of an envelope window in tracker seconds (default 1). */
  readonly windowS?: number;
  /** Closed windows the streaming fit keeps, the latest ones (default 120, two minutes at 1 s; at least MIN_SKEW_WINDOWS). */
  readonly maxWindows?: number;
}

/** Windows needed before a skew is fitted: with fewer, one stalled window could not be told from a skew. */
export const MIN_SKEW_WINDOWS = MIN_ENVELOPE_POINTS;
/** Skew assumed possible before it is fitted: crystal oscillators are specified to tens of ppm, 100 at worst (common practice, no source). */
export const ASSUMED_SKEW_BOUND = 100e-6;
const DEFAULT_WINDOW_S = 1;
const DEFAULT_MAX_WINDOWS = 120;

/**
 * The streaming fit of a tracker clock to the host clock, run as samples arrive: add each
 * sample's tracker timestamp and arrival host time, read the current mapping at any time.
 * It keeps one delay-envelope point per window (memory bounded by maxWindows) and refits
 * the closed windows when one of them changes (once a window, O(maxWindows)), so add()
 * and toHostS() are O(1) amortised. The window being filled is left out of the skew fit
 * until it closes: a young window's minimum is still high. Until MIN_SKEW_WINDOWS windows
 * have closed and passed the envelope fit's screening, the mapping is offset only (see
 * offsetOnlyMapping). A tracker that restarts its clock needs reset().
 */
export class TrackerClockFit {
  private readonly envelope: DelayEnvelope;
  private fitted: TrackerClockMapping | null = null;
  private fittedVersion = -1;

  constructor(options: TrackerClockFitOptions = {}) {
    const maxWindows = options.maxWindows ?? DEFAULT_MAX_WINDOWS;
    if (!(Number.isInteger(maxWindows) && maxWindows >= MIN_SKEW_WINDOWS)) {
      throw new RangeError(`maxWindows must be an integer >= ${MIN_SKEW_WINDOWS}, got ${maxWindows}`);
    }
    this.envelope = new DelayEnvelope(options.windowS ?? DEFAULT_WINDOW_S, maxWindows);
  }

  add(trackerTimeS: number, arrivalHostS: number): void {
    this.envelope.add(trackerTimeS, arrivalHostS);
    if (this.envelope.closedWindows >= MIN_SKEW_WINDOWS && this.fittedVersion !== this.envelope.version) {
      // Refit as soon as a window closes (not when first asked), so the next window's minimum is chosen against the new skew.
      const fit = skewMapping(this.envelope.points());
      this.fitted = fit?.mapping ?? null;
      this.fittedVersion = this.envelope.version;
      this.envelope.trendSlope = fit?.slope ?? 0;
    }
  }

  /** The current mapping; null before any sample. */
  mapping(): TrackerClockMapping | null {
    if (this.fitted !== null) return this.fitted;
    const { trackerTimeS, delayS } = this.envelope.windowPoints();
    return trackerTimeS.length === 0 ? null : offsetOnlyMapping(trackerTimeS, delayS, this.envelope.latestTrackerS, this.envelope.windowS);
  }

  /** A tracker timestamp on the host clock by the current mapping; null before any sample. */
  toHostS(trackerTimeS: number): number | null {
    const m = this.mapping();
    return m === null ? null : trackerToHostS(m, trackerTimeS);
  }

  reset(): void {
    this.envelope.reset();
    this.fitted = null;
    this.fittedVersion = -1;
  }
}

/**
 * The batch fit over a whole recording (used at export): every window, the last one
 * included, the pairs in any order. Two passes: the second chooses each window's minimum
 * against the skew the first found. Offset only when fewer than MIN_SKEW_WINDOWS windows
 * pass the screening. Throws a RangeError for empty, mismatched or non-finite input.
 */
export function fitTrackerClock(
  pairs: { trackerTimeS: ArrayLike<number>; arrivalHostS: ArrayLike<number> },
  options: { windowS?: number } = {},
): TrackerClockMapping {
  const n = pairs.trackerTimeS.length;
  if (pairs.arrivalHostS.length !== n) {
    throw new RangeError(`pairs.arrivalHostS must have the length of pairs.trackerTimeS (${n}), got ${pairs.arrivalHostS.length}`);
  }
  if (n === 0) throw new RangeError('pairs must hold at least one sample');
  const windowS = options.windowS ?? DEFAULT_WINDOW_S;
  const first = windowMinima(pairs.trackerTimeS, pairs.arrivalHostS, windowS, 0);
  const rough = skewMapping(first);
  const points = rough === null ? first : windowMinima(pairs.trackerTimeS, pairs.arrivalHostS, windowS, rough.slope);
  const fine = rough === null ? null : skewMapping(points);
  if (fine !== null) return fine.mapping;
  const trackerTimeS = Array.from(points.x, (x) => points.originTS + x);
  const delayS = Array.from(points.y, (y) => points.originDS + y);
  return offsetOnlyMapping(trackerTimeS, delayS, points.originTS + points.spanS, windowS);
}

/** A tracker timestamp on the host clock: the inverse of tracker = hostRefS + offsetS + (1 + skew)(host − hostRefS). */
export function trackerToHostS(m: TrackerClockMapping, trackerTimeS: number): number {
  return m.hostRefS + (trackerTimeS - (m.hostRefS + m.offsetS)) / (1 + m.skew);
}

/**
 * Without a skew fit: skew 0 and the offset of one window's least-delay sample, the one
 * whose delay plus the drift that an unfitted skew of ASSUMED_SKEW_BOUND could have caused
 * since (up to the latest tracker time) is least. So a recent window wins unless an older
 * one is lower by more than that drift, as when a stall has delayed the recent windows.
 */
function offsetOnlyMapping(trackerTimeS: readonly number[], delayS: readonly number[], latestTrackerS: number, windowS: number): TrackerClockMapping {
  const worst = (i: number) => delayS[i]! + ASSUMED_SKEW_BOUND * (latestTrackerS - trackerTimeS[i]!);
  let best = 0;
  for (let i = 1; i < trackerTimeS.length; i++) if (worst(i) < worst(best)) best = i;
  return {
    offsetS: -delayS[best]!,
    skew: 0,
    hostRefS: trackerTimeS[best]! + delayS[best]!,
    uncertaintyS: ASSUMED_SKEW_BOUND * Math.max(latestTrackerS - trackerTimeS[best]!, windowS),
    windows: trackerTimeS.length,
    skewFitted: false,
  };
}

/**
 * The fitted envelope is delay(t) = d̄ + b (t − tc) around the centroid (tc, d̄) of the kept
 * minima, so host(t) = t + delay(t) has slope 1 + b against tracker time: the tracker runs
 * at 1 / (1 + b) of host speed. Returns b too, for choosing the next minima; null when too
 * few windows pass the screening.
 */
function skewMapping(points: EnvelopePoints): { mapping: TrackerClockMapping; slope: number } | null {
  const fit = fitLowerEnvelope(points.x, points.y);
  if (fit === null) return null;
  const { line, kept, uncertaintyS } = fit;
  const centroidTrackerS = points.originTS + line.meanX;
  const delayAtCentroidS = points.originDS + line.meanY;
  const mapping = {
    offsetS: -delayAtCentroidS,
    skew: -line.slope / (1 + line.slope),
    hostRefS: centroidTrackerS + delayAtCentroidS,
    uncertaintyS,
    windows: kept,
    skewFitted: true,
  };
  return { mapping, slope: line.slope };
}
