import { readFile, rm, writeFile } from 'node:fs/promises';
import { hostname } from 'node:os';
import { join, resolve } from 'node:path';
import { SessionFolderError } from './session-folder-error';
import { LOCK_FILE } from './session-files';

/**
 * recorder.lock names the process recording into a session folder, so that recovery never
 * cuts the tail of a session that is still being written. A lock left by a process that
 * has died (a crash, kill -9) is stale and ignored. It is advisory and not fsynced: after
 * a power cut its process is gone anyway.
 */
interface LockContent {
  readonly pid: number;
  readonly host: string;
  readonly openedAt: string;
}

/** Folders this process is recording into right now (a pid check cannot tell for our own pid). */
const heldHere = new Set<string>();

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** The live process recording into `dir`, or null when none is (no lock, or a stale one). */
export async function liveRecorder(dir: string): Promise<LockContent | null> {
  if (heldHere.has(resolve(dir))) return { pid: process.pid, host: hostname(), openedAt: '' };
  let lock: LockContent;
  try {
    lock = JSON.parse(await readFile(join(dir, LOCK_FILE), 'utf8')) as LockContent;
  } catch {
    return null; // missing, or torn by a crash while it was written: no live owner either way
  }
  if (lock.host !== hostname()) return lock; // cannot check another machine's processes
  return lock.pid !== process.pid && processAlive(lock.pid) ? lock : null;
}

export async function refuseIfLive(dir: string, doing: string): Promise<void> {
  const live = await liveRecorder(dir);
  if (live) {
    const who = live.pid === process.pid && live.host === hostname() ? 'this process' : `process ${live.pid} on ${live.host}`;
    throw new SessionFolderError(dir, `cannot ${doing}: ${who} is recording into it (if that process is gone, delete ${LOCK_FILE})`);
  }
}

export async function takeLock(dir: string, openedAt: Date): Promise<void> {
  await refuseIfLive(dir, 'open the session');
  const content: LockContent = { pid: process.pid, host: hostname(), openedAt: openedAt.toISOString() };
  await writeFile(join(dir, LOCK_FILE), `${JSON.stringify(content)}\n`);
  heldHere.add(resolve(dir));
}

export async function releaseLock(dir: string): Promise<void> {
  heldHere.delete(resolve(dir));
  await rm(join(dir, LOCK_FILE), { force: true });
}
