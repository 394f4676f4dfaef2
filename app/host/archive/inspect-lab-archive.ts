import { readdir, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { MANIFEST_FILE, type ArchiveManifest } from '../../core/archive/archive-manifest';
import { parseManifest } from '../../core/archive/parse-manifest';
import { openArchiveSource, readAll } from './archive-source';

/** The manifest alone, without checking the files against it (that is verifyLabArchive). */
export async function inspectLabArchive(path: string): Promise<ArchiveManifest> {
  const source = await openArchiveSource(path);
  if (!source.files.has(MANIFEST_FILE)) throw new ArchiveFormatError(path, `no ${MANIFEST_FILE}: not a Gazeloom lab archive`);
  return parseManifest(new TextDecoder().decode(await readAll(source, MANIFEST_FILE)));
}

export interface BackupListing {
  readonly path: string;
  readonly name: string;
  readonly kind: 'folder' | 'zip';
  readonly manifest: ArchiveManifest | null;
  /** Why the manifest could not be read, when it could not. */
  readonly problem: string | null;
}

/** The archives in a backups folder, newest first (by the manifest's creation time; unreadable ones last). */
export async function listLabBackups(backupsDir: string): Promise<BackupListing[]> {
  let names: string[];
  try {
    names = (await readdir(backupsDir)).filter((n) => !n.startsWith('.'));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const out: BackupListing[] = [];
  for (const name of names) {
    const path = join(backupsDir, name);
    const kind = (await stat(path)).isDirectory() ? 'folder' : 'zip';
    try {
      out.push({ path, name, kind, manifest: await inspectLabArchive(path), problem: null });
    } catch (error) {
      if (!(error instanceof ArchiveFormatError)) throw error;
      out.push({ path, name, kind, manifest: null, problem: error.message });
    }
  }
  const time = (b: BackupListing) => b.manifest?.createdAt ?? '';
  return out.sort((a, b) => time(b).localeCompare(time(a)) || b.name.localeCompare(a.name));
}

/** dataDir/backups/lab-YYYYMMDD-HHMMSS[.zip] in UTC, with -2, -3, ... when that second already has a backup. */
export async function defaultBackupPath(backupsDir: string, now: Date, zip: boolean): Promise<string> {
  const stamp = now.toISOString().replace(/[-:]/g, '').replace(/\..*/, '').replace('T', '-');
  for (let n = 1; ; n++) {
    const path = join(backupsDir, `lab-${stamp}${n > 1 ? `-${n}` : ''}${zip ? '.zip' : ''}`);
    try {
      await stat(path);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return path;
      throw error;
    }
  }
}
