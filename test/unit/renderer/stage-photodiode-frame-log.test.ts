import { describe, expect, it, vi } from 'vitest';
import { FrameLog } from '../../../renderer/stage/frame-log';
import { PhotodiodePatch, PHOTODIODE_SIZE_PX } from '../../../renderer/stage/photodiode';
import type { StageSurface } from '../../../renderer/stage/surface';

const surface = () => {
  const fills: unknown[][] = [];
  const s = { canvas: { width: 800, height: 600 }, fillRect: (...args: unknown[]) => fills.push(args) } as unknown as StageSurface;
  return { s, fills };
};

// The stage's rules as the issue states them (no outside source): the patch alternates on
// every frame while a clip plays and stays black otherwise; late = interval > 1.5 nominal.
describe('the photodiode patch', () => {
  it('alternates white and black on every playing frame, black otherwise, in the bottom-left corner', () => {
    const patch = new PhotodiodePatch();
    const { s, fills } = surface();
    expect(patch.draw(s, true)).toBeNull(); // off: nothing drawn, nothing logged
    patch.enabled = true;
    const states = [true, true, true, false, true].map((playing) => patch.draw(s, playing));
    expect(states).toEqual([1, 0, 1, 0, 1]);
    expect(fills[0]).toEqual([0, 600 - PHOTODIODE_SIZE_PX, PHOTODIODE_SIZE_PX, PHOTODIODE_SIZE_PX, [255, 255, 255]]);
    expect(fills[3]![4]).toEqual([0, 0, 0]);
  });
});

describe('the frame log', () => {
  it('numbers frames, flags the late ones and sends them in batches with the clock estimate', () => {
    const reportFrames = vi.fn(async (_request: unknown) => ({ ok: true }));
    const log = new FrameLog({ reportFrames } as never, () => ({ offsetMs: 5, uncertaintyMs: 0.2 }), () => null);
    const times = [0, 16.7, 33.4, 50.1, 66.8, 83.5, 100.2, 116.9, 133.6, 150.3, 167, 217, 233.7]; // one 50 ms gap
    const records = times.map((t) => log.add({ stageTimeMs: t, hostNs: t * 1e6, clip: 'aisle', stimulusUs: t * 1000, eventsDrawn: 3, photodiode: null }));
    expect(records.map((r) => r.frame)).toEqual(times.map((_, i) => i));
    expect(records.filter((r) => r.late).map((r) => r.stageTimeMs)).toEqual([217]);
    expect(reportFrames).toHaveBeenCalled();
    const first = reportFrames.mock.calls[0]![0] as { frames: unknown[]; clock: unknown };
    expect(first.clock).toEqual({ offsetMs: 5, uncertaintyMs: 0.2 });
    expect(first.frames.length).toBeGreaterThan(0);
  });
});
