import { describe, expect, it } from 'vitest';
import { EventChunkQueue } from '../../../../app/core/playback/event-chunk-queue';
import { PlaybackClock } from '../../../../app/core/playback/playback-clock';

// t_ev = t_start + (h − h_start − paused)·speed, DESIGN.md's clock rule, checked by hand.
describe('the playback clock', () => {
  it('maps host time to stimulus time at the playback speed', () => {
    const clock = new PlaybackClock(1e9, 500, 0.5); // starts at host 1 s, stimulus 500 µs, half speed
    expect(clock.stimulusUsAt(0.5e9)).toBe(500); // before the start it holds the first instant
    expect(clock.stimulusUsAt(1e9)).toBe(500);
    expect(clock.stimulusUsAt(1.1e9)).toBe(500 + 50_000); // 100 ms of host time = 50 ms of stimulus
  });

  it('stands still while paused and carries on from there', () => {
    const clock = new PlaybackClock(0, 0, 1);
    clock.pause(2e9);
    expect(clock.paused).toBe(true);
    expect(clock.stimulusUsAt(5e9)).toBe(2e6);
    clock.resume(5e9);
    expect(clock.stimulusUsAt(6e9)).toBe(3e6);
    clock.pause(7e9);
    clock.resume(7.5e9);
    expect(clock.stimulusUsAt(8e9)).toBe(4.5e6);
    expect(() => new PlaybackClock(0, 0, 0)).toThrow(RangeError);
  });
});

describe('the compact event queue', () => {
  const chunk = (baseUs: number, ticksPerUs: number, dts: number[], xs: number[], ys: number[], ps: number[]) => ({
    baseUs,
    ticksPerUs,
    dt: Uint32Array.from(dts),
    x: Uint16Array.from(xs),
    yp: Uint16Array.from(ys.map((y, i) => (y << 1) | ps[i]!)),
  });

  it('decodes only the events due, across chunk boundaries, each exactly once', () => {
    const q = new EventChunkQueue(2);
    q.push(chunk(1000, 1, [0, 10, 20], [1, 2, 3], [4, 5, 32767], [1, 0, 1]));
    q.push(chunk(1030, 1000, [0, 500, 5000], [7, 8, 9], [0, 1, 2], [0, 0, 1])); // nanosecond ticks
    expect(q.waiting).toBe(6);
    const first = q.take(1010);
    expect(Array.from(first.t)).toEqual([1000, 1010]);
    expect(Array.from(first.y)).toEqual([4, 5]);
    expect(Array.from(first.p)).toEqual([1, 0]);
    const second = q.take(1030.5); // grows its buffer past the initial capacity of 2
    expect(Array.from(second.t)).toEqual([1020, 1030, 1030.5]);
    expect(Array.from(second.y)).toEqual([32767, 0, 1]);
    expect(q.lastUs()).toBe(1035);
    expect(Array.from(q.take(1e9).x)).toEqual([9]);
    expect(q.waiting).toBe(0);
    expect(q.take(1e9).t.length).toBe(0);
  });
});
