/**
 * Which frame was on the screen at a given session time: the last frame presented at or
 * before it. A frame stays on screen until the next one; the last frame of the log counts
 * for one median frame interval after it (after that the stage may have closed).
 */
export interface TimelineFrame {
  readonly timeS: number;
  readonly clip: string | null;
  readonly stimulusUs: number | null;
}

export class FrameTimeline {
  private readonly times: Float64Array;
  private readonly frames: readonly TimelineFrame[];
  private readonly lastHoldS: number;

  constructor(frames: readonly TimelineFrame[]) {
    this.frames = [...frames].sort((a, b) => a.timeS - b.timeS);
    this.times = Float64Array.from(this.frames, (f) => f.timeS);
    const steps = Array.from(this.times.subarray(1), (t, i) => t - this.times[i]!).sort((a, b) => a - b);
    this.lastHoldS = steps.length > 0 ? steps[Math.floor(steps.length / 2)]! : 0;
  }

  at(timeS: number): TimelineFrame | null {
    const i = upperBound(this.times, timeS) - 1;
    if (i < 0) return null;
    if (i === this.times.length - 1 && timeS - this.times[i]! > this.lastHoldS) return null;
    return this.frames[i]!;
  }
}

/** The index of the first element greater than `value` in a sorted array. */
function upperBound(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
