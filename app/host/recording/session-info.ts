import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { checkDisplayGeometry, type DisplayGeometry } from '../../core/geometry/display-geometry';
import { checkJsonValue } from '../../core/recording/json-value-check';
import { RecordingFormatError } from '../../core/recording/recording-format-error';
import { SessionFolderError } from './session-folder-error';
import { SESSION_FILE } from './session-files';

/** What the caller gives when creating a session. */
export interface SessionMeta {
  /** Defaults to a random UUID. */
  readonly sessionId?: string;
  /** The stage's display, or null when recording without one (`gazeloom record`). */
  readonly display: DisplayGeometry | null;
  /** Anything else the caller wants kept with the session (JSON values only). */
  readonly metadata?: Readonly<Record<string, unknown>>;
}

/** session.json. */
export interface SessionInfo {
  readonly format: 'gazeloom-session';
  readonly version: 1;
  readonly sessionId: string;
  /** Wall-clock creation time, ISO 8601. */
  readonly createdAt: string;
  /** The host clock at creation: zero of the session clock. */
  readonly createdHostNs: number;
  readonly display: DisplayGeometry | null;
  readonly metadata: Readonly<Record<string, unknown>>;
}

export function sessionInfo(meta: SessionMeta, createdAt: Date, createdHostNs: number): SessionInfo {
  const sessionId = meta.sessionId ?? globalThis.crypto.randomUUID();
  if (typeof sessionId !== 'string' || sessionId === '') throw new RangeError('meta.sessionId must be a non-empty string');
  if (meta.display !== null) checkDisplayGeometry(meta.display);
  const metadata = meta.metadata ?? {};
  checkJsonValue(metadata, 'meta.metadata');
  return { format: 'gazeloom-session', version: 1, sessionId, createdAt: createdAt.toISOString(), createdHostNs, display: meta.display, metadata };
}

export async function readSessionInfo(dir: string): Promise<SessionInfo> {
  const file = join(dir, SESSION_FILE);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new SessionFolderError(dir, `not a session folder (no ${SESSION_FILE})`);
    throw error;
  }
  let o: Record<string, unknown>;
  try {
    o = JSON.parse(text) as Record<string, unknown>;
  } catch (error) {
    throw new RecordingFormatError(file, '', `not valid JSON (${(error as Error).message})`);
  }
  const bad = (field: string, expected: string) => new RecordingFormatError(file, `field "${field}"`, `expected ${expected}`);
  if (o.format !== 'gazeloom-session') throw bad('format', '"gazeloom-session"');
  if (o.version !== 1) throw bad('version', '1 (a newer Gazeloom wrote this session?)');
  if (typeof o.sessionId !== 'string') throw bad('sessionId', 'a string');
  if (typeof o.createdAt !== 'string' || Number.isNaN(Date.parse(o.createdAt))) throw bad('createdAt', 'an ISO 8601 time');
  if (typeof o.createdHostNs !== 'number' || !Number.isFinite(o.createdHostNs)) throw bad('createdHostNs', 'a number of nanoseconds');
  if (typeof o.metadata !== 'object' || o.metadata === null) throw bad('metadata', 'an object');
  if (o.display !== null) {
    try {
      checkDisplayGeometry(o.display as DisplayGeometry);
    } catch (error) {
      throw bad('display', `null or a display geometry (${(error as Error).message})`);
    }
  }
  return o as unknown as SessionInfo;
}
