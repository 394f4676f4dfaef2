import { z } from 'zod';
import { tables, type TableName } from '../study/records';

/**
 * The lab archive: a folder (or a .zip of the same layout) that joins the console's records
 * and the host's recordings, so backups, the command line, analysis and releases all read
 * the same thing without the UI.
 *   manifest.json               this manifest: format, versions, and a SHA-256 of every other file
 *   tables/NAME.ndjson          one record per line, as records.ts defines them (personal fields still encrypted)
 *   recordings/SESSION/...      the recorder's session folders as they are (no lock files)
 * Version 1; a reader refuses a newer version rather than guess at it.
 */
export const ARCHIVE_FORMAT_VERSION = 1;
export const ARCHIVE_FORMAT = 'gazeloom-lab-archive';
export const MANIFEST_FILE = 'manifest.json';

const sha256 = z.string().regex(/^[0-9a-f]{64}$/, 'expected a SHA-256 as 64 lowercase hex digits');
/** One path segment: no separators, no "." or "..", nothing a file system treats specially. */
const SEGMENT = /^(?!\.{1,2}$)[A-Za-z0-9._-]{1,200}$/;
export const safeSegment = z.string().regex(SEGMENT, 'expected a plain name (letters, digits, ".", "_", "-")');
const relativePath = z.string().refine((p) => p.split('/').every((s) => SEGMENT.test(s)), 'expected a relative path of plain names separated by "/"');

export const tableEntry = z.object({ file: z.string(), records: z.number().int().nonnegative(), sha256 });
export const recordingFile = z.object({ bytes: z.number().int().nonnegative(), sha256 });

export const archiveManifest = z
  .object({
    format: z.literal(ARCHIVE_FORMAT),
    formatVersion: z.number().int().positive(),
    appVersion: z.string().min(1).max(40),
    createdAt: z.string().min(10).max(40),
    /** Invented data made by the simulator (`gazeloom demo`): shown as such everywhere. */
    demo: z.boolean(),
    tables: z.record(z.string(), tableEntry),
    recordings: z.record(safeSegment, z.object({ files: z.record(relativePath, recordingFile) })),
  })
  .superRefine((m, ctx) => {
    for (const [name, entry] of Object.entries(m.tables)) {
      if (!(name in tables)) ctx.addIssue({ code: 'custom', path: ['tables', name], message: `unknown table "${name}" (known: ${Object.keys(tables).join(', ')})` });
      else if (entry.file !== tableFile(name as TableName)) ctx.addIssue({ code: 'custom', path: ['tables', name, 'file'], message: `expected "${tableFile(name as TableName)}"` });
    }
  });

export type ArchiveManifest = z.infer<typeof archiveManifest>;

export const tableFile = (table: TableName): string => `tables/${table}.ndjson`;
export const recordingFilePath = (sessionId: string, relPath: string): string => `recordings/${sessionId}/${relPath}`;
export const tableNames = Object.keys(tables) as TableName[];
