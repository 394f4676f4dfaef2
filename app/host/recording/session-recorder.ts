import { join } from 'node:path';
import { CHUNK_HEADER_BYTES, parseChunkHeader, perStream, RECORD_STREAMS, type RecordStream } from '../../core/recording/chunk-format';
import type { ChunkBuilder } from '../../core/recording/chunk-builder';
import { checkFrameRecord } from '../../core/recording/frame-codec';
import { FrameChunkBuilder } from '../../core/recording/frame-chunk-builder';
import { GazeChunkBuilder } from '../../core/recording/gaze-chunk-builder';
import { MessageChunkBuilder } from '../../core/recording/message-chunk-builder';
import { MESSAGE_KINDS, type RecordingOpenData } from '../../core/recording/message-kinds';
import type { FrameRecord, GazeRecord, MessageRecord } from '../../core/recording/records';
import { syncDirectory, writeFileDurably } from '../fs/durable';
import { removeClosedMarker, writeClosedMarker } from './closed-marker';
import { CoalescingRunner } from './coalescing-runner';
import { recorderSettings, type RecorderOptions, type RecorderSettings } from './recorder-options';
import { readSession } from './read-session';
import { releaseLock, takeLock } from './recorder-lock';
import { examineSessionLocked, type RecoveryReport } from './recover-session';
import { SESSION_FILE, streamPath } from './session-files';
import { prepareEmptyFolder } from './session-folder';
import { writeSessionIndex, type IndexedChunk } from './session-index';
import { readSessionInfo, sessionInfo, type SessionInfo, type SessionMeta } from './session-info';
import { StreamWriter } from './stream-writer';

export interface RecorderStats {
  /** Records in the session (recovered at reopen plus appended), per stream. */
  readonly gaze: number;
  readonly frames: number;
  readonly messages: number;
  /** Bytes handed to the OS (they survive the process dying), and of those, fsynced (they survive a power cut). */
  readonly bytes: number;
  readonly durableBytes: number;
  readonly flushes: number;
  readonly syncs: number;
  /** Host time when the last write, and the last fsync, finished (null before the first). */
  readonly lastFlushNs: number | null;
  readonly lastSyncNs: number | null;
}

interface StreamState<R> {
  readonly writer: StreamWriter;
  readonly builder: ChunkBuilder<R>;
  nextSeq: number;
  records: number;
  readonly chunks: IndexedChunk[];
}

interface Streams {
  gaze: StreamState<GazeRecord>;
  frames: StreamState<FrameRecord>;
  messages: StreamState<MessageRecord>;
}

interface Resume {
  readonly nextSeq: Readonly<Record<RecordStream, number>>;
  readonly records: Readonly<Record<RecordStream, number>>;
  readonly chunks: Readonly<Record<RecordStream, readonly IndexedChunk[]>>;
}

async function openWriters(dir: string, mode: 'create' | 'append'): Promise<Record<RecordStream, StreamWriter>> {
  const writers: Partial<Record<RecordStream, StreamWriter>> = {};
  try {
    for (const stream of RECORD_STREAMS) writers[stream] = await StreamWriter.open(streamPath(dir, stream), stream, mode);
    await syncDirectory(dir);
  } catch (error) {
    await Promise.all(Object.values(writers).map((w) => w.close()));
    throw error;
  }
  return writers as Record<RecordStream, StreamWriter>;
}

/** The segment the next opening starts: one after the last recording_open on record. */
async function nextSegment(dir: string): Promise<number> {
  let last = 0;
  for await (const m of (await readSession(dir)).messages()) {
    if (m.kind === MESSAGE_KINDS.recordingOpen && typeof m.data.segment === 'number') last = Math.max(last, m.data.segment);
  }
  return last + 1;
}

/**
 * The durable session recorder. Appends are synchronous and only encode into the current
 * chunk of their stream; every flush interval the pending chunks are sealed (each with its
 * checksums), appended to their files in one write per stream and fsynced, so a crash loses
 * at most the records of the last interval (plus a write in flight) and a power cut at most
 * what was not yet synced. Writes and fsyncs run separately: a slow fsync never holds back
 * the next write. Nothing is ever overwritten; reopen recovers and then appends.
 */
