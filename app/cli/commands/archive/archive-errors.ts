import { ArchiveFormatError } from '../../../core/archive/archive-error';
import { CliError } from '../../command';
import { asBadInput } from '../../input-errors';

/** An archive that is not one (missing, no manifest, unreadable manifest) is bad input. */
export function archiveBadInput<T>(work: () => Promise<T>): Promise<T> {
  return asBadInput(async () => {
    try {
      return await work();
    } catch (error) {
      if (error instanceof ArchiveFormatError) throw new CliError(error.message);
      throw error;
    }
  });
}
