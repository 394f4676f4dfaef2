import { RecordedGazeFormatError } from '../../../core/gaze/feed';
import { CliError } from '../../command';

const SOCKET_PROBLEMS: Record<string, string> = {
  EADDRINUSE: 'the port is already in use',
  EADDRNOTAVAIL: 'no network interface has that address',
  EACCES: 'permission denied (ports below 1024 need privileges)',
  ECONNREFUSED: 'nothing is listening there',
  ENOTFOUND: 'the host name does not resolve',
};

/** Turns the expected failures of the feed commands into bad-input errors naming the option. */
export function feedBadInput(error: unknown, option: string, url: string): never {
  if (error instanceof CliError) throw error;
  if (error instanceof RangeError || error instanceof RecordedGazeFormatError) throw new CliError(error.message);
  const problem = SOCKET_PROBLEMS[(error as NodeJS.ErrnoException).code ?? ''];
  if (problem) throw new CliError(`--${option} ${url}: ${problem}`);
  throw error;
}
