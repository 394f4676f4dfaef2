import type { HostClock } from '../../core/clock/host-clock';
import type { ControlMessage } from '../../core/gaze/control-message';
import type { GazeSink, GazeSource } from './gaze-source';

/**
 * Mouse as gaze, for piloting a protocol without a tracker. The stage reports pointer
 * positions with its own timestamps; they enter here like any tracker's samples (the stage
 * clock plays the tracker clock, and the clock fit maps it to host time). A pointer off the
 * stage counts as an invalid sample.
 */
export class MouseGazeSource implements GazeSource {
  readonly kind = 'mouse' as const;
  readonly description = 'mouse on the stage';
  private sink: GazeSink | null = null;
  private seq = 0;

  constructor(
    private readonly clock: HostClock,
    private readonly screen: { widthPx: number; heightPx: number },
    private readonly setStageMouse: (enabled: boolean) => void,
  ) {}

  async start(sink: GazeSink): Promise<void> {
    this.sink = sink;
    this.setStageMouse(true);
    sink.connection('connected', 'stage');
    sink.hello({ protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 60, eyes: 'left', screen: this.screen, pupilUnit: null, source: this.description }, 'stage');
  }

  async stop(): Promise<void> {
    this.setStageMouse(false);
    this.sink?.connection('disconnected', 'stage');
    this.sink = null;
  }

  control(_message: ControlMessage): void {
    // The mouse needs no calibration messages.
  }

  /** Pointer samples from the stage page. */
  deliver(samples: readonly { stageTimeMs: number; x: number; y: number; inside: boolean }[]): void {
    const sink = this.sink;
    if (!sink) return;
    const arrivalNs = this.clock.nowNs();
    for (const s of samples) {
      sink.sample({ seq: this.seq++, trackerTimeS: s.stageTimeMs / 1000, left: { x: s.x, y: s.y, valid: s.inside, pupil: null }, right: null }, arrivalNs);
    }
  }
}
