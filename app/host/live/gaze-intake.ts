import type { HostNs } from '../../core/clock/host-clock';
import { TrackerClockFit } from '../../core/clock/tracker-clock-fit';
import type { GazeHello, GazeSample } from '../../core/gaze/gaze-sample';
import { LiveMonitor } from '../../core/live/live-monitor';
import { MESSAGE_KINDS } from '../../core/recording/message-kinds';
import type { GazeRecord, MessageRecord } from '../../core/recording/records';
import type { GazeSink } from '../gaze/gaze-source';
import { createRecordingSink, type RecordingSink } from '../recording/recording-sink';

/**
 * Where a gaze source's output goes during a live recording: the recorder's sink (every
 * sample with the host time its tracker time maps to, hellos, connection changes and gaps
 * as messages), the clock fit that keeps learning as samples arrive (reset at each hello:
 * a new hello is a new tracker run), and the live figures.
 */
export class GazeIntake implements GazeSink {
  readonly fit = new TrackerClockFit();
  readonly monitor = new LiveMonitor();
  helloSeen: GazeHello | null = null;
  connected = false;
  private readonly sink: RecordingSink;
  private ended = false;

  constructor(
    private readonly recorder: { appendGaze(r: GazeRecord): void; appendMessage(r: MessageRecord): void },
    private readonly nowNs: () => number,
  ) {
    this.sink = createRecordingSink(recorder, {
      nowNs,
      toHostNs: (trackerTimeS: number, arrivalNs: HostNs) => {
        this.fit.add(trackerTimeS, arrivalNs / 1e9);
        return this.fit.toHostS(trackerTimeS)! * 1e9;
      },
    });
  }

  get samples(): number {
    return this.sink.samples;
  }

  get garbageLines(): number {
    return this.sink.garbageLines;
  }

  hello(hello: GazeHello, peer: string): void {
    if (this.ended) return;
    this.helloSeen = hello;
    this.fit.reset();
    this.monitor.setNominalRate(hello.rateHz);
    this.sink.hello(hello, peer);
  }

  sample(sample: GazeSample, arrivalNs: HostNs): void {
    if (this.ended) return;
    this.sink.sample(sample, arrivalNs);
    this.monitor.add(sample, arrivalNs);
  }

  garbage(reason: string, peer: string): void {
    if (!this.ended) this.sink.garbage(reason, peer);
  }

  connection(state: 'connected' | 'disconnected', peer: string): void {
    if (this.ended) return;
    this.connected = state === 'connected';
    this.sink.connection(state, peer);
  }

  /** The live clock fit as a message, so a reader can see how the mapping evolved. */
  recordFit(): void {
    const mapping = this.fit.mapping();
    if (mapping && !this.ended) this.recorder.appendMessage({ hostNs: this.nowNs(), kind: MESSAGE_KINDS.clockFit, data: { ...mapping } });
  }

  /** Stops recording what the source still says while it shuts down (its own disconnect is not a gap). */
  end(): void {
    this.recordFit();
    this.sink.finish();
    this.ended = true;
  }
}
