import type { HostNs } from '../../core/clock/host-clock';
import { TrackerClockFit } from '../../core/clock/tracker-clock-fit';
import type { EyeSample, GazeHello, GazeSample } from '../../core/gaze/gaze-sample';
import { LiveMonitor } from '../../core/live/live-monitor';
import { applyRawCalibration, type RawCalibrationParams } from '../../core/quality/correction/raw-calibration';
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
  private readonly taps = new Set<(record: GazeRecord) => void>();
  private ended = false;
  private calibration: RawCalibrationParams | null = null;

  constructor(
    private readonly recorder: { appendGaze(r: GazeRecord): void; appendMessage(r: MessageRecord): void },
    private readonly nowNs: () => number,
  ) {
    const tapped = {
      appendGaze: (r: GazeRecord) => {
        recorder.appendGaze(r);
        for (const tap of this.taps) tap(r);
      },
      appendMessage: (r: MessageRecord) => recorder.appendMessage(r),
    };
    this.sink = createRecordingSink(tapped, {
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

  /**
   * Hands every sample from now on to `listener` as it is recorded, with the host time its
   * tracker time maps to (target procedures collect their windows this way). Returns the
   * function that removes the listener.
   */
  tap(listener: (record: GazeRecord) => void): () => void {
    this.taps.add(listener);
    return () => this.taps.delete(listener);
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
    const onScreen = this.mapping ? calibrated(sample, this.calibration!) : sample;
    this.sink.sample(onScreen, arrivalNs);
    this.monitor.add(onScreen, arrivalNs);
  }

  /**
   * Gazeloom's calibration of a source that sends raw coordinates: while set (and the
   * source's hello says 'raw'), every sample is mapped to screen px before it is recorded,
   * monitored or tapped. Null stops mapping. The caller records the change as a message.
   */
  setCalibration(params: RawCalibrationParams | null): void {
    this.calibration = params;
  }

  get hasCalibration(): boolean {
    return this.calibration !== null;
  }

  /** Whether samples are being mapped from raw coordinates to screen px now. */
  get mapping(): boolean {
    return this.calibration !== null && this.helloSeen?.units === 'raw';
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

function calibratedEye(eye: EyeSample | null, params: RawCalibrationParams): EyeSample | null {
  if (eye === null || !(Number.isFinite(eye.x) && Number.isFinite(eye.y))) return eye;
  const p = applyRawCalibration(params, eye.x, eye.y);
  return { ...eye, x: p.x, y: p.y };
}

function calibrated(sample: GazeSample, params: RawCalibrationParams): GazeSample {
  return { ...sample, left: calibratedEye(sample.left, params), right: calibratedEye(sample.right, params) };
}
