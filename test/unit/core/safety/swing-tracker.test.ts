import { describe, expect, it } from 'vitest';
import { FlashPairs, flashesInWindow } from '../../../../app/core/safety/flash-pairs';
import { SwingTracker } from '../../../../app/core/safety/swing-tracker';

/** Runs one signal through a tracker and returns its swings as [from, to, end frame]. */
function swings(signal: readonly number[], minSwing = 0.1): Array<[number, number, number]> {
  const out: Array<[number, number, number]> = [];
  const tracker = new SwingTracker(1, minSwing, (_cell, from, to, frame) => out.push([from, to, frame]));
  signal.forEach((v, frame) => tracker.next(Float64Array.of(v), null, frame));
  tracker.finish();
  return out;
}

// Transitions "between adjacent peaks and valleys" (W3C 2023, WCAG 2.2, note to the flash thresholds); worked by hand.
describe('peaks and troughs', () => {
  it('finds each swing between a trough and a peak, timed by the frame that first reaches the new state', () => {
    expect(swings([0.2, 0.2, 0.6, 0.6, 0.6, 0.2, 0.2, 0.6])).toEqual([
      [0.2, 0.6, 2],
      [0.6, 0.2, 5],
      [0.2, 0.6, 7],
    ]);
  });

  it('ignores wiggles under the swing and follows a slow climb to its top', () => {
    expect(swings([0.3, 0.35, 0.31, 0.36, 0.3])).toEqual([]);
    expect(swings([0.3, 0.35, 0.42, 0.5, 0.45, 0.3])).toEqual([
      [0.3, 0.5, 3],
      [0.5, 0.3, 5],
    ]);
  });
});

describe('flashes from transitions', () => {
  it('pairs opposing transitions and counts the flashes wholly inside a window', () => {
    const pairs = new FlashPairs(1);
    // up, up (the first never completes), down, up, down: two flashes, frames 5-8 and 20-26.
    for (const [sense, frame] of [[1, 1], [1, 5], [-1, 8], [1, 20], [-1, 26]] as const) pairs.add(0, sense, frame);
    expect([pairs.starts[0], pairs.ends[0]]).toEqual([[5, 20], [8, 26]]);
    expect(flashesInWindow(pairs.starts[0]!, pairs.ends[0]!, 0, 60)).toEqual([0, 2]);
    expect(flashesInWindow(pairs.starts[0]!, pairs.ends[0]!, 6, 60)).toEqual([1, 2]);
    expect(flashesInWindow(pairs.starts[0]!, pairs.ends[0]!, 0, 26)).toEqual([0, 1]);
  });
});
