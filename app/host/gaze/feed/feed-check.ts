import type { HostClock, HostNs } from '../../../core/clock/host-clock';
import { fitTrackerClock, trackerToHostS, type TrackerClockMapping } from '../../../core/clock/tracker-clock-fit';
import { FeedQualityCounter, type FeedQuality } from '../../../core/gaze/feed';
import type { HostLog } from '../../log';
import { createFeedListener } from './create-feed-listener';
import { formatFeedUrl } from './feed-url';

export interface FeedCheckClock {
  /** Tracker time minus host time (process.hrtime seconds) at the first sample, minimum arrival delay removed. */
  readonly offsetS: number;
  /** Null when the stretch was too short for the fit to give a skew. */
  readonly skewPpm: number | null;
  readonly uncertaintyS: number;
}

export interface FeedCheckResult {
  readonly url: string;
  readonly quality: FeedQuality;
  /** Null without samples. Computed over the samples after the latest hello. */
  readonly clock: FeedCheckClock | null;
  readonly peers: readonly string[];
  readonly disconnections: number;
  readonly receiveBufferBytes: number | null;
}

export interface FeedCheckOptions {
  readonly seconds: number;
  readonly clock: HostClock;
  /** process.hrtime in seconds at the clock's zero, so the offset is against process.hrtime. */
  readonly clockEpochS: number;
  readonly log: HostLog;
  readonly onProgress?: (fraction: number) => void;
}

/**
 * Window length for the clock fit: up to 1 s as in a recording, shorter for a short check
 * so that it still has about 20 windows, but never under 20 samples per window.
 */
const fitWindowS = (spanS: number, rateHz: number): number => Math.min(1, Math.max(spanS / 20, 20 / rateHz));

/** Listens on `url` for `seconds` and measures what arrives: the engine of `gazeloom feed check`. */
export async function runFeedCheck(url: string, options: FeedCheckOptions): Promise<FeedCheckResult> {
  const { clock, clockEpochS } = options;
  const counter = new FeedQualityCounter();
  const peers = new Set<string>();
  let disconnections = 0;
  let stopping = false;
  let rateHz = 0;
  let trackerTimeS: number[] = [];
  let arrivalHostS: number[] = [];
  const listener = createFeedListener(url, { clock, log: options.log });
  await listener.start({
    hello(hello) {
      counter.hello(hello);
      rateHz = hello.rateHz;
      // A new hello means a restarted tracker clock: fit only what follows it.
      trackerTimeS = [];
      arrivalHostS = [];
    },
    sample(sample, arrivalNs: HostNs) {
      counter.sample(sample, arrivalNs);
      trackerTimeS.push(sample.trackerTimeS);
      arrivalHostS.push(clockEpochS + arrivalNs / 1e9);
    },
    garbage: (reason) => counter.garbage(reason),
    connection(state, peer) {
      peers.add(peer);
      if (state === 'disconnected' && !stopping) disconnections++;
    },
  });
  const bound = listener.address!;
  const receiveBufferBytes = listener.receiveBufferBytes;
  const started = clock.nowNs();
  const ticker = setInterval(() => options.onProgress?.((clock.nowNs() - started) / 1e9 / options.seconds), 250);
  await new Promise((resolve) => setTimeout(resolve, options.seconds * 1000));
  clearInterval(ticker);
  stopping = true; // peers still connected now are cut by the check itself, not lost
  await listener.stop();
  options.onProgress?.(1);
  return {
    url: formatFeedUrl(bound),
    quality: counter.report(),
    clock: trackerTimeS.length === 0 ? null : clockFigures(trackerTimeS, arrivalHostS, rateHz),
    peers: [...peers],
    disconnections,
    receiveBufferBytes,
  };
}

function clockFigures(trackerTimeS: number[], arrivalHostS: number[], rateHz: number): FeedCheckClock {
  let first = trackerTimeS[0]!;
  let last = first;
  for (const t of trackerTimeS) [first, last] = [Math.min(first, t), Math.max(last, t)];
  const m: TrackerClockMapping = fitTrackerClock({ trackerTimeS, arrivalHostS }, { windowS: fitWindowS(last - first, rateHz) });
  const firstArrivedS = trackerTimeS[0]!;
  return {
    offsetS: firstArrivedS - trackerToHostS(m, firstArrivedS),
    skewPpm: m.skewFitted ? m.skew * 1e6 : null,
    uncertaintyS: m.uncertaintyS,
  };
}