export class SessionRecorder {
  private readonly streams: Streams;
  private readonly writes: CoalescingRunner;
  private readonly syncs: CoalescingRunner;
  private readonly flushTimer: { cancel(): void };
  private flushCount = 0;
  private syncCount = 0;
  private ticks = 0;
  private lastFlushNs: number | null = null;
  private lastSyncNs: number | null = null;
  private closing: Promise<void> | null = null;

  private constructor(
    readonly dir: string,
    readonly info: SessionInfo,
    /** 0 for the opening that created the session, then one more per reopening. */
    readonly segment: number,
    /** What reopen's recovery found; null for a new session. */
    readonly recovery: RecoveryReport | null,
    writers: Record<RecordStream, StreamWriter>,
    resume: Resume,
    private readonly settings: RecorderSettings,
  ) {
    const state = <R>(stream: RecordStream, builder: ChunkBuilder<R>): StreamState<R> => ({
      writer: writers[stream],
      builder,
      nextSeq: resume.nextSeq[stream],
      records: resume.records[stream],
      chunks: [...resume.chunks[stream]],
    });
    this.streams = { gaze: state('gaze', new GazeChunkBuilder()), frames: state('frames', new FrameChunkBuilder()), messages: state('messages', new MessageChunkBuilder()) };
    this.writes = new CoalescingRunner(() => this.writeAll());
    this.syncs = new CoalescingRunner(() => this.syncAll());
    const open: RecordingOpenData = {
      segment,
      wallTime: settings.wallClock().toISOString(),
      clockOriginNs: settings.clockOriginNs === null ? null : String(settings.clockOriginNs),
      firstChunks: resume.nextSeq,
    };
    this.appendMessage({ hostNs: settings.clock.nowNs(), kind: MESSAGE_KINDS.recordingOpen, data: { ...open } });
    this.flushTimer = settings.timer(settings.flushIntervalMs, () => this.tick());
  }

  /** Starts a session in `dir`, which must be missing or empty. session.json is durable before this resolves. */
  static async create(dir: string, meta: SessionMeta, options: RecorderOptions): Promise<SessionRecorder> {
    const settings = recorderSettings(options);
    const info = sessionInfo(meta, settings.wallClock(), settings.clock.nowNs());
    await prepareEmptyFolder(dir);
    await writeFileDurably(join(dir, SESSION_FILE), `${JSON.stringify(info, null, 2)}\n`);
    await takeLock(dir, settings.wallClock());
    try {
      const writers = await openWriters(dir, 'create');
      const zero = { gaze: 0, frames: 0, messages: 0 };
      return await SessionRecorder.opened(new SessionRecorder(dir, info, 0, null, writers, { nextSeq: zero, records: zero, chunks: { gaze: [], frames: [], messages: [] } }, settings));
    } catch (error) {
      await releaseLock(dir);
      throw error;
    }
  }

  /** Recovers the session in `dir` (cutting a torn tail), then appends to it as a new segment. */
  static async reopen(dir: string, options: RecorderOptions): Promise<SessionRecorder> {
    const settings = recorderSettings(options);
    const info = await readSessionInfo(dir);
    await takeLock(dir, settings.wallClock());
    try {
      const recovery = await examineSessionLocked(dir, { repair: true, now: settings.wallClock });
      await removeClosedMarker(dir);
      const segment = await nextSegment(dir);
      const writers = await openWriters(dir, 'append');
      const nextSeq = perStream((s) => recovery.streams[s].chunks.reduce((n, c) => Math.max(n, c.seq + 1), 0));
      const resume = { nextSeq, records: perStream((s) => recovery.streams[s].records), chunks: perStream((s) => recovery.streams[s].chunks) };
      return await SessionRecorder.opened(new SessionRecorder(dir, info, segment, recovery, writers, resume, settings));
    } catch (error) {
      await releaseLock(dir);
      throw error;
    }
  }

  /**
   * Makes the opening's recording_open message durable before any record of the segment
   * can be, so a crash can never leave chunks of a segment without the clock it was timed on.
   */
  private static async opened(recorder: SessionRecorder): Promise<SessionRecorder> {
    try {
      await recorder.flush();
    } catch (error) {
      recorder.flushTimer.cancel();
      await Promise.all(RECORD_STREAMS.map((k) => recorder.streams[k].writer.close()));
      throw error;
    }
    return recorder;
  }

