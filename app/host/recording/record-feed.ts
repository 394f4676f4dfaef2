import type { HostClock, HostNs } from '../../core/clock/host-clock';
import { TrackerClockFit } from '../../core/clock/tracker-clock-fit';
import type { DisplayGeometry } from '../../core/geometry/display-geometry';
import { MESSAGE_KINDS } from '../../core/recording/message-kinds';
import type { GazeSink } from '../gaze/gaze-source';
import { createFeedListener, parseFeedUrl } from '../gaze/feed';
import type { HostLog } from '../log';
import { createRecordingSink } from './recording-sink';
import { RelaySink } from './relay-sink';
import { SessionRecorder } from './session-recorder';

export interface RecordFeedOptions {
  readonly url: string;
  readonly dir: string;
  readonly seconds: number;
  readonly display: DisplayGeometry | null;
  readonly clock: HostClock;
  /** The clock's zero on process.hrtime, kept with the session (see RecorderOptions.clockOriginNs). */
  readonly clockOriginNs: bigint | null;
  readonly log: HostLog;
  /** Ends the recording early (Ctrl-C), closing it cleanly all the same. */
  readonly signal?: AbortSignal;
  readonly onProgress?: (fraction: number) => void;
}

export interface RecordFeedResult {
  readonly sessionId: string;
  readonly samples: number;
  readonly messages: number;
  readonly garbageLines: number;
  readonly disconnects: number;
  readonly seconds: number;
  readonly interrupted: boolean;
}

/** A clock_fit message this often, so the session keeps the live fit as it went. */
const CLOCK_FIT_EVERY_MS = 10_000;

function waitFor(seconds: number, signal: AbortSignal | undefined, onProgress: (fraction: number) => void): Promise<boolean> {
  return new Promise((resolve) => {
    const started = Date.now();
    const ticker = setInterval(() => onProgress((Date.now() - started) / 1000 / seconds), 250);
    const done = (interrupted: boolean) => {
      clearTimeout(timer);
      clearInterval(ticker);
      signal?.removeEventListener('abort', abort);
      resolve(interrupted);
    };
    const abort = () => done(true);
    const timer = setTimeout(() => done(false), seconds * 1000);
    if (signal?.aborted) done(true);
    else signal?.addEventListener('abort', abort);
  });
}

/**
 * The engine of `gazeloom record`: listens to a gaze feed and records it into a new session
 * folder with the same recorder as the app. Every sample is mapped to host time by the live
 * tracker clock fit (reset at each hello: a new hello may mean a restarted tracker clock),
 * and the fit is recorded as clock_fit messages. The listener is bound before the session
 * is created, so a busy port leaves no folder behind.
 */
export async function recordFeed(options: RecordFeedOptions): Promise<RecordFeedResult> {
  const { clock } = options;
  parseFeedUrl(options.url);
  const relay = new RelaySink();
  const listener = createFeedListener(options.url, { clock, log: options.log });
  await listener.start(relay);
  let recorder: SessionRecorder;
  try {
    recorder = await SessionRecorder.create(options.dir, { display: options.display, metadata: { recordedWith: 'gazeloom record', listen: options.url } }, {
      clock,
      clockOriginNs: options.clockOriginNs,
      onError: (error) => options.log.error('recording.write_failed', { message: error.message }),
    });
  } catch (error) {
    await listener.stop();
    throw error;
  }
  const fit = new TrackerClockFit();
  const recordFit = () => {
    const mapping = fit.mapping();
    if (mapping) recorder.appendMessage({ hostNs: clock.nowNs(), kind: MESSAGE_KINDS.clockFit, data: { ...mapping } });
  };
  const sink = createRecordingSink(recorder, {
    nowNs: () => clock.nowNs(),
    toHostNs: (trackerTimeS: number, arrivalNs: HostNs) => {
      fit.add(trackerTimeS, arrivalNs / 1e9);
      return fit.toHostS(trackerTimeS)! * 1e9;
    },
  });
  const resetting: GazeSink = {
    hello: (hello, peer) => {
      fit.reset();
      sink.hello(hello, peer);
    },
    sample: (sample, arrivalNs) => sink.sample(sample, arrivalNs),
    garbage: (reason, peer) => sink.garbage(reason, peer),
    connection: (state, peer) => sink.connection(state, peer),
  };
  const started = clock.nowNs();
  relay.attach(resetting);
  const fitTimer = setInterval(recordFit, CLOCK_FIT_EVERY_MS);
  const interrupted = await waitFor(options.seconds, options.signal, (f) => options.onProgress?.(f));
  clearInterval(fitTimer);
  relay.end();
  sink.finish();
  await listener.stop();
  recordFit();
  const seconds = (clock.nowNs() - started) / 1e9;
  await recorder.close();
  options.onProgress?.(1);
  return {
    sessionId: recorder.info.sessionId,
    samples: sink.samples,
    messages: recorder.stats.messages,
    garbageLines: sink.garbageLines,
    disconnects: sink.disconnects,
    seconds,
    interrupted,
  };
}
