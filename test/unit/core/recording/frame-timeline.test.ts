import { describe, expect, it } from 'vitest';
import { FrameTimeline } from '../../../../app/core/recording/frame-timeline';

const f = (timeS: number, clip: string | null = 'aisle', stimulusUs: number | null = timeS * 1e6) => ({ timeS, clip, stimulusUs });

describe('FrameTimeline', () => {
  const frames = [f(1 / 60), f(0), f(2 / 60), f(3 / 60, null, null)]; // given out of order
  const t = new FrameTimeline(frames);

  it('gives the frame on screen: the last one presented at or before the time', () => {
    expect(t.at(-0.001)).toBeNull();
    expect(t.at(0)).toEqual(f(0));
    expect(t.at(0.5 / 60)).toEqual(f(0));
    expect(t.at(1 / 60)).toEqual(f(1 / 60));
    expect(t.at(2.99 / 60)).toEqual(f(2 / 60));
  });

  it('holds the last frame for one median frame interval, no longer', () => {
    expect(t.at(3.9 / 60)).toEqual(f(3 / 60, null, null));
    expect(t.at(4.1 / 60)).toBeNull();
    expect(new FrameTimeline([]).at(0)).toBeNull();
  });
});
