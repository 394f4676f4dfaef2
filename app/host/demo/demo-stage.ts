import type { ManualClock } from '../../core/clock/host-clock';
import { hostNs } from '../../core/clock/host-clock';
import type { DisplayGeometry } from '../../core/geometry/display-geometry';
import type { FrameRecord, GazeRecord } from '../../core/recording/records';
import type { LookTarget } from '../../core/tracker-sim';
import type { SimulatedTrackerSource } from '../gaze/simulated-source';
import type { GazeIntake } from '../live/gaze-intake';
import type { TargetStage } from '../live/target-procedure';
import type { SessionRecorder } from '../recording/session-recorder';

/** Simulated time moves in steps this long; each step delivers the samples that became due. */
const STEP_MS = 20;
/** How often LiveSession records the live clock fit. */
const FIT_EVERY_NS = 10e9;
/** The simulated display presents at 60 Hz; its page clock started a second before the session. */
const FRAME_NS = 1e9 / 60;
const STAGE_CLOCK_LEAD_MS = 1000;

/**
 * The stage of a simulated session: no window, but everything a live session records
 * (targets shown and removed, clip starts and ends, messages), with the same message kinds
 * and data as LiveSession, on a ManualClock that moves only when the session waits. The
 * simulated tracker looks where a participant would, and delivers as time passes. The frame
 * log is what a 60 Hz stage would report (the clip and its stimulus time in every frame, so
 * gaze maps onto the clip's own time axis), with no events drawn: no clip is rendered.
 */
export class DemoStage implements TargetStage {
  private targets = 0;
  private nextFitNs: number;
  private readonly startNs: number;
  private frames = 0;
  private playing: { clip: string; startNs: number; speed: number } | null = null;

  constructor(
    readonly clock: ManualClock,
    private readonly recorder: SessionRecorder,
    private readonly source: SimulatedTrackerSource,
    private readonly intake: GazeIntake,
    private readonly session: { sessionId: string; display: DisplayGeometry; rateHz: number },
  ) {
    this.startNs = clock.nowNs();
    this.nextFitNs = this.startNs + FIT_EVERY_NS;
  }

  /** The clip on the stage from now on (null: grey, or targets). */
  show(clip: { clip: string; speed: number } | null): void {
    this.playing = clip && { ...clip, startNs: this.clock.nowNs() };
  }

  gazeContext() {
    return { sessionId: this.session.sessionId, display: this.session.display, rateHz: this.session.rateHz, units: 'screen_px' as const };
  }

  tapGaze(listener: (record: GazeRecord) => void): () => void {
    return this.intake.tap(listener);
  }

  showTarget(x: number, y: number, purpose: 'calibration' | 'validation' | 'drift_check'): string {
    const id = `target-${++this.targets}`;
    this.recordMessage('target_shown', { id, x, y, purpose });
    this.lookAt({ kind: 'point', x, y });
    return id;
  }

  hideTarget(id: string): void {
    this.recordMessage('target_removed', { id });
    this.lookAt({ kind: 'idle' });
  }

  recordMessage(kind: string, data: Record<string, unknown>): void {
    this.recorder.appendMessage({ hostNs: this.clock.nowNs(), kind, data });
  }

  lookAt(target: LookTarget): void {
    this.source.setLook(target);
  }

  /** Lets `ms` of simulated time pass: samples are delivered and recorded as they fall due. */
  wait(ms: number): void {
    const endNs = this.clock.nowNs() + ms * 1e6;
    while (this.clock.nowNs() < endNs) {
      this.clock.advanceNs(Math.min(STEP_MS * 1e6, endNs - this.clock.nowNs()));
      this.source.advanceTo(hostNs(this.clock.nowNs()));
      this.present();
      if (this.clock.nowNs() >= this.nextFitNs) {
        this.intake.recordFit();
        this.nextFitNs += FIT_EVERY_NS;
      }
    }
  }

  /** The frames presented up to now. */
  private present(): void {
    const frames: FrameRecord[] = [];
    for (let at = this.startNs + this.frames * FRAME_NS; at <= this.clock.nowNs(); at = this.startNs + this.frames * FRAME_NS) {
      const p = this.playing;
      const stimulusUs = p ? Math.round(((at - p.startNs) / 1e3) * p.speed) : null;
      frames.push({ frame: this.frames++, stageTimeMs: STAGE_CLOCK_LEAD_MS + (at - this.startNs) / 1e6, hostNs: Math.round(at), clip: p?.clip ?? null, stimulusUs, eventsDrawn: 0, late: false, photodiode: null });
    }
    if (frames.length > 0) this.recorder.appendFrames(frames);
  }
}
