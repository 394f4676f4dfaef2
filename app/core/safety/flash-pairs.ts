/**
 * Flashes of each cell from its transitions: "a pair of opposing changes", an increase
 * followed by a decrease or a decrease followed by an increase (WCAG 2.2, general flash).
 * Each qualifying transition either completes a flash with the waiting one of the opposite
 * sense or waits itself. Transitions are counted by the frame that ends them.
 */
export class FlashPairs {
  /** Per cell, the frames of each flash's first and second transition. */
  readonly starts: number[][];
  readonly ends: number[][];
  private readonly waitingFrame: Float64Array;
  private readonly waitingSense: Int8Array;

  constructor(cells: number) {
    this.starts = Array.from({ length: cells }, () => []);
    this.ends = Array.from({ length: cells }, () => []);
    this.waitingFrame = new Float64Array(cells);
    this.waitingSense = new Int8Array(cells);
  }

  /** A qualifying transition of `cell`, rising (+1) or falling (-1), ending at `frame`. */
  add(cell: number, sense: 1 | -1, frame: number): void {
    const waiting = this.waitingSense[cell]!;
    if (waiting === -sense) {
      this.starts[cell]!.push(this.waitingFrame[cell]!);
      this.ends[cell]!.push(frame);
      this.waitingSense[cell] = 0;
    } else {
      this.waitingSense[cell] = sense;
      this.waitingFrame[cell] = frame;
    }
  }
}

/**
 * Flashes of one cell wholly inside the window [fromFrame, fromFrame + windowFrames):
 * returns [first, end) indices into its lists (flashes are in time order).
 */
export function flashesInWindow(starts: readonly number[], ends: readonly number[], fromFrame: number, windowFrames: number): [number, number] {
  let lo = 0;
  let hi = starts.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (starts[mid]! < fromFrame) lo = mid + 1;
    else hi = mid;
  }
  let end = lo;
  while (end < ends.length && ends[end]! < fromFrame + windowFrames) end++;
  return [lo, end];
}
