import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdir, open, rm, stat } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { recordingFilePath } from '../../core/archive/archive-manifest';
import { publishDirectory, syncDirectory, temporarySibling } from '../fs/durable';
import type { VerifiedArchive } from './verify-lab-archive';

/** A session of the archive already in the data folder with different contents: nothing is overwritten. */
export class RestoreConflictError extends Error {
  override name = 'RestoreConflictError';
}

type SessionFiles = VerifiedArchive['manifest']['recordings'][string]['files'];

async function fileSha256(path: string): Promise<string | null> {
  try {
    const hash = createHash('sha256');
    for await (const chunk of createReadStream(path)) hash.update(chunk as Buffer);
    return hash.digest('hex');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

/** 'absent', 'same' (every listed file already there with its SHA-256), or 'different'. */
async function compareExisting(dir: string, files: SessionFiles): Promise<'absent' | 'same' | 'different'> {
  try {
    if (!(await stat(dir)).isDirectory()) return 'different';
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return 'absent';
    throw error;
  }
  for (const [relPath, { sha256 }] of Object.entries(files)) {
    if ((await fileSha256(join(dir, ...relPath.split('/')))) !== sha256) return 'different';
  }
  return 'same';
}

async function copySession(archive: VerifiedArchive, sessionId: string, files: SessionFiles, target: string): Promise<void> {
  const staging = temporarySibling(target);
  await mkdir(staging);
  try {
    for (const [relPath, expected] of Object.entries(files)) {
      const name = recordingFilePath(sessionId, relPath);
      const path = join(staging, ...relPath.split('/'));
      await mkdir(dirname(path), { recursive: true });
      const hash = createHash('sha256');
      const handle = await open(path, 'wx');
      try {
        for await (const chunk of archive.source.read(name)) {
          hash.update(chunk);
          await handle.write(chunk);
        }
        await handle.sync();
      } finally {
        await handle.close();
      }
      if (hash.digest('hex') !== expected.sha256) throw new ArchiveFormatError(name, 'SHA-256 does not match the manifest: the file changed while it was restored');
      if (dirname(path) !== staging) await syncDirectory(dirname(path));
    }
    await publishDirectory(staging, target);
  } catch (error) {
    await rm(staging, { recursive: true, force: true });
    throw error;
  }
}

/**
 * Copies the archive's recordings into `recordingsDir`, one session folder each. A session
 * already there with the same files is left as it is; one there with different files stops
 * the restore before anything is copied. Each session appears whole or not at all.
 */
export async function restoreRecordings(archive: VerifiedArchive, recordingsDir: string): Promise<{ restored: string[]; alreadyPresent: string[] }> {
  const sessions = Object.entries(archive.manifest.recordings);
  const plan: { sessionId: string; files: SessionFiles; state: 'absent' | 'same' }[] = [];
  for (const [sessionId, { files }] of sessions) {
    const state = await compareExisting(join(recordingsDir, sessionId), files);
    if (state === 'different') throw new RestoreConflictError(`${join(recordingsDir, sessionId)} already exists with different contents; it was not overwritten (move it away to restore this session)`);
    plan.push({ sessionId, files, state });
  }
  await mkdir(recordingsDir, { recursive: true });
  const restored: string[] = [];
  for (const { sessionId, files, state } of plan) {
    if (state === 'same') continue;
    await copySession(archive, sessionId, files, join(recordingsDir, sessionId));
    restored.push(sessionId);
  }
  return { restored, alreadyPresent: plan.filter((p) => p.state === 'same').map((p) => p.sessionId) };
}

