import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { feedReplayCommand } from '../../app/cli/commands/feed/replay';
import { runCli } from '../../app/cli/run-cli';
import { ManualClock } from '../../app/core/clock/host-clock';
import { replayHello, type RecordedGazeRow } from '../../app/core/gaze/feed';
import type { GazeHello, GazeSample } from '../../app/core/gaze/gaze-sample';
import { Xoshiro128 } from '../../app/core/random/xoshiro128';
import { createFeedListener, formatFeedUrl, replayGaze, type DeadlineTimer, type FeedListener } from '../../app/host/gaze/feed';
import { createHostLog } from '../../app/host/log';

// Replay of a recorded gaze file through the feed (issue 4). Timing is checked in simulated
// time: the timer below wakes up late by a random amount, as a busy machine would.

/** A 2000 Hz recording with jitter on its timestamps and one 40 ms gap (tracker lost the eye). */
function recording(n: number): RecordedGazeRow[] {
  const g = new Xoshiro128(3);
  return Array.from({ length: n }, (_, i) => ({ trackerTimeS: 800 + i / 2000 + (i > n / 2 ? 0.04 : 0) + g.next() * 20e-6, x: 700 + i, y: 400, pupil: null }));
}

/** A ManualClock timer that oversleeps each deadline still ahead by 0 to `lateNs`, and returns at once for one already past. */
function lateTimer(lateNs: number, seed: number): DeadlineTimer & { clock: ManualClock } {
  const clock = new ManualClock(5e9);
  const g = new Xoshiro128(seed);
  return {
    clock,
    async sleepUntilNs(deadlineNs) {
      if (deadlineNs > clock.nowNs()) clock.advanceNs(deadlineNs - clock.nowNs() + g.next() * lateNs);
    },
  };
}

describe('replayGaze timing, in simulated time', () => {
  it.each([1, 2.5])('sends each sample at its absolute deadline, so lateness never adds up (speed %s)', async (speed) => {
    const rows = recording(20_000);
    const hello = replayHello(rows, 'test');
    const lateNs = 300_000;
    const timer = lateTimer(lateNs, 9);
    const sentAtNs: number[] = [];
    const result = await replayGaze(rows, { hello, timer, speed, format: 'tsv', send: async () => void sentAtNs.push(timer.clock.nowNs()) });
    expect(result.samples).toBe(rows.length);
    expect(sentAtNs).toHaveLength(rows.length + 1); // the hello, then every row
    const startNs = sentAtNs[0]!;
    const errorsNs = rows.map((r, i) => sentAtNs[i + 1]! - startNs - ((r.trackerTimeS - rows[0]!.trackerTimeS) / speed) * 1e9);
    // Every send lies within one oversleep of its deadline, to the last of 20 000 (relative
    // sleeps would be late by about 20 000 x 150 µs = 3 s by then).
    expect(Math.min(...errorsNs)).toBeGreaterThanOrEqual(-1e-3);
    expect(Math.max(...errorsNs)).toBeLessThanOrEqual(lateNs + 1e-3);
    expect(result.maxLateMs).toBeCloseTo(Math.max(...errorsNs) / 1e6, 6);
    // The intervals are those of the file (within the oversleep), the gap included.
    const gapIndex = rows.length / 2;
    expect((sentAtNs[gapIndex + 2]! - sentAtNs[gapIndex + 1]!) * speed).toBeGreaterThan(40e6);
  });

  it('refuses a speed that is not above 0', async () => {
    const rows = recording(3);
    await expect(replayGaze(rows, { hello: replayHello(rows, 't'), timer: lateTimer(0, 1), speed: 0, format: 'tsv', send: async () => undefined })).rejects.toThrow(RangeError);
  });
});

describe('gazeloom feed replay', () => {
  let listener: FeedListener | null = null;
  afterEach(async () => {
    await listener?.stop();
    listener = null;
  });

  async function receive(transport: 'udp' | 'tcp') {
    const hellos: GazeHello[] = [];
    const samples: GazeSample[] = [];
    const garbage: string[] = [];
    listener = createFeedListener(`${transport}://127.0.0.1:0`, { clock: new ManualClock(), log: createHostLog({ file: null, echo: false }) });
    await listener.start({ hello: (h) => hellos.push(h), sample: (s) => samples.push(s), garbage: (r) => garbage.push(r), connection: () => undefined });
    return { hellos, samples, garbage, url: formatFeedUrl(listener.address!) };
  }

  const file = (() => {
    const dir = mkdtempSync(join(tmpdir(), 'gz-replay-'));
    const rows = ['timestamp\tx_coordinate\ty_coordinate\tpupil_size\ttracker_timestamp'];
    for (let i = 0; i < 300; i++) rows.push(i % 40 === 5 ? `${(i / 500).toFixed(3)}\tn/a\tn/a\tn/a\t${(42 + i / 500).toFixed(6)}` : `${(i / 500).toFixed(3)}\t${500 + i}\t${300 + (i % 7)}\t${(3 + i / 1000).toFixed(3)}\t${(42 + i / 500).toFixed(6)}`);
    writeFileSync(join(dir, 'aisle-gaze.tsv'), `${rows.join('\n')}\n`);
    return join(dir, 'aisle-gaze.tsv');
  })();

  it.each([
    ['udp', 'ndjson'],
    ['tcp', 'tsv'],
  ] as const)('sends a recorded file over %s as %s: a derived hello, then every row numbered, blinks as invalid', async (transport, format) => {
    const { hellos, samples, garbage, url } = await receive(transport);
    const out: string[] = [];
    const code = await runCli(['feed', 'replay', file, '--to', url, '--speed', '5', '--format', format, '--json'], [feedReplayCommand], { stdout: { write: (t: string) => out.push(t) }, stderr: { write: (t: string) => out.push(t) } }, 'test');
    expect(code).toBe(0);
    const doc = JSON.parse(out.join(''));
    expect(doc).toMatchObject({ file, to: url, samples: 300, speed: 5, format, warnings: [] });
    expect(doc.rate_hz).toBeCloseTo(500, 6);
    expect(doc.duration_s).toBeCloseTo(299 / 500, 9);
    for (let i = 0; i < 200 && samples.length < 300; i++) await new Promise((r) => setTimeout(r, 10));
    expect(hellos).toEqual([{ protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: doc.rate_hz, eyes: 'left', screen: null, pupilUnit: 'arbitrary', source: 'gazeloom feed replay aisle-gaze.tsv' }]);
    expect(garbage).toEqual([]);
    expect(samples.map((s) => s.seq)).toEqual(Array.from({ length: 300 }, (_, i) => i));
    expect(samples[5]).toEqual({ seq: 5, trackerTimeS: 42.01, left: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null }, right: null });
    expect(samples[6]).toEqual({ seq: 6, trackerTimeS: 42.012, left: { x: 506, y: 306, valid: true, pupil: 3.006 }, right: null });
  });

  it('refuses a file that is not a gaze export, naming its line', async () => {
    const bad = join(mkdtempSync(join(tmpdir(), 'gz-replay-')), 'events.csv');
    writeFileSync(bad, 't,x,y,p\n1,2,3,1\n');
    const err: string[] = [];
    const code = await runCli(['feed', 'replay', bad, '--to', 'udp://127.0.0.1:9'], [feedReplayCommand], { stdout: { write: () => true }, stderr: { write: (t: string) => err.push(t) } }, 'test');
    expect(code).toBe(2);
    expect(err.join('')).toContain(`${bad} line 1: the header row lacks timestamp`);
  });
});
