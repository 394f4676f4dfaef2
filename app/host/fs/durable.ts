import { randomBytes } from 'node:crypto';
import { open, rename, rm } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';

/** fsync a directory so a rename inside it survives a power cut (a no-op where unsupported). */
export async function syncDirectory(dir: string): Promise<void> {
  let handle;
  try {
    handle = await open(dir, 'r');
    await handle.sync();
  } catch (error) {
    // Windows cannot open directories for syncing; renames there are already durable enough.
    if ((error as NodeJS.ErrnoException).code !== 'EISDIR' && (error as NodeJS.ErrnoException).code !== 'EPERM') throw error;
  } finally {
    await handle?.close();
  }
}

/** A sibling temporary name in the same folder, so the final rename never crosses devices. */
export const temporarySibling = (target: string): string =>
  join(dirname(target), `.${basename(target)}.${randomBytes(4).toString('hex')}.partial`);

/**
 * Writes the whole file or nothing: data goes to a temporary sibling, is fsynced, renamed
 * over the target, and the folder is fsynced. A crash at any moment leaves either the old
 * file or the new one, never a half-written target.
 */
export async function writeFileDurably(target: string, data: string | Uint8Array): Promise<void> {
  const temporary = temporarySibling(target);
  try {
    const handle = await open(temporary, 'wx');
    try {
      await handle.writeFile(data);
      await handle.sync();
    } finally {
      await handle.close();
    }
    await rename(temporary, target);
    await syncDirectory(dirname(target));
  } catch (error) {
    await rm(temporary, { force: true });
    throw error;
  }
}

/** Moves a finished folder into place and makes the move durable. */
export async function publishDirectory(staging: string, target: string): Promise<void> {
  await syncDirectory(staging);
  await rename(staging, target);
  await syncDirectory(dirname(target));
}
