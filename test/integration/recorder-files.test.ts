import { cpSync, mkdirSync, mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { recordingInspectCommand } from '../../app/cli/commands/recording/inspect';
import { runCli } from '../../app/cli/run-cli';
import { ManualClock } from '../../app/core/clock/host-clock';
import { CHUNK_HEADER_BYTES } from '../../app/core/recording/chunk-format';
import type { GazeRecord } from '../../app/core/recording/records';
import { findUnclosedSessions } from '../../app/host/recording/find-unclosed-sessions';
import { readSession } from '../../app/host/recording/read-session';
import { examineSession, recoverSession } from '../../app/host/recording/recover-session';
import { INDEX_FILE, streamPath } from '../../app/host/recording/session-files';
import { SessionFolderError } from '../../app/host/recording/session-folder-error';
import { SessionRecorder } from '../../app/host/recording/session-recorder';
import { frameAt, gazeAt, messageAt } from './fixtures-recorder/generated-records';
import { manualTimer } from './fixtures-recorder/manual-timer';

// The recorder's file rules in simulated time (a ManualClock and a flush timer the test
// fires): chunks on a tick, damage in the middle counted and kept, the index never needed,
// never an overwrite. Record content comes from the crash test's generator.
const root = mkdtempSync(join(tmpdir(), 'gz-recfiles-'));
let n = 0;
const freshDir = () => join(root, `session-${n++}`);

async function collect<T>(it: AsyncIterable<T>): Promise<T[]> {
  const out: T[] = [];
  for await (const r of it) out.push(r);
  return out;
}

/** A closed session of `chunks` gaze chunks of 100 samples, a frame chunk per tick and a message per chunk. */
async function recorded(chunks: number, dir = freshDir()): Promise<{ dir: string; gaze: GazeRecord[] }> {
  const clock = new ManualClock(1e9);
  const flush = manualTimer();
  const rec = await SessionRecorder.create(dir, { display: { widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 }, metadata: { participant: 'P07' } }, { clock, timer: flush.timer });
  const gaze: GazeRecord[] = [];
  const opened = rec.stats.flushes; // the opening flushes its recording_open message at once
  for (let c = 0; c < chunks; c++) {
    for (let i = 0; i < 100; i++) {
      const g = gazeAt(c * 100 + i, clock.nowNs());
      rec.appendGaze(g);
      gaze.push(g);
      clock.advanceNs(5e5);
    }
    rec.appendFrames([frameAt(2 * c), frameAt(2 * c + 1)]);
    rec.appendMessage(messageAt(c));
    flush.fire();
    await vi.waitFor(() => expect(rec.stats.flushes).toBe(opened + c + 1));
  }
  await rec.close();
  expect(flush.cancelled).toBe(true);
  return { dir, gaze };
}

const gazeChunkOffsets = async (dir: string) => (await examineSession(dir, { repair: false })).streams.gaze.chunks.map((c) => c.offset);

async function inspect(dir: string) {
  const out: string[] = [];
  const code = await runCli(['recording', 'inspect', dir, '--json'], [recordingInspectCommand], { stdout: { write: (t: string) => out.push(t) }, stderr: { write: () => undefined } }, 'test');
  expect(code).toBe(0);
  return JSON.parse(out.join(''));
}

describe('session recorder files', () => {
  it('writes one chunk per stream on each flush tick, in simulated time, and reads back everything', async () => {
    const { dir, gaze } = await recorded(6);
    const check = await examineSession(dir, { repair: false });
    expect(check.streams.gaze.chunks.map((c) => c.count)).toEqual([100, 100, 100, 100, 100, 100]);
    expect(check.streams.frames.chunks.map((c) => c.count)).toEqual([2, 2, 2, 2, 2, 2]);
    expect(check.streams.messages.chunks.map((c) => c.count)).toEqual([1, 1, 1, 1, 1, 1, 1]); // recording_open is made durable alone, at the opening
    const reader = await readSession(dir);
    expect(await collect(reader.gaze())).toEqual(gaze);
    expect(reader.info).toMatchObject({ format: 'gazeloom-session', version: 1, createdHostNs: 1e9, display: { widthPx: 1920 }, metadata: { participant: 'P07' } });
    expect(Date.parse(reader.info.createdAt)).not.toBeNaN();
    // Host-time range reads, through the index, match filtering everything.
    const from = gaze[250]!.hostNs;
    const to = gaze[420]!.hostNs;
    expect(await collect(reader.gaze({ fromHostNs: from, toHostNs: to }))).toEqual(gaze.filter((g) => g.hostNs >= from && g.hostNs <= to));
  });

  it('counts a chunk damaged in the middle as corrupt, keeps it and everything after it readable', async () => {
    const { dir, gaze } = await recorded(6);
    const offsets = await gazeChunkOffsets(dir);
    const file = streamPath(dir, 'gaze');
    const bytes = readFileSync(file);
    bytes[offsets[2]! + CHUNK_HEADER_BYTES + 1000] ^= 0x04; // one bit in a record of chunk 2
    writeFileSync(file, bytes);
    const report = await recoverSession(dir);
    expect(report).toMatchObject({ corruptChunks: 1, tornTailBytes: 0, recovered: { gaze: 500 } });
    expect(report.streams.gaze.corrupt).toEqual([{ offset: offsets[2], bytes: offsets[3]! - offsets[2]!, chunks: 1, reason: 'chunk 2 payload checksum does not match' }]);
    expect(readFileSync(file)).toEqual(bytes); // not cut, not repaired: kept as found
    expect(await collect((await readSession(dir)).gaze())).toEqual([...gaze.slice(0, 200), ...gaze.slice(300)]);
    expect(await inspect(dir)).toMatchObject({ samples: 500, corrupt_chunks: 1, torn_tail_bytes: 0, clean_close: true });
  });

  it('finds its way past a damaged chunk header to the chunks after it', async () => {
    const { dir, gaze } = await recorded(5);
    const offsets = await gazeChunkOffsets(dir);
    const file = streamPath(dir, 'gaze');
    const bytes = readFileSync(file);
    bytes[offsets[1]! + 17] ^= 0x80; // chunk 1's payload length
    writeFileSync(file, bytes);
    expect((await recoverSession(dir)).corruptChunks).toBe(1);
    expect(await collect((await readSession(dir)).gaze())).toEqual([...gaze.slice(0, 100), ...gaze.slice(200)]);
  });

  it('cuts a torn tail once, logs it, rebuilds the index, and inspect keeps reporting the cut', async () => {
    const { dir, gaze } = await recorded(3);
    const file = streamPath(dir, 'gaze');
    const size = statSync(file).size;
    const lastChunk = (await gazeChunkOffsets(dir))[2]!;
    writeFileSync(file, readFileSync(file).subarray(0, size - 40)); // the last chunk lost its end: as after a power cut
    const first = await recoverSession(dir);
    // The marker no longer matches the files, so the session counts as not closed.
    expect(first).toMatchObject({ cleanClose: false, tornTailBytes: size - 40 - lastChunk, indexRebuilt: true });
    expect(statSync(file).size).toBe(lastChunk);
    expect(await collect((await readSession(dir)).gaze())).toEqual(gaze.slice(0, 200));
    expect(await recoverSession(dir)).toMatchObject({ tornTailBytes: 0, earlierTornTailBytes: first.tornTailBytes, indexRebuilt: false });
    expect(await inspect(dir)).toMatchObject({ samples: 200, torn_tail_bytes: first.tornTailBytes, clean_close: false });
  });

  it('never needs the index: a garbled or stale one changes nothing', async () => {
    const { dir, gaze } = await recorded(4);
    const from = gaze[150]!.hostNs;
    const expected = gaze.filter((g) => g.hostNs >= from);
    writeFileSync(join(dir, INDEX_FILE), '{"format":"gazeloom-session-index","version":1,"streams":{"gaze":{"bytes":1,"chunks":[[5,9,9,0,1e30]]}}}');
    expect(await collect((await readSession(dir)).gaze({ fromHostNs: from }))).toEqual(expected);
    // An index pointing at offsets that are no longer chunk starts is caught by the header check.
    writeFileSync(join(dir, INDEX_FILE), JSON.stringify({ format: 'gazeloom-session-index', version: 1, streams: { gaze: { bytes: 10, chunks: [[3, 1, 100, 0, 1e30]] }, frames: { bytes: 0, chunks: [] }, messages: { bytes: 0, chunks: [] } } }));
    expect(await collect((await readSession(dir)).gaze({ fromHostNs: from }))).toEqual(expected);
    expect((await recoverSession(dir)).indexRebuilt).toBe(true);
    expect(await collect((await readSession(dir)).gaze({ fromHostNs: from }))).toEqual(expected);
  });

  it('never overwrites: create refuses a folder with anything in it, reopen only appends', async () => {
    const taken = freshDir();
    mkdirSync(taken);
    writeFileSync(join(taken, 'notes.txt'), 'beacon calibration notes');
    const clock = new ManualClock();
    await expect(SessionRecorder.create(taken, { display: null }, { clock, timer: manualTimer().timer })).rejects.toThrow(SessionFolderError);
    await expect(SessionRecorder.create(taken, { display: null }, { clock, timer: manualTimer().timer })).rejects.toThrow(/is not empty \(1 entry, e.g. "notes.txt"\); a new session is never written over existing files/);
    expect(readFileSync(join(taken, 'notes.txt'), 'utf8')).toBe('beacon calibration notes');
    await expect(SessionRecorder.create(join(taken, 'notes.txt'), { display: null }, { clock, timer: manualTimer().timer })).rejects.toThrow(/is a file, or inside one, not a folder/);

    const { dir, gaze } = await recorded(2);
    await expect(SessionRecorder.create(dir, { display: null }, { clock, timer: manualTimer().timer })).rejects.toThrow(/is not empty/);
    const before = readFileSync(streamPath(dir, 'gaze'));
    const flush = manualTimer();
    const again = await SessionRecorder.reopen(dir, { clock, timer: flush.timer });
    expect(again.segment).toBe(1);
    expect(again.stats.gaze).toBe(200);
    expect(again.recovery).toMatchObject({ cleanClose: true, recovered: { gaze: 200, frames: 4 }, tornTailBytes: 0, corruptChunks: 0 });
    // The folder is in use now: neither a second reopen nor a recovery may touch it.
    await expect(SessionRecorder.reopen(dir, { clock, timer: manualTimer().timer })).rejects.toThrow(/this process is recording into it/);
    await expect(recoverSession(dir)).rejects.toThrow(/cannot recover the session: this process is recording into it/);
    expect(await findUnclosedSessions(root)).not.toContain(dir);
    const more = gazeAt(200, 77);
    again.appendGaze(more);
    await again.close();
    const after = readFileSync(streamPath(dir, 'gaze'));
    expect(after.subarray(0, before.length)).toEqual(before);
    expect(await collect((await readSession(dir)).gaze())).toEqual([...gaze, more]);
    const opens = (await collect((await readSession(dir)).messages())).filter((m) => m.kind === 'recording_open');
    expect(opens.map((m) => [m.data.segment, m.data.firstChunks])).toEqual([
      [0, { gaze: 0, frames: 0, messages: 0 }],
      [1, { gaze: 2, frames: 2, messages: 3 }],
    ]);
  });

  it('finds the sessions that did not close, and only those', async () => {
    const place = join(root, 'lab');
    const closed = (await recorded(1, join(place, 'closed'))).dir;
    const crashed = join(place, 'crashed');
    // A copy of a closed session without its clean-close marker is what a crash leaves.
    cpSync(closed, crashed, { recursive: true, filter: (p) => !p.endsWith('closed.json') });
    mkdirSync(join(place, 'not-a-session'));
    const grown = (await recorded(1, join(place, 'grown'))).dir;
    writeFileSync(streamPath(grown, 'messages'), Buffer.concat([readFileSync(streamPath(grown, 'messages')), Buffer.from('x')]));
    expect(await findUnclosedSessions(place)).toEqual([crashed, grown]);
    expect(await findUnclosedSessions(join(root, 'missing'))).toEqual([]);
    await recoverSession(crashed);
    expect(await inspect(crashed)).toMatchObject({ samples: 100, clean_close: false });
  });

  it('syncs on the cadence asked for: every flush, every third, or only on demand', async () => {
    for (const [syncEveryFlushes, expected] of [[1, 6], [3, 2], [0, 0]] as const) {
      const clock = new ManualClock();
      const flush = manualTimer();
      const rec = await SessionRecorder.create(freshDir(), { display: null }, { clock, timer: flush.timer, syncEveryFlushes });
      expect(flush.intervalMs).toBe(50);
      expect(rec.stats).toMatchObject({ flushes: 1, syncs: 1, lastSyncNs: 0 }); // the opening is durable at once
      for (let t = 0; t < 6; t++) {
        rec.appendGaze(gazeAt(t, t));
        clock.advanceMs(50);
        flush.fire();
        await vi.waitFor(() => expect(rec.stats.flushes).toBe(t + 2));
      }
      await vi.waitFor(() => expect(rec.stats.syncs).toBe(1 + expected));
      expect(rec.stats.durableBytes < rec.stats.bytes).toBe(syncEveryFlushes !== 1 && syncEveryFlushes !== 3);
      await rec.flush();
      expect(rec.stats).toMatchObject({ gaze: 6, syncs: expected + 2, lastSyncNs: 300e6 });
      expect(rec.stats.durableBytes).toBe(rec.stats.bytes);
      await rec.close();
    }
  });

  it('refuses bad options and bad records, and stays usable after a refused record', async () => {
    const clock = new ManualClock();
    await expect(SessionRecorder.create(freshDir(), { display: null }, { clock, flushIntervalMs: 250 })).rejects.toThrow(/flushIntervalMs must be from 1 to 100, got 250/);
    await expect(SessionRecorder.create(freshDir(), { display: null }, { clock, maxRecordsPerChunk: 0 })).rejects.toThrow(RangeError);
    await expect(SessionRecorder.create(freshDir(), { display: { widthMm: 0, heightMm: 1, widthPx: 1, heightPx: 1, distanceMm: 1 } }, { clock })).rejects.toThrow(/display.widthMm must be a positive number/);
    const dir = freshDir();
    const rec = await SessionRecorder.create(dir, { display: null }, { clock, timer: manualTimer().timer, maxRecordsPerChunk: 10 });
    expect(() => rec.appendGaze({ ...gazeAt(0, 0), arrivalNs: Number.NaN })).toThrow(/arrivalNs must be a finite number/);
    expect(() => rec.appendFrames([frameAt(0), { ...frameAt(1), late: 1 as unknown as boolean }])).toThrow(/late must be true or false/);
    for (let i = 0; i < 25; i++) rec.appendGaze(gazeAt(i, i)); // seals chunks of 10 without waiting for a tick
    await rec.close();
    expect(() => rec.appendGaze(gazeAt(25, 25))).toThrow(/the recorder is closed/);
    const check = await examineSession(dir, { repair: false });
    expect(check.streams.gaze.chunks.map((c) => c.count)).toEqual([10, 10, 5]);
    expect(check.streams.frames.records).toBe(0); // the refused batch left nothing behind
  });
});
