import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { open } from 'node:fs/promises';
import { join } from 'node:path';
import { setImmediate as yieldToLoop } from 'node:timers/promises';
import type { GazeRecord } from '../../app/core/recording/records';
import { createMonotonicClock } from '../../app/host/monotonic-clock';
import { streamPath } from '../../app/host/recording/session-files';
import { SessionRecorder } from '../../app/host/recording/session-recorder';
import { rate, type Benchmark } from './harness';

// The recorder at its default flush interval (50 ms, fsync after every flush) taking gaze
// records as fast as they can be appended, against its limit: a plain append of the same
// bytes to a file on the same disk, in as many writes and as many fsyncs, spread evenly
// (chunks that fill up between ticks are written at once; the fsyncs follow the ticks).
const RECORDS = 5_000_000;
const BATCH = 4096;

function sample(seq: number, nowNs: number): GazeRecord {
  return { seq, trackerTimeS: 5000 + seq / 2000, arrivalNs: nowNs, hostNs: nowNs - 1e6, left: { x: 960 + (seq % 500), y: 540 - (seq % 300), valid: true, pupil: 3.2 }, right: { x: 962 + (seq % 500), y: 541, valid: seq % 50 !== 0, pupil: null } };
}

async function recordAll(dir: string, records: number): Promise<{ seconds: number; bytes: number; flushes: number; syncs: number }> {
  const clock = createMonotonicClock();
  const started = process.hrtime.bigint();
  const recorder = await SessionRecorder.create(dir, { display: null }, { clock });
  for (let seq = 0; seq < records; ) {
    const end = Math.min(records, seq + BATCH);
    const now = clock.nowNs();
    for (; seq < end; seq++) recorder.appendGaze(sample(seq, now));
    await yieldToLoop(); // let the flush timer and the writes run, as the live host does between datagrams
  }
  await recorder.close();
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  const { bytes, flushes, syncs } = recorder.stats;
  return { seconds, bytes, flushes, syncs };
}

async function plainAppend(path: string, bytes: Uint8Array, writes: number, syncs: number): Promise<number> {
  const started = process.hrtime.bigint();
  const handle = await open(path, 'a');
  const step = Math.ceil(bytes.length / writes);
  const syncEvery = Math.max(1, Math.floor(writes / Math.max(1, syncs)));
  for (let at = 0, n = 1; at < bytes.length; at += step, n++) {
    await handle.write(bytes, at, Math.min(step, bytes.length - at));
    if (n % syncEvery === 0 || at + step >= bytes.length) await handle.sync();
  }
  await handle.close();
  return Number(process.hrtime.bigint() - started) / 1e9;
}

export const benchmark: Benchmark = {
  name: 'durable session recorder throughput against a plain append with the same fsyncs',
  async run(log) {
    // A folder beside the repository, on the disk a data folder would use (not a RAM disk).
    mkdirSync(join(process.cwd(), 'bench'), { recursive: true });
    const base = mkdtempSync(join(process.cwd(), 'bench', '.recorder-'));
    try {
      await recordAll(join(base, 'warm-up'), 200_000);
      const ours = await recordAll(join(base, 'session'), RECORDS);
      const gazeBytes = readFileSync(streamPath(join(base, 'session'), 'gaze'));
      const peerSeconds = await plainAppend(join(base, 'plain.bin'), gazeBytes, ours.flushes, ours.syncs);
      const recordsPerS = RECORDS / ours.seconds;
      const peerRecordsPerS = RECORDS / peerSeconds;
      const mbPerS = ours.bytes / 1e6 / ours.seconds;
      const peerMbPerS = gazeBytes.length / 1e6 / peerSeconds;
      log(`recorder: ${RECORDS} records, ${(ours.bytes / 1e6).toFixed(1)} MB in ${ours.seconds.toFixed(2)} s, ${ours.flushes} writes, ${ours.syncs} fsyncs`);
      log(`plain append: ${(gazeBytes.length / 1e6).toFixed(1)} MB in ${ours.flushes} writes and ${ours.syncs} fsyncs, ${peerSeconds.toFixed(2)} s`);
      return [
        rate('recorder throughput (gaze, 50 ms flush, fsync)', recordsPerS, 'records/s', { name: 'plain append, same bytes, writes and fsyncs', value: peerRecordsPerS }),
        rate('recorder throughput (gaze, 50 ms flush, fsync)', mbPerS, 'MB/s', { name: 'plain append, same bytes, writes and fsyncs', value: peerMbPerS }),
      ];
    } finally {
      rmSync(base, { recursive: true, force: true });
    }
  },
};
