import { describe, expect, it } from 'vitest';
import type { GazeSample } from '../../../../app/core/gaze/gaze-sample';
import { LiveMonitor } from '../../../../app/core/live/live-monitor';

const sample = (seq: number | null, valid = true): GazeSample => ({ seq, trackerTimeS: 0, left: { x: 100, y: 200, valid, pupil: null }, right: null });

// Live figures as defined beside LiveMonitor (common practice, no source), checked by hand.
describe('live monitoring figures', () => {
  it('measures the rate and the data loss from sequence numbers', () => {
    const m = new LiveMonitor(1000);
    for (let i = 0; i < 1000; i++) {
      if (i % 10 === 5) continue; // every tenth sample never arrives
      m.add(sample(i, i % 100 !== 1), i * 1e6); // and one in a hundred arrives invalid
    }
    const f = m.figures(999e6, true);
    expect(f.dataLossPct10s).toBeCloseTo(11, 9); // 100 missing + 10 invalid of 1000
    expect(f.measuredRateHz).toBeCloseTo(899 / 0.999, 6);
    expect(f.alarm).toBe(false);
    expect(f.trail.length).toBeLessThanOrEqual(60);
  });

  it('uses the nominal rate when there are no sequence numbers, and raises the alarm after 500 ms of silence', () => {
    const m = new LiveMonitor(100);
    for (let i = 0; i < 50; i++) m.add(sample(null), 1e9 + i * 20e6); // 50 Hz arriving from a 100 Hz tracker
    const f = m.figures(1e9 + 49 * 20e6, true);
    expect(f.dataLossPct10s).toBeCloseTo((100 * (99 - 50)) / 99, 9); // 1 + 0.98 s × 100 Hz = 99 expected
    expect(m.figures(1e9 + 49 * 20e6 + 499e6, true).alarm).toBe(false);
    expect(m.figures(1e9 + 49 * 20e6 + 501e6, true).alarm).toBe(true);
    expect(m.figures(1e9 + 49 * 20e6 + 501e6, false).alarm).toBe(false); // no source running, no alarm
  });

  it('forgets samples older than 10 s', () => {
    const m = new LiveMonitor(10);
    m.add(sample(0), 0);
    m.add(sample(1), 100e6);
    expect(m.figures(20e9, true).dataLossPct10s).toBe(100);
  });
});
