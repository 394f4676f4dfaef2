import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { tableFile } from '../../core/archive/archive-manifest';
import { decodeTable } from '../../core/archive/table-codec';
import { sessionQuality, type SessionQuality } from '../../core/quality/session-quality';
import { restoreRecordings } from '../archive/restore-recordings';
import { readLabArchive, type VerifiedArchive } from '../archive/verify-lab-archive';
import { readSessionSeries } from './session-series';

export interface ArchiveQuality {
  readonly sessions: SessionQuality[];
  /** Sessions whose recording the archive does not hold: their times and data loss are null. */
  readonly withoutRecording: string[];
}

/** Where the archive's recordings can be read as session folders: in place for a folder, unpacked for a .zip. */
async function recordingsFolder(archive: VerifiedArchive, path: string): Promise<{ dir: string; done: () => Promise<void> }> {
  if ((await stat(path)).isDirectory()) return { dir: join(path, 'recordings'), done: async () => undefined };
  const dir = await mkdtemp(join(tmpdir(), 'gazeloom-quality-'));
  const done = () => rm(dir, { recursive: true, force: true });
  try {
    await restoreRecordings(archive, dir);
  } catch (error) {
    await done();
    throw error;
  }
  return { dir, done };
}

/**
 * Every session's quality (or one session's) from a lab archive, folder or .zip: the
 * validation records and protocol thresholds of its tables, the data loss and late frames
 * of its recordings. The archive is verified first; any damage is an ArchiveFormatError.
 */
export async function archiveQuality(path: string, options: { sessionId?: string; binS?: number } = {}): Promise<ArchiveQuality> {
  const archive = await readLabArchive(path);
  const read = <T extends 'sessions' | 'protocols' | 'validations'>(t: T) => decodeTable(t, archive.tables[t], tableFile(t));
  const all = read('sessions');
  const protocols = read('protocols');
  const validations = read('validations');
  const chosen = options.sessionId === undefined ? all : all.filter((s) => s.id === options.sessionId);
  if (chosen.length === 0 && options.sessionId !== undefined) {
    throw new ArchiveFormatError(path, `no session "${options.sessionId}" (the archive holds ${all.length ? all.map((s) => s.id).join(', ') : 'no sessions'})`);
  }
  const recordings = await recordingsFolder(archive, path);
  try {
    const sessions: SessionQuality[] = [];
    const withoutRecording: string[] = [];
    for (const session of chosen) {
      const protocol = protocols.find((p) => p.id === session.protocolId);
      if (!protocol) throw new ArchiveFormatError(tableFile('sessions'), `session "${session.id}" names protocol "${session.protocolId}", which the archive does not hold`);
      const recorded = session.id in archive.manifest.recordings;
      if (!recorded) withoutRecording.push(session.id);
      const series = recorded ? await readSessionSeries(join(recordings.dir, session.id), { binS: options.binS }) : null;
      sessions.push(
        sessionQuality({
          session,
          validations,
          firstSampleHostNs: series?.firstSampleHostNs ?? null,
          dataLoss: series?.dataLoss ?? null,
          lateFrames: series ? { frames: series.lateFrames.totalFrames, late: series.lateFrames.totalLate } : null,
          thresholds: protocol.thresholds,
        }),
      );
    }
    return { sessions, withoutRecording };
  } finally {
    await recordings.done();
  }
}
