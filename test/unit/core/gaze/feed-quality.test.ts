import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { FeedQualityCounter } from '../../../../app/core/gaze/feed';
import { percentileInPlace } from '../../../../app/core/gaze/feed/percentile';
import type { GazeHello, GazeSample } from '../../../../app/core/gaze/gaze-sample';

const hello = (rateHz: number): GazeHello => ({ protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz, eyes: 'left', screen: null, pupilUnit: null, source: null });
const sample = (trackerTimeS: number, seq: number | null = null): GazeSample => ({ seq, trackerTimeS, left: { x: 1, y: 2, valid: true, pupil: null }, right: null });

/** Feeds (t, seq) pairs arriving exactly on the nominal grid of `rateHz`. */
function counted(rateHz: number, rows: readonly (readonly [number, number | null])[]): FeedQualityCounter {
  const c = new FeedQualityCounter();
  c.hello(hello(rateHz));
  rows.forEach(([t, seq], i) => c.sample(sample(t, seq), (i * 1e9) / rateHz));
  return c;
}

describe('loss and order from sequence numbers (Schulzrinne et al. 2003, RFC 3550 appendix A.3: lost = expected - received)', () => {
  it('counts the numbers that never came', () => {
    const r = counted(100, [1, 2, 3, 5, 6, 9, 10].map((s) => [s / 100, s] as const)).report();
    expect(r).toMatchObject({ samples: 7, lost: 3, outOfOrder: 0, lossFrom: 'seq' });
  });

  it('does not count a late sample as lost, but as out of order; a repeat is out of order too', () => {
    const r = counted(100, [[0.01, 1], [0.02, 2], [0.04, 4], [0.03, 3], [0.05, 5], [0.05, 5]]).report();
    expect(r).toMatchObject({ samples: 6, lost: 0, outOfOrder: 2, lossFrom: 'seq' });
  });

  it('trusts the numbers over the timestamps when every sample has one', () => {
    // Timestamps show no gap, the numbers do: the sender dropped 2 and 3 before stamping.
    const r = counted(100, [[0.01, 1], [0.02, 4], [0.03, 5]]).report();
    expect(r).toMatchObject({ lost: 2, lossFrom: 'seq' });
  });
});

describe('loss and order from timestamp gaps when there are no sequence numbers (common practice, no source)', () => {
  it('counts round(gap x rate) - 1 missing samples per gap', () => {
    // gaps of 3 intervals (0.02 -> 0.05) and 3.05 intervals (0.06 -> 0.0905): 2 + 2 missing.
    const r = counted(100, [0, 0.01, 0.02, 0.05, 0.06, 0.0905].map((t) => [t, null] as const)).report();
    expect(r).toMatchObject({ samples: 6, lost: 4, outOfOrder: 0, lossFrom: 'timestamps' });
  });

  it('takes a gap of under 1.5 intervals as no loss (timestamp jitter)', () => {
    expect(counted(100, [[0, null], [0.0149, null], [0.0251, null]]).report().lost).toBe(0);
  });

  it('counts a late sample as out of order and no longer lost; a repeated timestamp as out of order only', () => {
    const r = counted(100, [0, 0.01, 0.03, 0.02, 0.04, 0.04].map((t) => [t, null] as const)).report();
    expect(r).toMatchObject({ lost: 0, outOfOrder: 2, lossFrom: 'timestamps' });
  });

  it('falls back to timestamps when some samples lack a number', () => {
    expect(counted(100, [[0, 1], [0.01, null], [0.04, 4]]).report()).toMatchObject({ lost: 2, lossFrom: 'timestamps' });
  });
});

describe('measured rate = (samples - 1) / (last - first timestamp) (the definition in issue 4)', () => {
  it('is the nominal rate on a full grid and lower with losses', () => {
    expect(counted(250, [0, 1, 2, 3, 4].map((i) => [10 + i / 250, i] as const)).report().measuredRateHz).toBeCloseTo(250, 9);
    expect(counted(100, [[0, null], [0.01, null], [0.02, null], [0.05, null]]).report().measuredRateHz).toBeCloseTo(60, 9);
  });

  it('uses the first and last timestamps, not the first and last to arrive', () => {
    expect(counted(100, [[0.02, 3], [0, 1], [0.01, 2], [0.04, 5]]).report().measuredRateHz).toBeCloseTo(75, 9);
  });

  it('is null with fewer than two distinct timestamps', () => {
    expect(counted(100, [[1, 1]]).report().measuredRateHz).toBeNull();
    expect(new FeedQualityCounter().report()).toMatchObject({ samples: 0, lost: 0, measuredRateHz: null, jitterMsP99: null, nominalRateHz: null, lossFrom: null });
  });
});

