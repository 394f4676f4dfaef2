/**
 * A problem in an event file, located for a person to fix: the file, where in it (for text
 * a 1-based physical line, the header being line 1; for .glev a chunk and byte offset),
 * and what was expected. The message reads as one line:
 *   clip.csv line 12: timestamp 1500 is earlier than 1600 on line 11 (use --sort to reorder)
 */
export class EventFormatError extends Error {
  override name = 'EventFormatError';

  constructor(
    readonly file: string,
    readonly location: string,
    readonly problem: string,
  ) {
    super(`${file}${location ? ` ${location}` : ''}: ${problem}`);
  }
}
