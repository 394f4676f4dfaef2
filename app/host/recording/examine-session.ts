import { open } from 'node:fs/promises';
import type { RecordStream } from '../../core/recording/chunk-format';
import { scanChunks } from '../../core/recording/scan-chunks';
import { openFileByteSource } from './file-byte-source';
import { logTailCut } from './recovery-log';
import { streamPath } from './session-files';
import type { IndexedChunk } from './session-index';

export interface DamagedStretch {
  readonly offset: number;
  readonly bytes: number;
  /** How many chunks it held, from the sequence numbers on either side. */
  readonly chunks: number;
  readonly reason: string;
}

export interface StreamExamination {
  readonly stream: RecordStream;
  /** Intact chunks and the records they hold. */
  readonly chunks: readonly IndexedChunk[];
  readonly records: number;
  /** File size after the examination (after the cut, if one was made). */
  readonly bytes: number;
  /** Sequence number of the last intact chunk, or null when there is none. */
  readonly lastSeq: number | null;
  /** Damaged stretches with intact chunks after them: kept, counted, never cut. */
  readonly corrupt: readonly DamagedStretch[];
  readonly corruptChunks: number;
  /** The torn tail found: cut when the examination was asked to, else only reported. */
  readonly tornTail: { readonly offset: number; readonly bytes: number; readonly reason: string } | null;
  readonly cut: boolean;
}

/** Cuts the file at `offset` and makes the new size durable. */
async function cutAt(path: string, offset: number): Promise<void> {
  const handle = await open(path, 'r+');
  try {
    await handle.truncate(offset);
    await handle.sync();
  } finally {
    await handle.close();
  }
}

/**
 * Walks one stream file chunk by chunk. With `cut`, a torn tail is cut off (only it: the
 * file keeps every byte before it) and the cut is logged in recovery.ndjson.
 */
async function examineStream(dir: string, stream: RecordStream, cut: boolean, now: () => Date): Promise<StreamExamination> {
  const path = streamPath(dir, stream);
  const source = await openFileByteSource(path);
  const chunks: IndexedChunk[] = [];
  const corrupt: DamagedStretch[] = [];
  let tornTail: StreamExamination['tornTail'] = null;
  let records = 0;
  try {
    for await (const item of scanChunks(source, path, stream)) {
      if (item.kind === 'chunk') {
        const { seq, count, minHostNs, maxHostNs } = item.header;
        chunks.push({ offset: item.offset, seq, count, minHostNs, maxHostNs });
        records += count;
      } else if (item.kind === 'corrupt') {
        corrupt.push({ offset: item.offset, bytes: item.bytes, chunks: item.chunks, reason: item.reason });
      } else {
        tornTail = { offset: item.offset, bytes: item.bytes, reason: item.reason };
      }
    }
  } finally {
    await source.close();
  }
  let bytes = source.size;
  if (cut && tornTail) {
    await cutAt(path, tornTail.offset);
    await logTailCut(dir, { time: now().toISOString(), stream, ...tornTail });
    bytes = tornTail.offset;
  }
  return {
    stream,
    chunks,
    records,
    bytes,
    lastSeq: chunks.length > 0 ? chunks[chunks.length - 1]!.seq : null,
    corrupt,
    corruptChunks: corrupt.reduce((n, c) => n + c.chunks, 0),
    tornTail,
    cut: cut && tornTail !== null,
  };
}

export async function examineStreams(dir: string, cut: boolean, now: () => Date): Promise<Record<RecordStream, StreamExamination>> {
  return { gaze: await examineStream(dir, 'gaze', cut, now), frames: await examineStream(dir, 'frames', cut, now), messages: await examineStream(dir, 'messages', cut, now) };
}