  appendGaze(record: GazeRecord): void {
    this.append(this.streams.gaze, record);
  }

  /** All or none: every record is checked before any is appended. */
  appendFrames(records: readonly FrameRecord[]): void {
    this.refuseIfClosing();
    records.forEach(checkFrameRecord);
    for (const record of records) this.append(this.streams.frames, record);
  }

  appendMessage(record: MessageRecord): void {
    this.append(this.streams.messages, record);
  }

  /** Writes and fsyncs everything appended so far; resolves when it is durable. */
  async flush(): Promise<void> {
    this.sealAll();
    await this.writes.run();
    await this.syncs.run();
  }

  /** Flushes, writes the index and the clean-close marker, and releases the folder. Appends are refused from the call on. */
  close(): Promise<void> {
    this.closing ??= this.finish().catch((error: unknown) => {
      this.closing = null; // let the caller retry once the disk is back
      throw error;
    });
    return this.closing;
  }

  get stats(): RecorderStats {
    const s = this.streams;
    const writers = RECORD_STREAMS.map((k) => s[k].writer);
    return {
      gaze: s.gaze.records,
      frames: s.frames.records,
      messages: s.messages.records,
      bytes: writers.reduce((n, w) => n + w.bytes, 0),
      durableBytes: writers.reduce((n, w) => n + w.durableBytes, 0),
      flushes: this.flushCount,
      syncs: this.syncCount,
      lastFlushNs: this.lastFlushNs,
      lastSyncNs: this.lastSyncNs,
    };
  }

  private refuseIfClosing(): void {
    if (this.closing) throw new Error(`${this.dir}: the recorder is closed`);
  }

  private append<R>(state: StreamState<R>, record: R): void {
    this.refuseIfClosing();
    state.builder.append(record);
    state.records++;
    if (state.builder.count >= this.settings.maxRecordsPerChunk) {
      this.seal(state);
      this.writes.run().catch(this.settings.onError);
    }
  }

  private seal<R>(state: StreamState<R>): void {
    if (state.builder.count === 0) return;
    const chunk = state.builder.take(state.nextSeq);
    const header = parseChunkHeader(chunk.subarray(0, CHUNK_HEADER_BYTES));
    if (typeof header === 'string') throw new Error(`sealed chunk has no valid header: ${header}`);
    const offset = state.writer.enqueue(chunk);
    state.chunks.push({ offset, seq: header.seq, count: header.count, minHostNs: header.minHostNs, maxHostNs: header.maxHostNs });
    state.nextSeq++;
  }

  private sealAll(): void {
    this.seal(this.streams.gaze);
    this.seal(this.streams.frames);
    this.seal(this.streams.messages);
  }

  private tick(): void {
    if (this.closing) return;
    this.sealAll();
    if (!RECORD_STREAMS.some((k) => this.streams[k].writer.pending)) return;
    this.ticks++;
    const syncDue = this.settings.syncEveryFlushes > 0 && this.ticks % this.settings.syncEveryFlushes === 0;
    this.writes
      .run()
      .then(() => (syncDue ? this.syncs.run() : undefined))
      .catch(this.settings.onError);
  }

  private async writeAll(): Promise<void> {
    const writers = RECORD_STREAMS.map((k) => this.streams[k].writer);
    await Promise.all(writers.map((w) => w.write()));
    this.flushCount++;
    this.lastFlushNs = this.settings.clock.nowNs();
  }

  private async syncAll(): Promise<void> {
    await Promise.all(RECORD_STREAMS.map((k) => this.streams[k].writer.sync()));
    this.syncCount++;
    this.lastSyncNs = this.settings.clock.nowNs();
  }

  private async finish(): Promise<void> {
    this.flushTimer.cancel();
    this.sealAll();
    await this.writes.run();
    await this.syncs.run();
    await writeSessionIndex(this.dir, perStream((k) => ({ bytes: this.streams[k].writer.bytes, chunks: this.streams[k].chunks })));
    const streams = perStream((k) => ({ bytes: this.streams[k].writer.bytes, records: this.streams[k].records }));
    await writeClosedMarker(this.dir, { closedAt: this.settings.wallClock().toISOString(), streams });
    await Promise.all(RECORD_STREAMS.map((k) => this.streams[k].writer.close()));
    await releaseLock(this.dir);
  }
}
