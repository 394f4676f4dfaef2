import { open, rename, rm } from 'node:fs/promises';
import { dirname } from 'node:path';
import { syncDirectory, temporarySibling } from '../fs/durable';

const BATCH_CHARS = 1 << 20;

/**
 * Streams text into `target` without ever leaving it half-written: the pieces go to a
 * temporary sibling in batches of about a megabyte, which is fsynced and renamed over the
 * target, then the folder is fsynced. On any error the temporary file is removed.
 */
export async function writeTextDurably(target: string, pieces: AsyncIterable<string> | Iterable<string>): Promise<void> {
  const temporary = temporarySibling(target);
  const handle = await open(temporary, 'wx');
  let closed = false;
  try {
    let batch: string[] = [];
    let size = 0;
    for await (const piece of pieces) {
      batch.push(piece);
      size += piece.length;
      if (size >= BATCH_CHARS) {
        await handle.writeFile(batch.join(''));
        batch = [];
        size = 0;
      }
    }
    await handle.writeFile(batch.join(''));
    await handle.sync();
    await handle.close();
    closed = true;
    await rename(temporary, target);
    await syncDirectory(dirname(target));
  } catch (error) {
    if (!closed) await handle.close();
    await rm(temporary, { force: true });
    throw error;
  }
}
