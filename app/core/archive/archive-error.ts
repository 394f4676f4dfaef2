/**
 * A lab archive (or a file in it) that cannot be used: malformed, damaged, tampered with,
 * or from a newer Gazeloom. The message names the file, and the line when there is one.
 */
export class ArchiveFormatError extends Error {
  override name = 'ArchiveFormatError';

  constructor(
    /** The file inside the archive (e.g. tables/participants.ndjson), or the archive itself. */
    readonly file: string,
    readonly problem: string,
    readonly line: number | null = null,
  ) {
    super(`${file}${line === null ? '' : `:${line}`}: ${problem}`);
  }
}
