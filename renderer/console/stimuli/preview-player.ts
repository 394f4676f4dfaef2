import type { GazeloomApi, StimulusMeta } from '../../../app/contract';
import { concatBatches, lowerBound, sliceBatch, type EventBatch } from '../../../app/core/events/event-batch';
import { EventImageRenderer, renderFrameAt, type LookName } from '../../../app/core/render';

const WINDOW_US = 500_000;

/**
 * Plays and scrubs a stimulus in the library with the shared event renderer. Scrubbing
 * draws one frame from the events that still matter at that time; playback feeds the
 * renderer incrementally and fetches the next half second ahead of need, so a clip of
 * any length plays without being loaded whole. The page never reads files: events come
 * from the host through the contract.
 */
export class PreviewPlayer {
  private look: LookName = 'polarity';
  private speed = 1;
  private playing = false;
  private frame = 0;
  private renderer: EventImageRenderer;
  private readonly image: ImageData;
  private buffered: EventBatch | null = null;
  private bufferedEndUs = 0;
  private fed = 0;
  private fetching: Promise<void> | null = null;
  private scrubToken = 0;
  private lastWallMs = 0;
  timeUs: number;

  constructor(
    private readonly api: GazeloomApi,
    private readonly stimulus: StimulusMeta,
    private readonly canvas: HTMLCanvasElement,
    private readonly onTime: (tUs: number, playing: boolean) => void,
  ) {
    canvas.width = stimulus.sensor.width;
    canvas.height = stimulus.sensor.height;
    this.image = new ImageData(stimulus.sensor.width, stimulus.sensor.height);
    this.renderer = new EventImageRenderer(stimulus.sensor, { look: this.look });
    this.timeUs = stimulus.tStartUs;
  }

  setLook(look: LookName): void {
    this.look = look;
    this.renderer = new EventImageRenderer(this.stimulus.sensor, { look });
    if (this.playing) this.restartBuffer();
    else void this.showAt(this.timeUs);
  }

  setSpeed(speed: number): void {
    this.speed = speed;
  }

  get isPlaying(): boolean {
    return this.playing;
  }

  /** Draws the frame shown at tUs (scrubbing); a newer call supersedes an older one. */
  async showAt(tUs: number): Promise<void> {
    this.pause();
    const token = ++this.scrubToken;
    this.timeUs = this.clamp(tUs);
    const from = this.timeUs - this.renderer.historyUs;
    const result = await this.api.readStimulusEvents({ id: this.stimulus.id, fromUs: from, toUs: this.timeUs + 1e-3 });
    if (token !== this.scrubToken || !result.ok) return;
    renderFrameAt(result.value.events, this.stimulus.sensor, { look: this.look }, this.timeUs, this.image.data);
    this.paint();
    this.onTime(this.timeUs, false);
  }

  play(): void {
    if (this.playing) return;
    if (this.timeUs >= this.stimulus.tEndUs) this.timeUs = this.stimulus.tStartUs;
    this.playing = true;
    this.scrubToken++;
    this.restartBuffer();
    this.lastWallMs = performance.now();
    this.frame = requestAnimationFrame(this.tick);
  }

  pause(): void {
    if (!this.playing) return;
    this.playing = false;
    cancelAnimationFrame(this.frame);
    this.onTime(this.timeUs, false);
  }

  dispose(): void {
    this.pause();
    this.scrubToken++;
  }

  private restartBuffer(): void {
    this.renderer.reset();
    this.buffered = null;
    this.fed = 0;
    this.bufferedEndUs = this.timeUs - this.renderer.historyUs;
    this.fetching = this.fetchMore();
  }

  private async fetchMore(): Promise<void> {
    const from = this.bufferedEndUs;
    const to = Math.min(from + WINDOW_US, this.stimulus.tEndUs + 1);
    const result = await this.api.readStimulusEvents({ id: this.stimulus.id, fromUs: from, toUs: to });
    this.fetching = null;
    if (!result.ok || from !== this.bufferedEndUs) return;
    const rest = this.buffered ? sliceBatch(this.buffered, this.fed, this.buffered.t.length) : null;
    this.buffered = rest ? concatBatches([rest, result.value.events]) : result.value.events;
    this.fed = 0;
    this.bufferedEndUs = to;
  }

  private readonly tick = (nowMs: number): void => {
    if (!this.playing) return;
    const elapsedUs = (nowMs - this.lastWallMs) * 1000 * this.speed;
    this.lastWallMs = nowMs;
    const canShowUntil = this.bufferedEndUs;
    // Hold the clock while the next window is on its way rather than show missing events.
    if (this.timeUs + elapsedUs < canShowUntil || this.bufferedEndUs > this.stimulus.tEndUs) this.timeUs = this.clamp(this.timeUs + elapsedUs);
    if (!this.fetching && this.bufferedEndUs <= this.stimulus.tEndUs && canShowUntil - this.timeUs < WINDOW_US / 2) this.fetching = this.fetchMore();
    if (this.buffered) {
      const upTo = lowerBound(this.buffered.t, this.timeUs + 1e-3, this.fed);
      if (upTo > this.fed) this.renderer.push(sliceBatch(this.buffered, this.fed, upTo));
      this.fed = upTo;
    }
    this.renderer.render(this.timeUs, this.image.data);
    this.paint();
    this.onTime(this.timeUs, true);
    if (this.timeUs >= this.stimulus.tEndUs) this.pause();
    else this.frame = requestAnimationFrame(this.tick);
  };

  private paint(): void {
    this.canvas.getContext('2d')!.putImageData(this.image, 0, 0);
    this.canvas.dataset.timeUs = String(this.timeUs);
  }

  private clamp(tUs: number): number {
    return Math.min(this.stimulus.tEndUs, Math.max(this.stimulus.tStartUs, tUs));
  }
}
