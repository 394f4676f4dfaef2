import { createHash } from 'node:crypto';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { MANIFEST_FILE, recordingFilePath, tableFile, tableNames, type ArchiveManifest } from '../../core/archive/archive-manifest';
import { parseManifest } from '../../core/archive/parse-manifest';
import { countRecords, decodeTable } from '../../core/archive/table-codec';
import type { TableName } from '../../core/study/records';
import { openArchiveSource, readAll, type ArchiveSource } from './archive-source';

export interface ArchiveProblem {
  /** The file inside the archive, e.g. tables/participants.ndjson. */
  readonly file: string;
  readonly problem: string;
}

export interface VerifiedArchive {
  readonly source: ArchiveSource;
  readonly manifest: ArchiveManifest;
  /** Every table's NDJSON ('' for a table the archive does not hold). */
  readonly tables: Record<TableName, string>;
  /** Everything that does not match the manifest; empty when the archive is intact. */
  readonly problems: readonly ArchiveProblem[];
}

async function digest(source: ArchiveSource, name: string): Promise<{ bytes: number; sha256: string } | string> {
  const hash = createHash('sha256');
  let bytes = 0;
  try {
    for await (const chunk of source.read(name)) {
      hash.update(chunk);
      bytes += chunk.length;
    }
  } catch (error) {
    if (error instanceof ArchiveFormatError) return error.problem;
    throw error;
  }
  return { bytes, sha256: hash.digest('hex') };
}

const CHANGED = 'SHA-256 does not match the manifest: the file was changed or damaged';

async function checkTable(source: ArchiveSource, table: TableName, entry: ArchiveManifest['tables'][string], problems: ArchiveProblem[]): Promise<string> {
  const file = entry.file;
  if (!source.files.has(file)) {
    problems.push({ file, problem: 'missing (listed in the manifest)' });
    return '';
  }
  let bytes: Uint8Array;
  try {
    bytes = await readAll(source, file);
  } catch (error) {
    if (!(error instanceof ArchiveFormatError)) throw error;
    problems.push({ file, problem: error.problem });
    return '';
  }
  const text = new TextDecoder().decode(bytes);
  if (createHash('sha256').update(bytes).digest('hex') !== entry.sha256) problems.push({ file, problem: CHANGED });
  else if (countRecords(text) !== entry.records) problems.push({ file, problem: `holds ${countRecords(text)} records, the manifest says ${entry.records}` });
  try {
    decodeTable(table, text, file);
  } catch (error) {
    if (!(error instanceof ArchiveFormatError)) throw error;
    problems.push({ file: error.line === null ? file : `${file}:${error.line}`, problem: error.problem });
  }
  return text;
}

/**
 * Checks a lab archive against its manifest: every table's SHA-256, record count and records
 * (schemas of records.ts), every recording file's size and SHA-256, and that no file is
 * missing or unlisted. Problems are collected, not thrown; an archive whose manifest cannot
 * be read at all throws an ArchiveFormatError.
 */
export async function verifyLabArchive(path: string): Promise<VerifiedArchive> {
  const source = await openArchiveSource(path);
  if (!source.files.has(MANIFEST_FILE)) throw new ArchiveFormatError(path, `no ${MANIFEST_FILE}: not a Gazeloom lab archive`);
  const manifest = parseManifest(new TextDecoder().decode(await readAll(source, MANIFEST_FILE)));
  const problems: ArchiveProblem[] = [];
  const listed = new Set<string>([MANIFEST_FILE]);
  const tables = Object.fromEntries(tableNames.map((t) => [t, ''])) as Record<TableName, string>;
  for (const table of tableNames) {
    const entry = manifest.tables[table];
    if (!entry) continue;
    listed.add(entry.file);
    tables[table] = await checkTable(source, table, entry, problems);
  }
  for (const [sessionId, { files }] of Object.entries(manifest.recordings)) {
    for (const [relPath, expected] of Object.entries(files)) {
      const file = recordingFilePath(sessionId, relPath);
      listed.add(file);
      if (!source.files.has(file)) {
        problems.push({ file, problem: 'missing (listed in the manifest)' });
        continue;
      }
      const found = await digest(source, file);
      if (typeof found === 'string') problems.push({ file, problem: found });
      else if (found.bytes !== expected.bytes) problems.push({ file, problem: `${found.bytes} bytes, the manifest says ${expected.bytes}` });
      else if (found.sha256 !== expected.sha256) problems.push({ file, problem: CHANGED });
    }
  }
  for (const file of source.files.keys()) {
    if (!listed.has(file)) problems.push({ file, problem: tableNames.some((t) => tableFile(t) === file) ? 'a table file the manifest does not list' : 'not listed in the manifest' });
  }
  return { source, manifest, tables, problems };
}

/** Reads an archive for restoring: any problem at all is an ArchiveFormatError naming the first file. */
export async function readLabArchive(path: string): Promise<VerifiedArchive> {
  const verified = await verifyLabArchive(path);
  const [first, ...rest] = verified.problems;
  if (first) throw new ArchiveFormatError(first.file, `${first.problem}${rest.length ? ` (and ${rest.length} more problem${rest.length > 1 ? 's' : ''})` : ''}`);
  return verified;
}
