import type { ByteSource } from '../../core/events/glev';
import { CHUNK_HEADER_BYTES, parseChunkHeader, type RecordStream } from '../../core/recording/chunk-format';
import { decodeFramePayload } from '../../core/recording/frame-codec';
import { decodeGazePayload } from '../../core/recording/gaze-codec';
import { decodeMessagePayload } from '../../core/recording/message-codec';
import type { FrameRecord, GazeRecord, MessageRecord } from '../../core/recording/records';
import { RecordingFormatError } from '../../core/recording/recording-format-error';
import { scanChunks, type ScanStart } from '../../core/recording/scan-chunks';
import { openFileByteSource } from './file-byte-source';
import { streamPath } from './session-files';
import { readSessionIndex, type StreamIndex } from './session-index';
import { readSessionInfo, type SessionInfo } from './session-info';

export interface RecordOf {
  gaze: GazeRecord;
  frames: FrameRecord;
  messages: MessageRecord;
}

/** Host times, inclusive; either end may be left open. */
export interface HostTimeRange {
  readonly fromHostNs?: number;
  readonly toHostNs?: number;
}

export interface DecodedChunk<R> {
  readonly seq: number;
  readonly offset: number;
  readonly records: readonly R[];
}

/**
 * Reads a session folder for export and analysis, without changing it. Each stream reads
 * its intact chunks in file order (the order they were written); damaged chunks and a torn
 * tail are skipped (recoverSession reports them). A session still being recorded reads as
 * what was on disk when the stream was opened.
 */
export interface SessionReader {
  readonly dir: string;
  readonly info: SessionInfo;
  chunks<S extends RecordStream>(stream: S, range?: HostTimeRange): AsyncIterable<DecodedChunk<RecordOf[S]>>;
  gaze(range?: HostTimeRange): AsyncIterable<GazeRecord>;
  frames(range?: HostTimeRange): AsyncIterable<FrameRecord>;
  messages(range?: HostTimeRange): AsyncIterable<MessageRecord>;
}

const decoders: { [S in RecordStream]: (payload: Uint8Array, count: number) => RecordOf[S][] } = {
  gaze: decodeGazePayload,
  frames: decodeFramePayload,
  messages: decodeMessagePayload,
};

/** The index entry to start from for `fromHostNs`, when the index has one that checks out against the file. */
async function startFromIndex(index: StreamIndex | undefined, source: ByteSource, fromHostNs: number): Promise<ScanStart> {
  const start = { offset: 0, previousSeq: null };
  if (!index || index.bytes > source.size) return start;
  const entry = index.chunks.find((c) => c.maxHostNs >= fromHostNs);
  if (!entry || entry.offset + CHUNK_HEADER_BYTES > source.size) return start;
  const header = parseChunkHeader(await source.read(entry.offset, CHUNK_HEADER_BYTES));
  return typeof header !== 'string' && header.seq === entry.seq ? { offset: entry.offset, previousSeq: null } : start;
}

export async function readSession(dir: string): Promise<SessionReader> {
  const info = await readSessionInfo(dir);

  async function* chunks<S extends RecordStream>(stream: S, range: HostTimeRange = {}): AsyncGenerator<DecodedChunk<RecordOf[S]>> {
    const from = range.fromHostNs ?? -Infinity;
    const to = range.toHostNs ?? Infinity;
    const path = streamPath(dir, stream);
    const source = await openFileByteSource(path);
    try {
      const start = from === -Infinity ? { offset: 0, previousSeq: null } : await startFromIndex((await readSessionIndex(dir))?.[stream], source, from);
      for await (const item of scanChunks(source, path, stream, start)) {
        if (item.kind !== 'chunk' || item.header.maxHostNs < from || item.header.minHostNs > to) continue;
        let records: RecordOf[S][];
        try {
          records = decoders[stream](item.payload, item.header.count);
        } catch (error) {
          throw new RecordingFormatError(path, `chunk ${item.header.seq} at byte ${item.offset}`, (error as Error).message);
        }
        const inRange = from === -Infinity && to === Infinity ? records : records.filter((r) => r.hostNs >= from && r.hostNs <= to);
        yield { seq: item.header.seq, offset: item.offset, records: inRange };
      }
    } finally {
      await source.close();
    }
  }

  async function* flat<S extends RecordStream>(stream: S, range?: HostTimeRange): AsyncGenerator<RecordOf[S]> {
    for await (const chunk of chunks(stream, range)) yield* chunk.records;
  }

  return {
    dir,
    info,
    chunks,
    gaze: (range) => flat('gaze', range),
    frames: (range) => flat('frames', range),
    messages: (range) => flat('messages', range),
  };
}