describe('a new hello (tracker restarted)', () => {
  it('starts new numbering and a new clock; totals add up over both stretches', () => {
    const c = new FeedQualityCounter();
    c.hello(hello(100));
    for (let s = 1; s <= 5; s++) c.sample(sample(s / 100, s), s * 1e7);
    c.hello(hello(50));
    c.sample(sample(500, 1), 1e9);
    c.sample(sample(500.04, 3), 1e9 + 4e7);
    const r = c.report();
    expect(r).toMatchObject({ samples: 7, lost: 1, outOfOrder: 0, hellos: 2, nominalRateHz: 50 });
    expect(r.measuredRateHz).toBeCloseTo((4 + 1) / (0.04 + 0.04), 9);
  });

  it('refuses a sample before any hello', () => {
    expect(() => new FeedQualityCounter().sample(sample(1), 0)).toThrow(/before hello/);
  });
});

describe('jitter p99 = 99th percentile of |arrival interval - nominal interval|, ms', () => {
  it('is exactly the 100th of 101 sorted deviations (Hyndman and Fan 1996, definition 7: h = (n - 1) p)', () => {
    const c = new FeedQualityCounter();
    c.hello(hello(100)); // nominal interval 10 ms
    let arrivalMs = 0;
    const intervalsMs = [...Array(99).fill(10), 13, 3]; // deviations: 99 zeros, 3, 7
    c.sample(sample(0, 0), 0);
    intervalsMs.forEach((dMs, i) => {
      arrivalMs += dMs;
      c.sample(sample((i + 1) / 100, i + 1), arrivalMs * 1e6);
    });
    expect(c.report().jitterMsP99).toBeCloseTo(3, 9);
  });

  it('interpolates between ranks, and counts two samples arriving together as a full interval off', () => {
    const c = new FeedQualityCounter();
    c.hello(hello(100));
    // Deviations 0..10 ms: p99 = x[9] + 0.9 (x[10] - x[9]) = 9.9.
    const arrivalsMs = [0, 10, 19, 31, 38, 52, 57, 73, 76, 94, 95, 115];
    arrivalsMs.forEach((a, i) => c.sample(sample(i / 100, i), a * 1e6));
    expect(c.report().jitterMsP99).toBeCloseTo(9.9, 9);
    const together = new FeedQualityCounter();
    together.hello(hello(500));
    together.sample(sample(0, 0), 5e6);
    together.sample(sample(0.002, 1), 5e6);
    expect(together.report().jitterMsP99).toBeCloseTo(2, 12);
  });
});

describe('garbage', () => {
  it('counts every line and keeps the reasons with their counts', () => {
    const c = new FeedQualityCounter();
    ['sample before any hello', 'not valid JSON: "{"', 'sample before any hello'].forEach((r) => c.garbage(r));
    expect(c.report()).toMatchObject({ garbageLines: 3, garbageReasons: [{ reason: 'sample before any hello', count: 2 }, { reason: 'not valid JSON: "{"', count: 1 }] });
  });

  it('keeps at most 20 distinct reasons but counts every line', () => {
    const c = new FeedQualityCounter();
    for (let i = 0; i < 30; i++) c.garbage(`reason ${i}`);
    expect(c.report().garbageLines).toBe(30);
    expect(c.report().garbageReasons).toHaveLength(20);
  });
});

describe('percentileInPlace', () => {
  // The same values through numpy.percentile (default linear method), run once with Debian's
  // python3-numpy 1.24 and kept here for machines without it:
  //   python3 -c "import numpy as n; v=[((i*37)%101)/7+(i%5)*0.01 for i in range(203)]; print([repr(n.percentile(v,p)) for p in (0,50,90,99,99.9,100)])"
  const values = Array.from({ length: 203 }, (_, i) => ((i * 37) % 101) / 7 + (i % 5) * 0.01);
  const ps = [0, 50, 90, 99, 99.9, 100];
  const numpyValues = [0.0, 7.142857142857143, 12.885142857142856, 14.152657142857143, 14.293694285714286, 14.295714285714286];

  it('matches numpy.percentile', () => {
    const ours = ps.map((p) => percentileInPlace(Float64Array.from(values), p)!);
    ours.forEach((v, i) => expect(v).toBeCloseTo(numpyValues[i]!, 12));
    const live = liveNumpy(values, ps);
    if (live) ours.forEach((v, i) => expect(v).toBeCloseTo(live[i]!, 12));
  });

  it('is null for no values and refuses p outside 0..100', () => {
    expect(percentileInPlace(new Float64Array(0), 99)).toBeNull();
    expect(() => percentileInPlace(new Float64Array(1), 101)).toThrow(RangeError);
  });
});

function liveNumpy(values: number[], ps: number[]): number[] | null {
  try {
    const script = 'import json,sys,numpy as n; d=json.load(sys.stdin); print(json.dumps([float(n.percentile(d["v"],p)) for p in d["p"]]))';
    return JSON.parse(execFileSync('/usr/bin/python3', ['-c', script], { input: JSON.stringify({ v: values, p: ps }), encoding: 'utf8' })) as number[];
  } catch {
    return null;
  }
}
