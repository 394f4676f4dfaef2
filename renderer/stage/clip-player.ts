import type { StageCommand, StageEventChunk } from '../../app/contract';
import { placeSensor, type Placement } from '../../app/core/geometry/placement';
import { EventChunkQueue } from '../../app/core/playback/event-chunk-queue';
import { PlaybackClock } from '../../app/core/playback/playback-clock';
import { EventImageRenderer } from '../../app/core/render';

type Prepare = Extract<StageCommand, { type: 'prepareClip' }>;

export interface ClipFrame {
  readonly clip: string;
  readonly stimulusUs: number;
  readonly eventsDrawn: number;
  readonly rgba: Uint8ClampedArray;
  readonly placement: Placement;
  readonly started: boolean;
  readonly ended: boolean;
}

/**
 * One clip on the stage: its events arrive from the host in compact chunks ahead of need;
 * each frame shows every event up to the frame's stimulus time through the shared renderer.
 */
export class ClipPlayer {
  readonly playbackId: string;
  readonly clip: string;
  private readonly clock: PlaybackClock;
  private readonly queue = new EventChunkQueue();
  private readonly renderer: EventImageRenderer;
  private readonly rgba: Uint8ClampedArray;
  private readonly command: Prepare;
  private lastChunkArrived = false;
  /** Events already handed to the renderer count as received once the queue is empty. */
  private lastShownUs: number | null = null;
  private startedReported = false;
  /** Frames for which the host's events had not arrived in time. */
  starvedFrames = 0;

  constructor(command: Prepare) {
    this.command = command;
    this.playbackId = command.playbackId;
    this.clip = command.clip;
    this.clock = new PlaybackClock(command.startAtHostNs, command.tStartUs, command.speed);
    this.renderer = new EventImageRenderer(command.sensor, { look: command.look });
    this.rgba = new Uint8ClampedArray(command.sensor.width * command.sensor.height * 4);
  }

  get paused(): boolean {
    return this.clock.paused;
  }

  /** The time of the last event received so far, or null before any. */
  get receivedUs(): number | null {
    const last = this.queue.lastUs();
    return Number.isFinite(last) ? last : this.lastShownUs;
  }

  addChunk(chunk: StageEventChunk): void {
    this.queue.push(chunk);
    if (chunk.last) this.lastChunkArrived = true;
  }

  pause(hostNs: number): void {
    this.clock.pause(hostNs);
  }

  resume(hostNs: number): void {
    this.clock.resume(hostNs);
  }

  /** Stimulus time shown at host time h, or null before the clip's first frame. */
  frame(hostNs: number, canvas: { widthPx: number; heightPx: number }): ClipFrame | null {
    if (hostNs < this.clock.startAtHostNs) return null;
    const stimulusUs = Math.min(this.clock.stimulusUsAt(hostNs), this.command.tEndUs);
    const due = this.queue.take(stimulusUs);
    if (due.t.length > 0) {
      this.renderer.push(due);
      this.lastShownUs = due.t[due.t.length - 1]!;
    }
    if (!this.lastChunkArrived && this.queue.lastUs() < stimulusUs) this.starvedFrames++;
    this.renderer.render(stimulusUs, this.rgba);
    const started = !this.startedReported;
    this.startedReported = true;
    return {
      clip: this.clip,
      stimulusUs,
      eventsDrawn: due.t.length,
      rgba: this.rgba,
      placement: placeSensor(this.command.sensor, canvas, this.command.placement),
      started,
      ended: stimulusUs >= this.command.tEndUs && this.lastChunkArrived && this.queue.waiting === 0,
    };
  }
}
