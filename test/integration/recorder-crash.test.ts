import { spawn, type ChildProcess } from 'node:child_process';
import { appendFileSync, mkdtempSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { build } from 'esbuild';
import { beforeAll, describe, expect, it } from 'vitest';
import { recordingExportCommand } from '../../app/cli/commands/recording/export';
import { recordingInspectCommand } from '../../app/cli/commands/recording/inspect';
import { runCli } from '../../app/cli/run-cli';
import { CHUNK_HEADER_BYTES, RECORD_STREAMS, type RecordStream } from '../../app/core/recording/chunk-format';
import type { FrameRecord, GazeRecord, MessageRecord } from '../../app/core/recording/records';
import { Xoshiro128 } from '../../app/core/random/xoshiro128';
import { readSession } from '../../app/host/recording/read-session';
import { examineSession, recoverSession } from '../../app/host/recording/recover-session';
import { streamPath } from '../../app/host/recording/session-files';
import { frameAt, gazeAt, messageAt } from './fixtures-recorder/generated-records';

// The recorder's promise, tested the hard way: a separate process records generated gaze
// (2000 Hz), frames (120 Hz) and messages with a 50 ms flush interval and is killed with
// SIGKILL at random moments, five times, the session reopened (and so recovered) each time.
// After each kill: every record appended more than 100 ms before the kill (the bound the
// recorder promises) is recovered, byte for byte what was generated; no chunk is corrupt;
// a torn tail (emulated on some kills as a write cut short) is cut and reported in bytes.
const FLUSH_BOUND_NS = 100_000_000n;

let generator: string;
let dir: string;

beforeAll(async () => {
  const out = mkdtempSync(join(tmpdir(), 'gz-crash-'));
  generator = join(out, 'record-generator.mjs');
  await build({ entryPoints: [join(__dirname, 'fixtures-recorder/record-generator.ts')], outfile: generator, bundle: true, platform: 'node', format: 'esm', target: 'node20', logLevel: 'warning' });
  dir = join(out, 'session');
});

interface Report {
  readonly appended: Record<RecordStream, number>;
  readonly atNs: bigint;
}

interface Run {
  readonly child: ChildProcess;
  readonly startedAtNs: bigint;
  /** The child's host clock zero on the monotonic clock, known once it is ready. */
  originNs(): bigint;
  readonly ready: Promise<void>;
  readonly reports: Report[];
  readonly exited: Promise<number | null>;
}

function startRecorder(plan: object): Run {
  const startedAtNs = process.hrtime.bigint();
  const child = spawn(process.execPath, [generator, JSON.stringify(plan)], { stdio: ['ignore', 'pipe', 'inherit'] });
  const reports: Report[] = [];
  let origin: bigint | null = null;
  let ready!: () => void;
  const readyPromise = new Promise<void>((resolve) => (ready = resolve));
  createInterface({ input: child.stdout! }).on('line', (line) => {
    const o = JSON.parse(line);
    if (o.ready) {
      origin = BigInt(o.originNs);
      ready();
    }
    if (o.appended) reports.push({ appended: o.appended, atNs: BigInt(o.atNs) });
  });
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  return { child, startedAtNs, originNs: () => origin!, ready: readyPromise, reports, exited };
}

async function readAll(): Promise<{ gaze: GazeRecord[]; frames: FrameRecord[]; marks: MessageRecord[] }> {
  const reader = await readSession(dir);
  const collect = async <T>(it: AsyncIterable<T>) => {
    const out: T[] = [];
    for await (const r of it) out.push(r);
    return out;
  };
  return { gaze: await collect(reader.gaze()), frames: await collect(reader.frames()), marks: (await collect(reader.messages())).filter((m) => m.kind === 'operator_mark') };
}

async function cli(args: string[]) {
  const out: string[] = [];
  const code = await runCli(args, [recordingInspectCommand, recordingExportCommand], { stdout: { write: (t: string) => out.push(t) }, stderr: { write: () => undefined } }, 'test');
  expect(code).toBe(0);
  return JSON.parse(out.join(''));
}

/** Each sample's arrival on the first opening's clock, from the origins the recorder kept. */
async function sessionArrivals(createdHostNs: number): Promise<number[]> {
  const reader = await readSession(dir);
  const origins: bigint[] = [];
  for await (const m of reader.messages()) if (m.kind === 'recording_open') origins.push(BigInt(m.data.clockOriginNs as string));
  const firsts: number[] = [];
  for await (const m of reader.messages()) if (m.kind === 'recording_open') firsts.push((m.data.firstChunks as { gaze: number }).gaze);
  const out: number[] = [];
  for await (const chunk of reader.chunks('gaze')) {
    const segment = firsts.filter((f) => f <= chunk.seq).length - 1;
    const shiftNs = Number(origins[segment]! - origins[0]!);
    for (const g of chunk.records) out.push((g.arrivalNs + shiftNs - createdHostNs) / 1e9);
  }
  return out;
}

/** Emulates a write cut short by the crash: the first part of a copy of the stream's last chunk. */
function tearTail(stream: RecordStream, lastChunkOffset: number): number {
  const path = streamPath(dir, stream);
  const bytes = readFileSync(path);
  const chunk = bytes.subarray(lastChunkOffset);
  const part = chunk.subarray(0, CHUNK_HEADER_BYTES + Math.floor((chunk.length - CHUNK_HEADER_BYTES) / 2));
  appendFileSync(path, part);
  return part.length;
}

describe('the recorder killed with SIGKILL mid-recording', () => {
  it('keeps every record older than the flush bound, exactly, through five kills, and resumes', async () => {
    const random = new Xoshiro128(20250301);
    const tornBy: Partial<Record<number, RecordStream>> = { 1: 'gaze', 3: 'frames', 4: 'messages' };
    let next = { gaze: 0, frames: 0, messages: 0 };
    let cutTotal = 0;
    for (let kill = 0; kill < 5; kill++) {
      const run = startRecorder({ dir, mode: kill === 0 ? 'create' : 'reopen', next, closeAfterMs: null });
      await run.ready;
      await new Promise((resolve) => setTimeout(resolve, 300 + random.nextInt(900)));
      run.child.kill('SIGKILL');
      const killedAtNs = process.hrtime.bigint();
      await run.exited;

      const before = await examineSession(dir, { repair: false }); // the state right after the kill, unchanged
      let emulated = 0;
      const stream = tornBy[kill];
      if (stream) emulated = tearTail(stream, before.streams[stream].chunks.at(-1)!.offset);
      const sizes = Object.fromEntries(RECORD_STREAMS.map((s) => [s, statSync(streamPath(dir, s)).size]));
      const report = await recoverSession(dir);

      expect(report.corruptChunks, `kill ${kill}`).toBe(0);
      expect(report.cleanClose).toBe(false);
      for (const s of RECORD_STREAMS) {
        const torn = report.streams[s].tornTail;
        // Whatever was torn is cut exactly: the file now ends where the tail began.
        expect(statSync(streamPath(dir, s)).size).toBe(torn ? torn.offset : sizes[s]);
        if (torn) expect(torn.offset + torn.bytes).toBe(sizes[s]);
      }
      if (stream) expect(report.streams[stream].tornTail!.bytes).toBeGreaterThanOrEqual(emulated);
      cutTotal += report.tornTailBytes;
      expect(await recoverSession(dir)).toMatchObject({ tornTailBytes: 0, corruptChunks: 0, indexRebuilt: false }); // idempotent

      const { gaze, frames, marks } = await readAll();
      // Contiguous from the very first record of the session, and exactly what was generated.
      expect(gaze.map((g) => g.seq)).toEqual(gaze.map((_, i) => i));
      expect(gaze).toEqual(gaze.map((g, i) => gazeAt(i, g.arrivalNs)));
      expect(frames).toEqual(frames.map((_, i) => frameAt(i)));
      expect(marks).toEqual(marks.map((_, i) => messageAt(i)));
      expect(report.recovered.gaze).toBe(gaze.length);

      // Everything appended more than the flush bound before the kill is there.
      const old = run.reports.filter((r) => r.atNs < killedAtNs - FLUSH_BOUND_NS).at(-1);
      expect(old, `kill ${kill}: no report older than the flush bound`).toBeDefined();
      expect(gaze.length).toBeGreaterThanOrEqual(old!.appended.gaze);
      expect(frames.length).toBeGreaterThanOrEqual(old!.appended.frames);
      expect(marks.length).toBeGreaterThanOrEqual(old!.appended.messages);
      // This run's samples arrived between its start and the kill, on the machine's monotonic clock.
      const arrivals = gaze.slice(next.gaze).map((g) => (run.originNs() + BigInt(Math.round(g.arrivalNs))));
      expect(arrivals.every((a) => a > run.startedAtNs && a < killedAtNs)).toBe(true);
      next = { gaze: gaze.length, frames: frames.length, messages: marks.length };
    }
    expect(cutTotal).toBeGreaterThan(0);

    // The last opening closes cleanly; inspect sees the whole session and what the recoveries cut.
    const last = startRecorder({ dir, mode: 'reopen', next, closeAfterMs: 500 });
    expect(await last.exited).toBe(0);
    const { gaze } = await readAll();
    expect(gaze).toEqual(gaze.map((g, i) => gazeAt(i, g.arrivalNs)));
    const doc = await cli(['recording', 'inspect', dir, '--json']);
    expect(doc).toMatchObject({ samples: gaze.length, first_timestamp: 5000, last_timestamp: 5000 + (gaze.length - 1) / 2000, gaps: [], corrupt_chunks: 0, torn_tail_bytes: cutTotal, clean_close: true });

    // Six host processes, six host clocks: export puts them all on the session clock, exactly,
    // by their origins on the machine's monotonic clock (each segment one tracker run).
    const tsv = join(dir, '..', 'gaze.tsv');
    const exported = await cli(['recording', 'export', dir, '--out', tsv, '--json']);
    expect(exported).toMatchObject({ samples: gaze.length, warnings: [] });
    expect(exported.tracker_runs).toHaveLength(6);
    const created = (await readSession(dir)).info.createdHostNs;
    const timestamps = readFileSync(tsv, 'utf8').trimEnd().split('\n').slice(1).map((line) => Number(line.split('\t')[0]));
    // Each sample was appended (its arrival) within a few ms of its place on the generator's
    // schedule, which the fit of its run follows; a segment put on the wrong clock would be seconds off.
    const arrivals = await sessionArrivals(created);
    expect(Math.max(...timestamps.map((t, i) => Math.abs(t - arrivals[i]!)))).toBeLessThan(0.1);
  });
});

