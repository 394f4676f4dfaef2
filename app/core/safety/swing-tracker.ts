/**
 * Peaks and troughs of many signals at once (one per screening cell), found as WCAG 2.2
 * describes transitions: "the change ... between adjacent peaks and valleys" of the signal
 * against time. A peak or trough is confirmed once the signal has turned back from it by at
 * least `minSwing` (a zig-zag with hysteresis), so noise smaller than that never makes one.
 * Each confirmed swing is reported with its two states and the frame where the later state
 * was first reached; the last swing is reported by finish(). Two side values (the
 * chromaticity for the red test) travel with every state.
 */
export type SwingSink = (cell: number, fromValue: number, toValue: number, endFrame: number, fromSide: number, fromSide2: number, toSide: number, toSide2: number) => void;

export class SwingTracker {
  /** 0 before the first swing, +1 rising, -1 falling. */
  private readonly direction: Int8Array;
  private readonly pivot: Float64Array;
  private readonly pivotSide: Float64Array;
  /** Running extreme of the current swing (both running extremes before the first). */
  private readonly high: Float64Array;
  private readonly highFrame: Float64Array;
  private readonly highSide: Float64Array;
  private readonly low: Float64Array;
  private readonly lowFrame: Float64Array;
  private readonly lowSide: Float64Array;
  private started = false;

  constructor(
    private readonly cells: number,
    private readonly minSwing: number,
    private readonly sink: SwingSink,
  ) {
    this.direction = new Int8Array(cells);
    this.pivot = new Float64Array(cells);
    this.pivotSide = new Float64Array(cells * 2);
    this.high = new Float64Array(cells);
    this.highFrame = new Float64Array(cells);
    this.highSide = new Float64Array(cells * 2);
    this.low = new Float64Array(cells);
    this.lowFrame = new Float64Array(cells);
    this.lowSide = new Float64Array(cells * 2);
  }

  /** One frame's value of every cell (and its side values, interleaved in pairs). */
  next(values: Float64Array, side: Float64Array | null, frame: number): void {
    if (!this.started) {
      this.started = true;
      for (let i = 0; i < this.cells; i++) {
        this.high[i] = this.low[i] = values[i]!;
        this.highFrame[i] = this.lowFrame[i] = frame;
        this.copySide(side, i, this.highSide);
        this.copySide(side, i, this.lowSide);
      }
      return;
    }
    for (let i = 0; i < this.cells; i++) {
      const x = values[i]!;
      const dir = this.direction[i]!;
      if (dir >= 0 && x > this.high[i]!) this.setHigh(i, x, frame, side);
      if (dir <= 0 && x < this.low[i]!) this.setLow(i, x, frame, side);
      if (dir === 0) {
        // The first swing starts from whichever extreme the signal has left by minSwing.
        if (x - this.low[i]! >= this.minSwing) this.begin(i, 1, this.low[i]!, this.lowSide, x, frame, side);
        else if (this.high[i]! - x >= this.minSwing) this.begin(i, -1, this.high[i]!, this.highSide, x, frame, side);
      } else if (dir > 0 && this.high[i]! - x >= this.minSwing) {
        this.emit(i, this.high[i]!, this.highFrame[i]!, this.highSide);
        this.pivot[i] = this.high[i]!;
        this.pivotSide[2 * i] = this.highSide[2 * i]!;
        this.pivotSide[2 * i + 1] = this.highSide[2 * i + 1]!;
        this.direction[i] = -1;
        this.setLow(i, x, frame, side);
      } else if (dir < 0 && x - this.low[i]! >= this.minSwing) {
        this.emit(i, this.low[i]!, this.lowFrame[i]!, this.lowSide);
        this.pivot[i] = this.low[i]!;
        this.pivotSide[2 * i] = this.lowSide[2 * i]!;
        this.pivotSide[2 * i + 1] = this.lowSide[2 * i + 1]!;
        this.direction[i] = 1;
        this.setHigh(i, x, frame, side);
      }
    }
  }

  /** Reports each cell's last swing when it reached minSwing. */
  finish(): void {
    for (let i = 0; i < this.cells; i++) {
      const dir = this.direction[i]!;
      if (dir > 0 && this.high[i]! - this.pivot[i]! >= this.minSwing) this.emit(i, this.high[i]!, this.highFrame[i]!, this.highSide);
      if (dir < 0 && this.pivot[i]! - this.low[i]! >= this.minSwing) this.emit(i, this.low[i]!, this.lowFrame[i]!, this.lowSide);
    }
  }

  private begin(i: number, dir: 1 | -1, from: number, fromSide: Float64Array, x: number, frame: number, side: Float64Array | null): void {
    this.pivot[i] = from;
    this.pivotSide[2 * i] = fromSide[2 * i]!;
    this.pivotSide[2 * i + 1] = fromSide[2 * i + 1]!;
    this.direction[i] = dir;
    if (dir > 0) this.setHigh(i, x, frame, side);
    else this.setLow(i, x, frame, side);
  }

  private emit(i: number, to: number, frame: number, toSide: Float64Array): void {
    this.sink(i, this.pivot[i]!, to, frame, this.pivotSide[2 * i]!, this.pivotSide[2 * i + 1]!, toSide[2 * i]!, toSide[2 * i + 1]!);
  }

  private setHigh(i: number, x: number, frame: number, side: Float64Array | null): void {
    this.high[i] = x;
    this.highFrame[i] = frame;
    this.copySide(side, i, this.highSide);
  }

  private setLow(i: number, x: number, frame: number, side: Float64Array | null): void {
    this.low[i] = x;
    this.lowFrame[i] = frame;
    this.copySide(side, i, this.lowSide);
  }

  private copySide(side: Float64Array | null, i: number, into: Float64Array): void {
    if (!side) return;
    into[2 * i] = side[2 * i]!;
    into[2 * i + 1] = side[2 * i + 1]!;
  }
}
