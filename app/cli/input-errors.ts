import { EventFormatError } from '../core/events/event-format-error';
import { CliError } from './command';

/**
 * Turns the expected failures of reading a user's files into bad-input errors (exit 2,
 * one line): a malformed event file, a missing or unreadable path, a parameter out of range.
 */
export async function asBadInput<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof CliError) throw error;
    if (error instanceof EventFormatError || error instanceof RangeError) throw new CliError(error.message);
    const code = (error as NodeJS.ErrnoException).code;
    const path = (error as NodeJS.ErrnoException).path;
    if (code === 'ENOENT') throw new CliError(`${path ?? 'file'}: no such file`);
    if (code === 'EACCES' || code === 'EPERM') throw new CliError(`${path ?? 'file'}: permission denied`);
    if (code === 'EISDIR') throw new CliError(`${path ?? 'file'}: is a folder, not a file`);
    throw error;
  }
}
