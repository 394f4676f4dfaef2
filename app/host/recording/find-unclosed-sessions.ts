import { access, readdir } from 'node:fs/promises';
import { join } from 'node:path';
import { validClosedMarker } from './closed-marker';
import { liveRecorder } from './recorder-lock';
import { SESSION_FILE } from './session-files';

/**
 * The session folders directly inside `recordingsRoot` that did not close cleanly (no
 * clean-close marker, or files that no longer match it) and that no live process is
 * recording into: the ones to recover at start-up. Sorted by path; none when the root is missing.
 */
export async function findUnclosedSessions(recordingsRoot: string): Promise<string[]> {
  let entries;
  try {
    entries = await readdir(recordingsRoot, { withFileTypes: true });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const unclosed: string[] = [];
  for (const entry of entries) {
    if (!entry.isDirectory()) continue;
    const dir = join(recordingsRoot, entry.name);
    const isSession = await access(join(dir, SESSION_FILE)).then(
      () => true,
      () => false,
    );
    if (isSession && (await validClosedMarker(dir)) === null && (await liveRecorder(dir)) === null) unclosed.push(dir);
  }
  return unclosed.sort();
}
