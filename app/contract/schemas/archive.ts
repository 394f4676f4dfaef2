import { z } from 'zod';
import { archiveManifest } from '../../core/archive/archive-manifest';

/** The manifest as app/core/archive defines it, checked at the boundary too. */
export { archiveManifest };

/** Tables as NDJSON text by table name (app/core/archive encodeTable), as the console's LabStore exports them. */
export const ndjsonTables = z.record(z.string(), z.string());

export const backupRequest = z.object({
  tables: ndjsonTables,
  /** Sessions whose recordings go in (folders under the data folder's recordings/). */
  sessionIds: z.array(z.string().min(1).max(200)).max(10_000),
  /** Where to write it; default dataDir/backups/lab-YYYYMMDD-HHMMSS (with .zip when zip is set). */
  dest: z.string().min(1).max(4096).optional(),
  zip: z.boolean().optional(),
});

export const backupResponse = z.object({
  path: z.string(),
  manifest: archiveManifest,
  /** Sessions asked for whose recording folder is not in the data folder (the backup holds their records only). */
  missingRecordings: z.array(z.string()),
});

export const archivePathRequest = z.object({ path: z.string().min(1).max(4096) });

export const backupListing = z.object({
  path: z.string(),
  name: z.string(),
  kind: z.enum(['folder', 'zip']),
  manifest: archiveManifest.nullable(),
  problem: z.string().nullable(),
});

export const restoreResponse = z.object({
  tables: ndjsonTables,
  manifest: archiveManifest,
  /** Recordings copied into the data folder, and those already there with the same files. */
  restored: z.array(z.string()),
  alreadyPresent: z.array(z.string()),
});

export const demoStudy = z.object({
  state: z.enum(['building', 'ready', 'none', 'failed']),
  tables: ndjsonTables.optional(),
  message: z.string().optional(),
});

export const backupList = z.object({ backupsDir: z.string(), backups: z.array(backupListing) });
