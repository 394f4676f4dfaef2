import { RecordingFormatError } from '../../../core/recording/recording-format-error';
import { SessionFolderError } from '../../../host/recording/session-folder-error';
import { CliError } from '../../command';
import { asBadInput } from '../../input-errors';

/** The expected failures of the recording commands (not a session, damaged format, folder in use) as bad input. */
export function recordingBadInput<T>(work: () => Promise<T>): Promise<T> {
  return asBadInput(async () => {
    try {
      return await work();
    } catch (error) {
      if (error instanceof SessionFolderError || error instanceof RecordingFormatError) throw new CliError(error.message);
      throw error;
    }
  });
}
