import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { StageCommand } from '../../../app/contract';
import { ManualClock } from '../../../app/core/clock/host-clock';
import type { GazeRecord, MessageRecord } from '../../../app/core/recording/records';
import { LiveSession, type SessionWriter } from '../../../app/host/live/live-session';
import { createHostLog } from '../../../app/host/log';
import { StimulusStore } from '../../../app/host/stimuli/stimulus-store';

/**
 * A live session on a manual clock whose simulated tracker runs only when the test advances
 * it, recording into memory: the gaze, the messages and the stage commands, to look at.
 */
export function inMemoryLiveSession(folderPrefix: string) {
  const dataDir = mkdtempSync(join(tmpdir(), folderPrefix));
  const log = createHostLog({ file: null, echo: false });
  const clock = new ManualClock(20e9);
  const gaze: GazeRecord[] = [];
  const messages: MessageRecord[] = [];
  const stage: StageCommand[] = [];
  const writer: SessionWriter = { appendGaze: (r) => gaze.push(r), appendFrames: () => {}, appendMessage: (r) => messages.push(r), close: async () => {} };
  const live = new LiveSession({
    clock,
    log,
    store: new StimulusStore(dataDir, log),
    recordingsDir: join(dataDir, 'recordings'),
    openRecorder: async () => writer,
    reopenRecorder: () => Promise.reject(new Error('not used')),
    toStage: { command: (c) => stage.push(c), events: () => {} },
    publish: () => {},
    simulatedDrive: 'manual',
  });
  return { dataDir, log, clock, live, gaze, messages, stage };
}
