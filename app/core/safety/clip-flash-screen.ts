import type { EventBatch, SensorSize } from '../events/event-batch';
import { checkDisplayGeometry } from '../geometry/display-geometry';
import { EventImageRenderer } from '../render/event-image-renderer';
import { flashCells, type FlashCells } from './flash-cells';
import { FlashFrameAnalyser } from './flash-frame-analyser';
import { FLASH_ANALYSER_VERSION, type FlashAnalysis, type FlashSettings } from './flash-result';
import { CELL_SIDE_DEG } from './flash-thresholds';

function checkSettings(s: FlashSettings): FlashSettings {
  if (!(Number.isFinite(s.speed) && s.speed > 0)) throw new RangeError(`speed must be a positive number, got ${s.speed}`);
  if (!(Number.isFinite(s.rateHz) && s.rateHz > 0)) throw new RangeError(`rateHz must be a positive number, got ${s.rateHz}`);
  checkDisplayGeometry(s.display);
  return s;
}

/**
 * Flash screening of an event clip as the stage shows it: the same renderer with the same
 * look settings as the stage ({ look } with its defaults), one image per display frame
 * (frame k shows stimulus time tFirst + k * speed / rateHz, to the nanosecond), placed on the display as the
 * stage places it. Push the clip's events in time order, then finish(). Every frame is
 * analysed whole (every sensor pixel); only the regions are coarse (cells of ~1 degree).
 */
export class ClipFlashScreen {
  private readonly renderer: EventImageRenderer;
  private readonly rgba: Uint8ClampedArray;
  private readonly cells: FlashCells;
  private readonly analyser: FlashFrameAnalyser;
  private readonly frameStepUs: number;
  private firstUs: number | null = null;
  private lastUs = -Infinity;

  constructor(
    sensor: SensorSize,
    private readonly settings: FlashSettings,
  ) {
    checkSettings(settings);
    this.renderer = new EventImageRenderer(sensor, { look: settings.look });
    this.rgba = new Uint8ClampedArray(sensor.width * sensor.height * 4);
    this.cells = flashCells(sensor, settings.display, settings.placement);
    this.analyser = new FlashFrameAnalyser(this.cells, settings);
    this.frameStepUs = (1e6 / settings.rateHz) * settings.speed;
  }

  /** Events in time order; frames before the batch's last event are analysed now. */
  push(batch: EventBatch): void {
    const n = batch.t.length;
    if (n === 0) return;
    this.firstUs ??= batch.t[0]!;
    this.renderer.push(batch);
    this.lastUs = batch.t[n - 1]!;
    // A frame at exactly the last time might still get events from the next batch.
    this.renderUntil((t) => t < this.lastUs);
  }

  /** Seconds of clip time analysed so far (for progress). */
  get clipSeconds(): number {
    return (this.analyser.frames * this.frameStepUs) / 1e6;
  }

  finish(): FlashAnalysis {
    this.renderUntil((t) => t <= this.lastUs);
    const failures = this.analyser.finish();
    const { look, speed, placement, display, rateHz } = this.settings;
    return {
      pass: failures.length === 0,
      failures,
      analysedWith: { look, speed, placement, display: { ...display }, rateHz, analyserVersion: FLASH_ANALYSER_VERSION, frames: this.analyser.frames, cells: this.cells.cols * this.cells.rows, cellSideDeg: CELL_SIDE_DEG },
    };
  }

  private renderUntil(due: (tUs: number) => boolean): void {
    if (this.firstUs === null) return;
    for (let t = this.frameTime(this.analyser.frames); due(t); t = this.frameTime(this.analyser.frames)) {
      this.renderer.render(t, this.rgba);
      this.analyser.addFrame(this.rgba);
    }
  }

  /** Rounded to the nanosecond, so a frame that lands on an event's time is not lost to floating point. */
  private frameTime(k: number): number {
    return this.firstUs! + Math.round(k * this.frameStepUs * 1000) / 1000;
  }
}

/** Screens a whole clip held in memory. */
export function screenClipFlashes(events: EventBatch, sensor: SensorSize, settings: FlashSettings): FlashAnalysis {
  const screen = new ClipFlashScreen(sensor, settings);
  screen.push(events);
  return screen.finish();
}
