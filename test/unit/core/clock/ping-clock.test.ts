import { describe, expect, it } from 'vitest';
import { PingClockEstimator, pingOffsetDelay, type PingExchange } from '../../../../app/core/clock/ping-clock';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

/** One exchange with the server clock ahead by offset, up and down transit times and the server's turnaround (all ms). */
function exchange(t1: number, offset: number, upMs: number, turnaroundMs: number, downMs: number): PingExchange {
  const t2 = t1 + upMs + offset;
  const t3 = t2 + turnaroundMs;
  return { t1, t2, t3, t4: t3 - offset + downMs };
}

describe('pingOffsetDelay (Mills, 1991; RFC 5905, section 8; REFERENCES.md section 7, t7_clock.py)', () => {
  it('T = (1000, 1012.5, 1012.7, 1005.2) ms gives offset 10.0, delay 5.0 and bound 2.5', () => {
    const { offset, delay } = pingOffsetDelay({ t1: 1000, t2: 1012.5, t3: 1012.7, t4: 1005.2 });
    expect(offset).toBeCloseTo(10.0, 12);
    expect(delay).toBeCloseTo(5.0, 12);
    const estimator = new PingClockEstimator();
    estimator.add({ t1: 1000, t2: 1012.5, t3: 1012.7, t4: 1005.2 });
    expect(estimator.estimate()!.uncertainty).toBeCloseTo(2.5, 12);
  });

  it('errs by half the difference of the one-way delays, never more than delay / 2', () => {
    const rng = new Xoshiro128(21);
    for (let i = 0; i < 200; i++) {
      const [up, down] = [rng.nextExponential(0.5), rng.nextExponential(0.5)];
      const { offset, delay } = pingOffsetDelay(exchange(1e5 * rng.next(), 523.4, up, 0.3 * rng.next(), down));
      expect(offset - 523.4).toBeCloseTo((up - down) / 2, 9);
      expect(Math.abs(offset - 523.4)).toBeLessThanOrEqual(delay / 2 + 1e-9);
    }
    // All of the delay in one direction: the error is exactly the bound.
    const oneWay = pingOffsetDelay(exchange(0, -40, 6, 1, 0));
    expect(oneWay.delay).toBeCloseTo(6, 12);
    expect(oneWay.offset - -40).toBeCloseTo(3, 12);
  });

  it('takes a negative delay (rounding between the two clocks) as zero', () => {
    expect(pingOffsetDelay({ t1: 10, t2: 20, t3: 20.5, t4: 10.4 }).delay).toBe(0);
  });

  it('throws RangeError naming the field for times out of order or not finite', () => {
    expect(() => pingOffsetDelay({ t1: 10, t2: 20, t3: 21, t4: 9 })).toThrow(/exchange.t4 .* must not be before exchange.t1/);
    expect(() => pingOffsetDelay({ t1: 10, t2: 20, t3: 19, t4: 12 })).toThrow(/exchange.t3 .* must not be before exchange.t2/);
    expect(() => pingOffsetDelay({ t1: 10, t2: NaN, t3: 19, t4: 12 })).toThrow(/exchange.t2 must be a finite number/);
  });
});

describe('PingClockEstimator, the minimum-delay filter of NTP (Mills, 1991; RFC 5905, section 10)', () => {
  it('picks the minimum-delay exchange of the last 8, and forgets it once 8 newer ones have come', () => {
    const estimator = new PingClockEstimator();
    expect(estimator.estimate()).toBeNull();
    expect(estimator.toServer(0)).toBeNull();
    expect(estimator.toClient(0)).toBeNull();
    const delays = [4, 3, 0.5, 6, 2, 5, 7, 3.5]; // the 0.5 ms one is the third
    delays.forEach((d, i) => estimator.add(exchange(100 * i, 200, d * 0.75, 0.1, d * 0.25)));
    let e = estimator.estimate()!;
    expect(e.delay).toBeCloseTo(0.5, 12);
    expect(e.offset).toBeCloseTo(200 + (0.5 * 0.75 - 0.5 * 0.25) / 2, 12);
    expect(e.samples).toBe(8);
    expect(estimator.toServer(1000)).toBeCloseTo(1000 + e.offset, 12);
    expect(estimator.toClient(1200)).toBeCloseTo(1200 - e.offset, 12);
    for (let i = 0; i < 3; i++) estimator.add(exchange(1000 + 100 * i, 200, 4, 0.1, 4));
    e = estimator.estimate()!;
    expect(e.delay).toBeCloseTo(2, 12); // 0.5 has left the window of 8; 2 is the least of the rest
    expect(e.samples).toBe(8);
  });

  it('prefers the newer of two exchanges with the same delay', () => {
    const estimator = new PingClockEstimator({ keep: 4 });
    estimator.add(exchange(0, 10, 1, 0, 1));
    estimator.add(exchange(100, 11, 1, 0, 1));
    expect(estimator.estimate()!.offset).toBeCloseTo(11, 12);
  });

  it('converges under jitter: the estimate stays within its bound and beats single exchanges', () => {
    // One-way delays of 0.1 ms plus exponential jitter with a 2 ms mean each way, the server 523.4 ms ahead.
    const rng = new Xoshiro128(22);
    const estimator = new PingClockEstimator({ keep: 8 });
    const rawErrors: number[] = [];
    const estimateErrors: number[] = [];
    for (let i = 0; i < 400; i++) {
      const x = exchange(50 * i, 523.4, 0.1 + rng.nextExponential(0.5), 0.05, 0.1 + rng.nextExponential(0.5));
      rawErrors.push(Math.abs(pingOffsetDelay(x).offset - 523.4));
      estimator.add(x);
      const e = estimator.estimate()!;
      expect(Math.abs(e.offset - 523.4)).toBeLessThanOrEqual(e.uncertainty + 1e-9);
      estimateErrors.push(Math.abs(e.offset - 523.4));
    }
    const median = (v: number[]) => v.slice().sort((a, b) => a - b)[v.length >> 1]!;
    expect(median(estimateErrors.slice(8))).toBeLessThan(median(rawErrors) / 2);
  });

  it('throws RangeError for a bad keep', () => {
    expect(() => new PingClockEstimator({ keep: 0 })).toThrow(/keep must be a positive integer/);
    expect(() => new PingClockEstimator({ keep: 2.5 })).toThrow(RangeError);
  });
});
