import { createReadStream } from 'node:fs';
import { mkdir, stat } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { ARCHIVE_FORMAT, ARCHIVE_FORMAT_VERSION, archiveManifest, MANIFEST_FILE, recordingFilePath, safeSegment, tableFile, tableNames, type ArchiveManifest } from '../../core/archive/archive-manifest';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { decodeTable } from '../../core/archive/table-codec';
import type { TableName } from '../../core/study/records';
import { LOCK_FILE } from '../recording/session-files';
import { appVersion } from '../version';
import type { ArchiveSink } from './archive-sink';
import { openFolderSource } from './folder-source';
import { createFolderSink } from './folder-sink';
import { createZipSink } from './zip-sink';

export interface LabArchiveInput {
  /** NDJSON per table (encodeTable); a table left out is written empty. */
  readonly tables: Partial<Record<TableName, string>>;
  /** Session folders to copy under recordings/, each named by its session id. */
  readonly sessionDirs: readonly string[];
  readonly demo: boolean;
  readonly now?: Date;
}

export const isZipPath = (path: string): boolean => path.toLowerCase().endsWith('.zip');

async function exists(path: string): Promise<boolean> {
  try {
    await stat(path);
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
    throw error;
  }
}

/** Every table checked against its schema before anything is written; a bad record names its table and line. */
function checkTables(input: LabArchiveInput): Record<TableName, { text: string; records: number }> {
  const out = {} as Record<TableName, { text: string; records: number }>;
  for (const [name, text] of Object.entries(input.tables)) {
    if (!tableNames.includes(name as TableName)) throw new ArchiveFormatError(name, `unknown table (known: ${tableNames.join(', ')})`);
    if (typeof text !== 'string') throw new ArchiveFormatError(name, 'expected the table as NDJSON text');
  }
  for (const table of tableNames) {
    const text = input.tables[table] ?? '';
    out[table] = { text, records: decodeTable(table, text, tableFile(table)).length };
  }
  return out;
}

async function addRecording(sink: ArchiveSink, dir: string, manifest: ArchiveManifest): Promise<void> {
  const sessionId = basename(dir);
  if (!safeSegment.safeParse(sessionId).success) throw new ArchiveFormatError(dir, 'a session folder name must be a plain name (letters, digits, ".", "_", "-")');
  if (manifest.recordings[sessionId]) throw new ArchiveFormatError(dir, `session "${sessionId}" is given twice`);
  const source = await openFolderSource(dir);
  const files: ArchiveManifest['recordings'][string]['files'] = {};
  for (const relPath of [...source.files.keys()].sort()) {
    if (relPath === LOCK_FILE) continue; // which process held the folder means nothing elsewhere
    files[relPath] = await sink.add(recordingFilePath(sessionId, relPath), createReadStream(join(dir, ...relPath.split('/'))));
  }
  manifest.recordings[sessionId] = { files };
}

/**
 * Writes a lab archive to `dest`: a folder, or a .zip when the name ends in .zip. Nothing
 * appears at `dest` until the whole archive is written and synced (it is staged beside it
 * and renamed), and an existing `dest` is never overwritten.
 */
export async function writeLabArchive(dest: string, input: LabArchiveInput): Promise<ArchiveManifest> {
  if (await exists(dest)) throw new ArchiveFormatError(dest, 'already exists; choose a new name (an archive is never overwritten)');
  const checked = checkTables(input);
  const now = input.now ?? new Date();
  await mkdir(dirname(dest), { recursive: true });
  const sink = isZipPath(dest) ? await createZipSink(dest, now) : await createFolderSink(dest);
  const manifest: ArchiveManifest = { format: ARCHIVE_FORMAT, formatVersion: ARCHIVE_FORMAT_VERSION, appVersion: appVersion(), createdAt: now.toISOString(), demo: input.demo, tables: {}, recordings: {} };
  try {
    for (const table of tableNames) {
      const { text, records } = checked[table];
      const { sha256 } = await sink.add(tableFile(table), new TextEncoder().encode(text));
      manifest.tables[table] = { file: tableFile(table), records, sha256 };
    }
    for (const dir of input.sessionDirs) await addRecording(sink, dir, manifest);
    archiveManifest.parse(manifest);
    await sink.add(MANIFEST_FILE, new TextEncoder().encode(`${JSON.stringify(manifest, null, 2)}\n`));
    await sink.commit();
  } catch (error) {
    await sink.abort();
    throw error;
  }
  return manifest;
}
