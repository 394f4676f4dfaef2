import { ArchiveFormatError } from './archive-error';
import { ARCHIVE_FORMAT, ARCHIVE_FORMAT_VERSION, archiveManifest, MANIFEST_FILE, type ArchiveManifest } from './archive-manifest';
import { firstIssue } from './issue-path';

/** Reads manifest.json; a newer format version is refused by name rather than half understood. */
export function parseManifest(text: string, file = MANIFEST_FILE): ArchiveManifest {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    throw new ArchiveFormatError(file, `not valid JSON (${(error as Error).message})`);
  }
  const head = raw as { format?: unknown; formatVersion?: unknown } | null;
  if (typeof head !== 'object' || head === null || head.format !== ARCHIVE_FORMAT) throw new ArchiveFormatError(file, `not a Gazeloom lab archive manifest (expected "format": "${ARCHIVE_FORMAT}")`);
  if (typeof head.formatVersion === 'number' && head.formatVersion > ARCHIVE_FORMAT_VERSION) {
    throw new ArchiveFormatError(file, `archive format version ${head.formatVersion} is newer than this Gazeloom reads (${ARCHIVE_FORMAT_VERSION}); update Gazeloom`);
  }
  const parsed = archiveManifest.safeParse(raw);
  if (!parsed.success) throw new ArchiveFormatError(file, firstIssue(parsed.error));
  return parsed.data;
}
