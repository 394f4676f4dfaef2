import { appendFile, open, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { RecordStream } from '../../core/recording/chunk-format';
import { RECOVERY_LOG_FILE } from './session-files';

/**
 * recovery.ndjson: one line per torn tail that recovery cut, appended and fsynced, so the
 * loss stays on record after the session is resumed and closed again:
 *   {"time":"2025-…Z","stream":"gaze","offset":81920,"bytes":1234,"reason":"chunk 93 is incomplete: …"}
 */
export interface TailCut {
  readonly time: string;
  readonly stream: RecordStream;
  readonly offset: number;
  readonly bytes: number;
  readonly reason: string;
}

export async function logTailCut(dir: string, cut: TailCut): Promise<void> {
  const path = join(dir, RECOVERY_LOG_FILE);
  await appendFile(path, `${JSON.stringify(cut)}\n`);
  const handle = await open(path, 'r+');
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
}

/** Every cut on record; a line torn by a crash while it was written is skipped. */
export async function readTailCuts(dir: string): Promise<TailCut[]> {
  let text: string;
  try {
    text = await readFile(join(dir, RECOVERY_LOG_FILE), 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  return text.split('\n').flatMap((line) => {
    try {
      const cut = JSON.parse(line) as TailCut;
      return typeof cut.bytes === 'number' ? [cut] : [];
    } catch {
      return [];
    }
  });
}
