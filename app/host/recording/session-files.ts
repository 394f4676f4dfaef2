import { join } from 'node:path';
import type { RecordStream } from '../../core/recording/chunk-format';

/**
 * A session folder:
 *   session.json      who and what: written once, durably, at creation, never changed
 *   gaze.chunks       gaze samples      } append-only chunk files: the recording itself,
 *   frames.chunks     the frame log     } never rewritten, only appended to (and a torn
 *   messages.chunks   messages          } last chunk cut by recovery)
 *   index.json        chunk offsets and host-time ranges, derived: written at close and by
 *                     recovery, ignored whenever it does not match the files
 *   closed.json       the clean-close marker: written durably by close, removed on reopen
 *   recovery.ndjson   one line per torn tail recovery cut: when, which stream, how many bytes
 *   recorder.lock     the process recording into the folder (removed at close)
 */
export const SESSION_FILE = 'session.json';
export const INDEX_FILE = 'index.json';
export const CLOSED_FILE = 'closed.json';
export const RECOVERY_LOG_FILE = 'recovery.ndjson';
export const LOCK_FILE = 'recorder.lock';

export const STREAM_FILES: Readonly<Record<RecordStream, string>> = { gaze: 'gaze.chunks', frames: 'frames.chunks', messages: 'messages.chunks' };

export const streamPath = (dir: string, stream: RecordStream): string => join(dir, STREAM_FILES[stream]);
