import { basename } from 'node:path';
import { gazeSourceChoice, displayGeometry } from '../../contract/schemas/live';
import type { FirstRunJob } from '../first-run';
import { findUnclosedSessions } from '../recording/find-unclosed-sessions';
import { recoverSession } from '../recording/recover-session';
import { readSessionInfo } from '../recording/session-info';

export interface RecoveredSession {
  readonly sessionId: string;
  readonly dir: string;
  readonly samples: number;
  readonly frames: number;
  readonly messages: number;
  readonly tornTailBytes: number;
  readonly corruptChunks: number;
  /** Whether the session's gaze source and display are known, so it can be resumed as it was. */
  readonly resumable: boolean;
}

/**
 * At every start the host looks for recordings that did not close (a crash or power cut),
 * recovers them (cutting a torn last chunk, rebuilding the index) and keeps the list, so
 * the console can report what was saved and offer to resume each one.
 */
export class RecoveredSessions {
  private found: RecoveredSession[] = [];

  constructor(private readonly recordingsRoot: string) {}

  list(): RecoveredSession[] {
    return [...this.found];
  }

  forget(sessionId: string): void {
    this.found = this.found.filter((s) => s.sessionId !== sessionId);
  }

  job(): FirstRunJob {
    return {
      id: 'recover-recordings',
      label: 'Recover unfinished recordings',
      run: async (report) => {
        const dirs = await findUnclosedSessions(this.recordingsRoot);
        for (const [i, dir] of dirs.entries()) {
          report(i / Math.max(1, dirs.length), `recovering ${basename(dir)}`);
          const recovery = await recoverSession(dir);
          const info = await readSessionInfo(dir);
          const resumable = gazeSourceChoice.safeParse(info.metadata.source).success && displayGeometry.safeParse(info.display).success;
          this.found.push({
            sessionId: info.sessionId,
            dir,
            samples: recovery.recovered.gaze,
            frames: recovery.recovered.frames,
            messages: recovery.recovered.messages,
            tornTailBytes: recovery.tornTailBytes,
            corruptChunks: recovery.corruptChunks,
            resumable,
          });
        }
        if (dirs.length === 0) return 'every recording had closed cleanly';
        const samples = this.found.reduce((n, s) => n + s.samples, 0);
        return `recovered ${dirs.length} unfinished recording${dirs.length === 1 ? '' : 's'} (${samples.toLocaleString('en-GB')} samples); resume them from the Live screen`;
      },
    };
  }
}
