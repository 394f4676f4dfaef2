import { regionColour } from './chromaticity';
import type { FlashCells } from './flash-cells';
import { flashFailures } from './flash-failures';
import { FlashPairs } from './flash-pairs';
import type { FlashFailure } from './flash-result';
import { FLASH_WINDOW_S, GENERAL_DARKER_BELOW, GENERAL_MIN_CHANGE, RED_MIN_CHROMA_CHANGE, RED_MIN_RATIO, RED_RATIO_SWING } from './flash-thresholds';
import { LINEAR_OF_SRGB8, luminanceOfLinear } from './relative-luminance';
import { SwingTracker } from './swing-tracker';

/**
 * Flash screening of frames as they are shown: each frame's mean linear sRGB per cell gives
 * the cell's relative luminance (general flashes) and red ratio with chromaticity (red
 * flashes); their peaks and troughs become transitions, transitions become flashes, and
 * finish() applies the thresholds. Frames are the sensor image (rgba, width * height * 4)
 * at consecutive display frames.
 */
export class FlashFrameAnalyser {
  private readonly general: FlashPairs;
  private readonly red: FlashPairs;
  private readonly luminanceTracker: SwingTracker;
  private readonly redTracker: SwingTracker;
  private readonly sums: Float64Array;
  private readonly luminance: Float64Array;
  private readonly redRatio: Float64Array;
  private readonly chroma: Float64Array;
  private frame = 0;

  constructor(
    private readonly cells: FlashCells,
    private readonly timing: { readonly rateHz: number; readonly speed: number },
  ) {
    const n = cells.cols * cells.rows;
    this.general = new FlashPairs(n);
    this.red = new FlashPairs(n);
    this.sums = new Float64Array(n * 3);
    this.luminance = new Float64Array(n);
    this.redRatio = new Float64Array(n);
    this.chroma = new Float64Array(n * 2);
    this.luminanceTracker = new SwingTracker(n, GENERAL_MIN_CHANGE, (cell, from, to, frame) => {
      if (Math.min(from, to) < GENERAL_DARKER_BELOW) this.general.add(cell, to > from ? 1 : -1, frame);
    });
    this.redTracker = new SwingTracker(n, RED_RATIO_SWING, (cell, from, to, frame, fu, fv, tu, tv) => {
      if (Math.max(from, to) >= RED_MIN_RATIO && Math.hypot(tu - fu, tv - fv) > RED_MIN_CHROMA_CHANGE) this.red.add(cell, to > from ? 1 : -1, frame);
    });
  }

  get frames(): number {
    return this.frame;
  }

  /** One frame, rgba starting on a 4-byte boundary of its buffer (as the renderer requires). */
  addFrame(rgba: Uint8ClampedArray): void {
    const { pixelCount, pixelsInCell } = this.cells;
    if (rgba.length !== pixelCount * 4) throw new RangeError(`rgba must hold ${pixelCount * 4} bytes (width * height * 4), got ${rgba.length}`);
    const sums = this.sums;
    sums.fill(0);
    accumulate(rgba, this.cells, sums);
    for (let c = 0; c < pixelsInCell.length; c++) {
      const k = pixelsInCell[c]!;
      const r = sums[3 * c]! / k;
      const g = sums[3 * c + 1]! / k;
      const b = sums[3 * c + 2]! / k;
      this.luminance[c] = luminanceOfLinear(r, g, b);
      const colour = regionColour(r, g, b);
      this.redRatio[c] = colour.redRatio;
      this.chroma[2 * c] = colour.u;
      this.chroma[2 * c + 1] = colour.v;
    }
    this.luminanceTracker.next(this.luminance, null, this.frame);
    this.redTracker.next(this.redRatio, this.chroma, this.frame);
    this.frame++;
  }

  finish(): FlashFailure[] {
    this.luminanceTracker.finish();
    this.redTracker.finish();
    const timing = { windowFrames: FLASH_WINDOW_S * this.timing.rateHz, clipSPerFrame: this.timing.speed / this.timing.rateHz };
    return [...flashFailures('general', this.general, this.cells, timing), ...flashFailures('red', this.red, this.cells, timing)].sort(
      (a, b) => a.start_s - b.start_s || a.region.y_px - b.region.y_px || a.region.x_px - b.region.x_px,
    );
  }
}

/**
 * Sums linear r, g, b of each visible pixel into its cell, a cell's run of pixels in a row at
 * a time (no per-pixel cell look-up). Event images are mostly one background colour, so a
 * pixel whose packed colour equals the one before it reuses that pixel's linear values.
 * A plain function, so V8 optimizes the loop whole.
 */
function accumulate(rgba: Uint8ClampedArray, cells: FlashCells, sums: Float64Array): void {
  const linear = LINEAR_OF_SRGB8;
  const words = new Uint32Array(rgba.buffer, rgba.byteOffset, rgba.length >> 2);
  const { visible, sidePx, cols, sensorWidth } = cells;
  let lastWord = -1;
  let lr = 0;
  let lg = 0;
  let lb = 0;
  for (let y = visible.y0; y < visible.y1; y++) {
    const rowBase = Math.floor((y - visible.y0) / sidePx) * cols;
    for (let col = 0, x0 = visible.x0; x0 < visible.x1; col++, x0 += sidePx) {
      const x1 = Math.min(visible.x1, x0 + sidePx);
      let r = 0;
      let g = 0;
      let b = 0;
      for (let i = y * sensorWidth + x0, end = y * sensorWidth + x1; i < end; i++) {
        const word = words[i]!;
        if (word !== lastWord) {
          lastWord = word;
          const p = i << 2;
          lr = linear[rgba[p]!]!;
          lg = linear[rgba[p + 1]!]!;
          lb = linear[rgba[p + 2]!]!;
        }
        r += lr;
        g += lg;
        b += lb;
      }
      const c = 3 * (rowBase + col);
      sums[c] += r;
      sums[c + 1] += g;
      sums[c + 2] += b;
    }
  }
}
