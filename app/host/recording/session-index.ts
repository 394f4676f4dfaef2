import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { RECORD_STREAMS, type RecordStream } from '../../core/recording/chunk-format';
import { writeFileDurably } from '../fs/durable';
import { INDEX_FILE } from './session-files';

/**
 * index.json: where each intact chunk starts and the host-time range of its records, per
 * stream, so a reader can start near a time instead of at the beginning. It is derived
 * data: written at close and by recovery, checked against the chunk header it points to
 * before use, and ignored whenever it is missing, unreadable or stale.
 *   {"format":"gazeloom-session-index","version":1,
 *    "streams":{"gaze":{"bytes":N,"chunks":[[offset,seq,count,minHostNs,maxHostNs],...]},...}}
 */
export interface IndexedChunk {
  readonly offset: number;
  readonly seq: number;
  readonly count: number;
  readonly minHostNs: number;
  readonly maxHostNs: number;
}

export interface StreamIndex {
  /** The file size the index describes. */
  readonly bytes: number;
  readonly chunks: readonly IndexedChunk[];
}

export type SessionIndex = Readonly<Record<RecordStream, StreamIndex>>;

export async function writeSessionIndex(dir: string, index: SessionIndex): Promise<void> {
  const streams = Object.fromEntries(
    RECORD_STREAMS.map((s) => [s, { bytes: index[s].bytes, chunks: index[s].chunks.map((c) => [c.offset, c.seq, c.count, c.minHostNs, c.maxHostNs]) }]),
  );
  await writeFileDurably(join(dir, INDEX_FILE), `${JSON.stringify({ format: 'gazeloom-session-index', version: 1, streams })}\n`);
}

const isRow = (row: unknown): row is number[] => Array.isArray(row) && row.length === 5 && row.every((v) => typeof v === 'number' && Number.isFinite(v));

/** The index, or null when there is none usable. */
export async function readSessionIndex(dir: string): Promise<SessionIndex | null> {
  try {
    const o = JSON.parse(await readFile(join(dir, INDEX_FILE), 'utf8'));
    if (o.format !== 'gazeloom-session-index' || o.version !== 1) return null;
    const entries = RECORD_STREAMS.map((s) => {
      const { bytes, chunks } = o.streams[s];
      if (typeof bytes !== 'number' || !Array.isArray(chunks) || !chunks.every(isRow)) throw new Error('bad index');
      return [s, { bytes, chunks: chunks.map(([offset, seq, count, minHostNs, maxHostNs]: number[]) => ({ offset, seq, count, minHostNs, maxHostNs })) }];
    });
    return Object.fromEntries(entries) as SessionIndex;
  } catch {
    return null;
  }
}
