import { join } from 'node:path';
import type { GazeloomHandlers } from '../../contract';
import { fail } from '../../contract/result';
import { safeSegment } from '../../core/archive/archive-manifest';
import { RecordingFormatError } from '../../core/recording/recording-format-error';
import { readSessionSeries } from '../quality/session-series';
import { SessionFolderError } from '../recording/session-folder-error';

/** A session recording's quality over time: data loss, late frames and (when asked) the gaze, for the quality screen. */
export function qualityHandlers(recordingsDir: string): Pick<GazeloomHandlers, 'getSessionQuality'> {
  return {
    getSessionQuality: async ({ sessionId, binS, gaze }) => {
      if (!safeSegment.safeParse(sessionId).success) return fail('bad_input', `session id "${sessionId}" is not a plain folder name`, 'request.sessionId');
      try {
        const { gaze: series, ...rest } = await readSessionSeries(join(recordingsDir, sessionId), { binS });
        return gaze ? { ...rest, gaze: series } : rest;
      } catch (error) {
        if (error instanceof SessionFolderError) return fail('not_found', `no recording of session "${sessionId}" in the data folder (${error.problem})`);
        if (error instanceof RecordingFormatError) return fail('bad_input', error.message);
        const code = (error as NodeJS.ErrnoException).code;
        if (code === 'ENOENT') return fail('not_found', `no recording of session "${sessionId}" in the data folder`);
        throw error;
      }
    },
  };
}
