import type { HostNs } from '../../core/clock/host-clock';
import type { GazeHello } from '../../core/gaze/gaze-sample';
import { MESSAGE_KINDS } from '../../core/recording/message-kinds';
import type { GazeRecord, MessageRecord } from '../../core/recording/records';
import type { GazeSink } from '../gaze/gaze-source';
import { FeedGapRecorder } from './feed-gap-recorder';

export interface RecordingSinkOptions {
  /** Host time for messages about the connection (connected, disconnected). */
  readonly nowNs: () => number;
  /** A sample's tracker time mapped to host time with the clock fit current at its arrival. */
  readonly toHostNs: (trackerTimeS: number, arrivalNs: HostNs) => number;
}

export interface RecordingSink extends GazeSink {
  readonly samples: number;
  readonly garbageLines: number;
  readonly disconnects: number;
  /** Records a hello still waiting for its first sample; call when the recording ends. */
  finish(): void;
}

/**
 * A gaze sink that records everything a source delivers: every sample (valid or not) as a
 * gaze record, the hello and connection changes as messages, and gaps around
 * disconnections. Garbage lines are counted, not recorded.
 *
 * A hello starts a new tracker run (export fits each run's clock on its own), so its
 * message must sit exactly where the run's samples begin in host time. Sinks are not told
 * when a hello arrived, only samples are, so the tracker_hello message is written with the
 * arrival time of the first sample after it (usually read in the same chunk); a hello no
 * sample follows is written at the next connection change or at finish().
 */
export function createRecordingSink(recorder: { appendGaze(r: GazeRecord): void; appendMessage(r: MessageRecord): void }, options: RecordingSinkOptions): RecordingSink {
  const gaps = new FeedGapRecorder((m) => recorder.appendMessage(m));
  let samples = 0;
  let garbageLines = 0;
  let pendingHello: { hello: GazeHello; peer: string } | null = null;
  const writeHello = (hostNs: number) => {
    if (!pendingHello) return;
    recorder.appendMessage({ hostNs, kind: MESSAGE_KINDS.trackerHello, data: { ...pendingHello.hello, peer: pendingHello.peer } });
    pendingHello = null;
  };
  return {
    get samples() {
      return samples;
    },
    get garbageLines() {
      return garbageLines;
    },
    get disconnects() {
      return gaps.disconnects;
    },
    hello(hello, peer) {
      writeHello(options.nowNs());
      pendingHello = { hello, peer };
    },
    sample(sample, arrivalNs) {
      writeHello(arrivalNs);
      gaps.sample(sample.trackerTimeS, arrivalNs);
      recorder.appendGaze({ ...sample, arrivalNs, hostNs: options.toHostNs(sample.trackerTimeS, arrivalNs) });
      samples++;
    },
    garbage() {
      garbageLines++;
    },
    connection(state, peer) {
      writeHello(options.nowNs());
      gaps.connection(state, peer, options.nowNs());
    },
    finish() {
      writeHello(options.nowNs());
    },
  };
}
