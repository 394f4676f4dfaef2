import { stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { GazeloomHandlers } from '../../contract';
import { fail } from '../../contract/result';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { safeSegment, tableFile } from '../../core/archive/archive-manifest';
import { decodeTable } from '../../core/archive/table-codec';
import { defaultBackupPath, inspectLabArchive, listLabBackups } from '../archive/inspect-lab-archive';
import { restoreRecordings, RestoreConflictError } from '../archive/restore-recordings';
import { readLabArchive } from '../archive/verify-lab-archive';
import { writeLabArchive } from '../archive/write-lab-archive';
import type { DemoStudyCache } from '../demo/demo-study-cache';

type ArchiveChannels = 'backupLabArchive' | 'listLabBackups' | 'inspectLabArchive' | 'restoreLabArchive' | 'getDemoStudy';

export interface ArchiveHandlerDeps {
  readonly dataDir: string;
  readonly recordingsDir: string;
  readonly demo: DemoStudyCache;
}

/** Expected failures of archive work as contract failures; anything else is a bug and throws. */
function failure(error: unknown) {
  if (error instanceof ArchiveFormatError || error instanceof RangeError) return fail('bad_input', error.message);
  if (error instanceof RestoreConflictError) return fail('conflict', error.message);
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT' || code === 'EACCES' || code === 'EPERM' || code === 'ENOTDIR') return fail('bad_input', (error as Error).message);
  throw error;
}

async function isFolder(path: string): Promise<boolean> {
  try {
    return (await stat(path)).isDirectory();
  } catch {
    return false;
  }
}

/** A backup is demo data when every study in it is a demo study. */
function demoOnly(studiesNdjson: string | undefined): boolean {
  const studies = decodeTable('studies', studiesNdjson ?? '', tableFile('studies'));
  return studies.length > 0 && studies.every((s) => s.demo);
}

/** Lab archive backups and restores, and the demo study built on first run. */
export function archiveHandlers(deps: ArchiveHandlerDeps): Pick<GazeloomHandlers, ArchiveChannels> {
  const backupsDir = join(deps.dataDir, 'backups');
  return {
    backupLabArchive: async ({ tables, sessionIds, dest, zip }) => {
      try {
        const path = dest ?? (await defaultBackupPath(backupsDir, new Date(), zip === true));
        const sessionDirs: string[] = [];
        const missingRecordings: string[] = [];
        for (const id of sessionIds) {
          if (!safeSegment.safeParse(id).success) return fail('bad_input', `session id "${id}" is not a plain folder name`, 'request.sessionIds');
          const dir = join(deps.recordingsDir, id);
          if (await isFolder(dir)) sessionDirs.push(dir);
          else missingRecordings.push(id);
        }
        const manifest = await writeLabArchive(path, { tables, sessionDirs, demo: demoOnly(tables.studies) });
        return { path, manifest, missingRecordings };
      } catch (error) {
        return failure(error);
      }
    },
    listLabBackups: async () => ({ backupsDir, backups: await listLabBackups(backupsDir) }),
    inspectLabArchive: async ({ path }) => {
      try {
        return { manifest: await inspectLabArchive(path) };
      } catch (error) {
        return failure(error);
      }
    },
    restoreLabArchive: async ({ path }) => {
      try {
        const archive = await readLabArchive(path);
        const { restored, alreadyPresent } = await restoreRecordings(archive, deps.recordingsDir);
        return { tables: archive.tables, manifest: archive.manifest, restored, alreadyPresent };
      } catch (error) {
        return failure(error);
      }
    },
    getDemoStudy: () => deps.demo.get(),
  };
}
