import { perStream, RECORD_STREAMS, type RecordStream } from '../../core/recording/chunk-format';
import { validClosedMarker } from './closed-marker';
import { examineStreams, type StreamExamination } from './examine-session';
import { refuseIfLive } from './recorder-lock';
import { readTailCuts } from './recovery-log';
import { readSessionInfo } from './session-info';
import { readSessionIndex, writeSessionIndex, type SessionIndex } from './session-index';

export interface RecoveryReport {
  readonly dir: string;
  /** The session had been closed cleanly before this examination. */
  readonly cleanClose: boolean;
  readonly streams: Readonly<Record<RecordStream, StreamExamination>>;
  /** Records readable, per stream. */
  readonly recovered: Readonly<Record<RecordStream, number>>;
  /** Chunks failing their checksum with intact chunks after them (kept, never cut). */
  readonly corruptChunks: number;
  /** Bytes of torn tails found now: cut by recovery, only reported by a read-only check. */
  readonly tornTailBytes: number;
  /** Bytes cut by earlier recoveries, from recovery.ndjson. */
  readonly earlierTornTailBytes: number;
  readonly indexRebuilt: boolean;
}

export interface ExamineOptions {
  /** Cut torn tails and rebuild the index (recovery), or only report (a read-only check). */
  readonly repair: boolean;
  readonly now?: () => Date;
}

const indexMatches = (index: SessionIndex | null, streams: Record<RecordStream, StreamExamination>): boolean =>
  index !== null && RECORD_STREAMS.every((s) => index[s].bytes === streams[s].bytes && index[s].chunks.length === streams[s].chunks.length);

/** For SessionRecorder.reopen, which holds the folder's lock already. */
export async function examineSessionLocked(dir: string, options: ExamineOptions): Promise<RecoveryReport> {
  await readSessionInfo(dir);
  const now = options.now ?? (() => new Date());
  const cleanClose = (await validClosedMarker(dir)) !== null;
  const earlierTornTailBytes = (await readTailCuts(dir)).reduce((n, c) => n + c.bytes, 0);
  const streams = await examineStreams(dir, options.repair, now);
  let indexRebuilt = false;
  if (options.repair && !indexMatches(await readSessionIndex(dir), streams)) {
    await writeSessionIndex(dir, perStream((s) => ({ bytes: streams[s].bytes, chunks: streams[s].chunks })));
    indexRebuilt = true;
  }
  const sum = (f: (e: StreamExamination) => number) => RECORD_STREAMS.reduce((n, s) => n + f(streams[s]), 0);
  return {
    dir,
    cleanClose,
    streams,
    recovered: perStream((s) => streams[s].records),
    corruptChunks: sum((e) => e.corruptChunks),
    tornTailBytes: sum((e) => e.tornTail?.bytes ?? 0),
    earlierTornTailBytes,
    indexRebuilt,
  };
}

/**
 * Examines a session folder stream by stream. With repair (recovery), a torn last chunk
 * (incomplete, or failing its checksum with nothing intact after it) is cut, the cut is
 * logged, and the index is rebuilt when it does not match; complete chunks are never
 * touched, and damaged chunks in the middle are counted and kept. Running it again finds
 * nothing more to cut. Repair refuses a folder another process is still recording into
 * (its last chunk may be mid-write); a read-only check reads the part written so far.
 */
export async function examineSession(dir: string, options: ExamineOptions): Promise<RecoveryReport> {
  if (options.repair) await refuseIfLive(dir, 'recover the session');
  return examineSessionLocked(dir, options);
}

export const recoverSession = (dir: string, options: { now?: () => Date } = {}): Promise<RecoveryReport> => examineSession(dir, { ...options, repair: true });
