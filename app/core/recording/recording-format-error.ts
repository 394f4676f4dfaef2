/**
 * A problem in a session recording, located for a person to fix: the file, where in it
 * (a chunk and byte offset, or a field), and what was expected. Reads as one line:
 *   session/gaze.chunks chunk 12 at byte 8192: payload is 90 bytes, expected 88 per record
 */
export class RecordingFormatError extends Error {
  override name = 'RecordingFormatError';

  constructor(
    readonly file: string,
    readonly location: string,
    readonly problem: string,
  ) {
    super(`${file}${location ? ` ${location}` : ''}: ${problem}`);
  }
}
