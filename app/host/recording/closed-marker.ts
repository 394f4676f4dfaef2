import { readFile, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { RECORD_STREAMS, type RecordStream } from '../../core/recording/chunk-format';
import { syncDirectory, writeFileDurably } from '../fs/durable';
import { CLOSED_FILE, streamPath } from './session-files';

/**
 * closed.json, the clean-close marker: written durably by close after the last chunk is
 * synced, with each stream file's size then. A session is cleanly closed when the marker
 * exists and every file still has that size; reopening removes the marker (durably) before
 * it appends anything.
 *   {"closedAt":"2025-…Z","streams":{"gaze":{"bytes":N,"records":N},…}}
 */
export interface ClosedMarker {
  readonly closedAt: string;
  readonly streams: Readonly<Record<RecordStream, { readonly bytes: number; readonly records: number }>>;
}

export async function writeClosedMarker(dir: string, marker: ClosedMarker): Promise<void> {
  await writeFileDurably(join(dir, CLOSED_FILE), `${JSON.stringify(marker)}\n`);
}

export async function removeClosedMarker(dir: string): Promise<void> {
  await rm(join(dir, CLOSED_FILE), { force: true });
  await syncDirectory(dir);
}

async function fileSize(path: string): Promise<number> {
  try {
    return (await stat(path)).size;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return 0;
    throw error;
  }
}

/** The marker when it is present and matches the files, else null. */
export async function validClosedMarker(dir: string): Promise<ClosedMarker | null> {
  let marker: ClosedMarker;
  try {
    marker = JSON.parse(await readFile(join(dir, CLOSED_FILE), 'utf8')) as ClosedMarker;
  } catch {
    return null;
  }
  for (const stream of RECORD_STREAMS) {
    if (marker.streams?.[stream]?.bytes !== (await fileSize(streamPath(dir, stream)))) return null;
  }
  return marker;
}
