import { mkdir, readdir } from 'node:fs/promises';
import { dirname, resolve } from 'node:path';
import { syncDirectory } from '../fs/durable';
import { SessionFolderError } from './session-folder-error';

/**
 * Makes `dir` ready for a new session: creates it (and missing parents, each made durable
 * in its parent) or accepts it when it exists and is empty. A folder with anything in it
 * is refused: a session is never written over existing files.
 */
export async function prepareEmptyFolder(dir: string): Promise<void> {
  let firstCreated: string | undefined;
  try {
    firstCreated = await mkdir(dir, { recursive: true });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EEXIST' || (error as NodeJS.ErrnoException).code === 'ENOTDIR') throw new SessionFolderError(dir, 'is a file, or inside one, not a folder');
    throw error;
  }
  if (firstCreated === undefined) {
    const entries = await readdir(dir);
    if (entries.length > 0) {
      throw new SessionFolderError(
        dir,
        `is not empty (${entries.length} ${entries.length === 1 ? 'entry' : 'entries'}, e.g. "${entries.sort()[0]}"); a new session is never written over existing files: choose an empty or new folder, or reopen the session there to append to it`,
      );
    }
    return;
  }
  // Every folder mkdir created must be durable in its parent, up to the first one it created.
  const stop = dirname(resolve(firstCreated));
  for (let parent = dirname(resolve(dir)); ; parent = dirname(parent)) {
    await syncDirectory(parent);
    if (parent === stop || parent === dirname(parent)) break;
  }
}
