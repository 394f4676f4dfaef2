import { describe, expect, it } from 'vitest';
import type { RecordingOpenData } from '../../../../app/core/recording/message-kinds';
import { sessionClock } from '../../../../app/core/recording/session-clock';

const open = (segment: number, hostNs: number, wallTime: string, clockOriginNs: string | null, first: number): { hostNs: number; data: RecordingOpenData } => ({
  hostNs,
  data: { segment, wallTime, clockOriginNs, firstChunks: { gaze: first, frames: first, messages: first } },
});

describe('sessionClock', () => {
  // A host started at monotonic 1000 s creates the session 2 s into its life; it crashes, a
  // new host starts at monotonic 1100 s and reopens 0.5 s later (wall clock 100.5 s later).
  const first = open(0, 2e9, '2025-03-01T10:00:00.000Z', '1000000000000', 0);
  const second = open(1, 0.5e9, '2025-03-01T10:01:38.500Z', '1100000000000', 40);

  it('puts a resumed segment on the first clock by the exact difference of clock origins', () => {
    const c = sessionClock(2e9, [first, second]);
    expect(c.warnings).toEqual([]);
    expect(c.toSessionS(0, 2e9)).toBe(0);
    expect(c.toSessionS(0, 5e9)).toBe(3);
    // Monotonic 1100.5 s is 98.5 s after the creation at monotonic 1002 s.
    expect(c.toSessionS(1, 0.5e9)).toBeCloseTo(98.5, 9);
    expect(c.segmentOf('gaze', 39)).toBe(0);
    expect(c.segmentOf('gaze', 40)).toBe(1);
  });

  it('falls back to the wall clock when the origins disagree with it (a reboot), or are unknown', () => {
    const rebooted = open(1, 0.5e9, '2025-03-01T10:01:38.500Z', '5000000000', 40);
    const c = sessionClock(2e9, [first, rebooted]);
    expect(c.toSessionS(1, 0.5e9)).toBeCloseTo(98.5, 6);
    expect(c.warnings).toEqual([expect.stringMatching(/segment 1: its host clock restarted with the computer/)]);
    const unknown = sessionClock(2e9, [first, open(1, 0.5e9, '2025-03-01T10:01:38.500Z', null, 40)]);
    expect(unknown.toSessionS(1, 1.5e9)).toBeCloseTo(99.5, 6);
    expect(unknown.warnings).toEqual([expect.stringMatching(/origin unknown; aligned to the first by wall-clock time/)]);
  });

  it('is one segment from the creation time without any opening on record', () => {
    const c = sessionClock(1e9, []);
    expect(c.segments).toBe(1);
    expect(c.segmentOf('frames', 7)).toBe(0);
    expect(c.toSessionS(0, 3.5e9)).toBe(2.5);
  });
});
