import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { recordingExportCommand } from '../../app/cli/commands/recording/export';
import { recordingInspectCommand } from '../../app/cli/commands/recording/inspect';
import { runCli } from '../../app/cli/run-cli';
import type { GazeHello } from '../../app/core/gaze/gaze-sample';
import { encodeHello, encodeSampleNdjson } from '../../app/core/gaze/feed';
import { placeSensor } from '../../app/core/geometry/placement';
import type { ClipStartData } from '../../app/core/recording/message-kinds';
import { createFeedListener, connectFeedSender, formatFeedUrl } from '../../app/host/gaze/feed';
import { createHostLog } from '../../app/host/log';
import { createMonotonicClock } from '../../app/host/monotonic-clock';
import { readSession } from '../../app/host/recording/read-session';
import { createRecordingSink } from '../../app/host/recording/recording-sink';
import { RelaySink } from '../../app/host/recording/relay-sink';
import { SessionRecorder } from '../../app/host/recording/session-recorder';

// A tracker bridge drops its TCP connection in the middle of a clip and comes back 150 ms
// later (its samples numbered on, 100 of them lost meanwhile). The session records the
// disconnection and the reconnection, the gap from the last sample before to the first
// after, and keeps recording; inspect reports exactly that gap, export places every
// sample on the clip.
const hello: GazeHello = { protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 500, eyes: 'left', screen: { widthPx: 1920, heightPx: 1080 }, pupilUnit: null, source: 'bay 4 bridge' };
const trackerTime = (k: number) => 100 + k / 500;
// Gaze on sensor pixel (100 + k % 50, 200) of a 640x480 clip fitted on 1920x1080 (scale 2.25, left 240, top 0).
const gazeX = (k: number) => 240 + 2.25 * (100 + (k % 50) + 0.5);
const gazeY = 2.25 * 200.5;
const display = { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 };
const placement = placeSensor({ width: 640, height: 480 }, display, 'fit');
const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function cli(args: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await runCli(args, [recordingInspectCommand, recordingExportCommand], { stdout: { write: (t: string) => out.push(t) }, stderr: { write: (t: string) => err.push(t) } }, 'test');
  expect(err.join('')).toBe('');
  expect(code).toBe(0);
  return JSON.parse(out.join(''));
}

async function sendSamples(url: string, from: number, to: number) {
  const sender = await connectFeedSender(url);
  await sender.send([encodeHello(hello)]);
  for (let k = from; k < to; k += 20) {
    const lines = [];
    for (let j = k; j < Math.min(to, k + 20); j++) lines.push(encodeSampleNdjson({ seq: j, trackerTimeS: trackerTime(j), left: { x: gazeX(j), y: gazeY, valid: true, pupil: null }, right: null }));
    await sender.send(lines);
    await pause(40); // 20 samples at 500 Hz
  }
  return sender;
}

describe('a tracker that disconnects and reconnects mid-clip', () => {
  it('is recorded as a gap with its start and end, and the recording resumes', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'gz-gap-')), 'session');
    const clock = createMonotonicClock();
    const recorder = await SessionRecorder.create(dir, { display }, { clock, clockOriginNs: clock.originNs });
    const relay = new RelaySink();
    const listener = createFeedListener('tcp://127.0.0.1:0', { clock, log: createHostLog({ file: null, echo: false }) });
    await listener.start(relay);
    const sink = createRecordingSink(recorder, { nowNs: () => clock.nowNs(), toHostNs: (_t, arrivalNs) => arrivalNs });
    relay.attach(sink);
    const url = formatFeedUrl(listener.address!);

    // The stage starts the clip and presents a frame every 16 ms while the tracker comes and goes.
    const clipStartNs = clock.nowNs();
    const clip: ClipStartData = { clip: 'aisle-2 forklift', speed: 1, placement, display };
    recorder.appendMessage({ hostNs: clipStartNs, kind: 'clip_start', data: { ...clip } });
    let frame = 0;
    const stage = setInterval(() => {
      const hostNs = clock.nowNs();
      recorder.appendFrames([{ frame: frame++, stageTimeMs: hostNs / 1e6, hostNs, clip: 'aisle-2 forklift', stimulusUs: (hostNs - clipStartNs) / 1e3, eventsDrawn: 1000, late: false, photodiode: null }]);
    }, 16);
    await pause(100); // the clip is under way when the tracker's samples begin
    const first = await sendSamples(url, 0, 200);
    await first.close();
    await pause(150);
    const second = await sendSamples(url, 300, 500);
    await pause(50);
    relay.end();
    sink.finish();
    await listener.stop();
    await second.close();
    clearInterval(stage);
    await recorder.close();

    const kinds = [];
    for await (const m of (await readSession(dir)).messages()) kinds.push(m.kind === 'tracker_connection' ? `${m.kind} ${m.data.state}` : m.kind);
    expect(kinds).toEqual(['recording_open', 'clip_start', 'tracker_connection connected', 'tracker_hello', 'tracker_connection disconnected', 'gap_start', 'tracker_connection connected', 'tracker_hello', 'gap_end']);
    expect(sink).toMatchObject({ samples: 400, disconnects: 1, garbageLines: 0 });

    const report = await cli(['recording', 'inspect', dir, '--json']);
    expect(report).toEqual({ samples: 400, first_timestamp: 100, last_timestamp: trackerTime(499), gaps: [{ start: trackerTime(199), end: trackerTime(300) }], corrupt_chunks: 0, torn_tail_bytes: 0, clean_close: true, warnings: [] });

    const out = join(dir, '..', 'gaze.tsv');
    const exported = await cli(['recording', 'export', dir, '--out', out, '--stimulus', '--json']);
    expect(exported).toMatchObject({ samples: 400, in_clip: 400 });
    expect(exported.tracker_runs).toHaveLength(2); // each hello starts a tracker run
    const rows = readFileSync(out, 'utf8').trimEnd().split('\n').map((line) => line.split('\t'));
    expect(rows[0]).toEqual(['timestamp', 'x_coordinate', 'y_coordinate', 'pupil_size', 'tracker_timestamp', 'clip', 'stimulus_time_us', 'sensor_x', 'sensor_y']);
    const samples = [...Array.from({ length: 200 }, (_, k) => k), ...Array.from({ length: 200 }, (_, k) => 300 + k)];
    expect(rows.slice(1).map((r) => [r[4], r[5], r[7], r[8]])).toEqual(samples.map((k) => [String(trackerTime(k)), 'aisle-2 forklift', String(100 + (k % 50)), '200']));
    // The stimulus time shown rises with the sample time (the frames were on screen in order).
    const stimulus = rows.slice(1).map((r) => Number(r[6]));
    expect(stimulus.every((s, i) => i === 0 || s >= stimulus[i - 1]!)).toBe(true);
  });
});
