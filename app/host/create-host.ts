import { join } from 'node:path';
import { channels, events, type AppInfo, type CallContext, type GazeloomHandlers, type Result, type StageStatus } from '../contract';
import { createDispatcher } from '../contract/dispatcher';
import { createEventHub, type EventSink } from '../contract/event-hub';
import type { HostClock } from '../core/clock/host-clock';
import { dataFolderJob } from './data-folder-job';
import { FirstRunQueue, type FirstRunJob } from './first-run';
import { appHandlers } from './handlers/app-handlers';
import { archiveHandlers } from './handlers/archive-handlers';
import { DemoStudyCache } from './demo/demo-study-cache';
import { liveHandlers } from './handlers/live-handlers';
import { preflightHandlers } from './handlers/preflight-handlers';
import { qualityHandlers } from './handlers/quality-handlers';
import { stimulusHandlers } from './handlers/stimulus-handlers';
import { JobRunner } from './jobs';
import { displayGeometry, gazeSourceChoice } from '../contract/schemas/live';
import { LiveSession } from './live/live-session';
import { RecoveredSessions } from './live/recovered-sessions';
import { SessionRecorder } from './recording/session-recorder';
import type { HostLog } from './log';
import type { StagePresenter } from './stage-presenter';
import { demoClipsJob } from './stimuli/demo-clips';
import { FlashScreeningService } from './stimuli/flash-screening';
import { StimulusService } from './stimuli/stimulus-service';
import { StimulusStore } from './stimuli/stimulus-store';
import { appVersion } from './version';

export interface HostOptions {
  readonly mode: AppInfo['mode'];
  readonly dataDir: string;
  readonly clock: HostClock;
  readonly log: HostLog;
  readonly stage: StagePresenter;
  /** Skip building the demo clips and study on first run (tests, --no-demo, GAZELOOM_NO_DEMO=1). */
  readonly noDemo?: boolean;
  /** Extra first-run jobs; the data folder job always runs first. */
  readonly firstRunJobs?: readonly FirstRunJob[];
}

export interface HostConnection {
  readonly id: string;
  dispatch(channel: string, payload: unknown): Promise<Result<unknown>>;
  detach(): void;
}

export interface Host {
  readonly info: AppInfo;
  readonly dataDir: string;
  /** A page (console or stage) connects; `send` delivers host events to it. */
  attach(page: CallContext['page'], send: EventSink['send']): HostConnection;
  startFirstRun(): Promise<void>;
  /** Stops the recording (closing it cleanly) and the background timers. */
  close(): Promise<void>;
}

/** The composition root of the host: every service, wired to the contract. */
export function createHost(options: HostOptions): Host {
  const { clock, log } = options;
  const hub = createEventHub(events);
  const firstRun = new FirstRunQueue(log, (task) => hub.emit('onFirstRunProgress', task));
  const jobs = new JobRunner((status) => hub.emit('onJobProgress', status), log);
  const store = new StimulusStore(options.dataDir, log);
  const changed = (ids: string[]) => hub.emit('onStimuliChanged', { ids });
  const flashScreening = new FlashScreeningService(store, jobs, changed);
  const stimuli = new StimulusService(store, jobs, changed, (id) => flashScreening.start(id));
  const clockOriginNs = (clock as { originNs?: bigint }).originNs ?? null;
  const recordingsDir = join(options.dataDir, 'recordings');
  const recovered = new RecoveredSessions(recordingsDir);
  const recorderOptions = { clock, clockOriginNs, onError: (error: Error) => log.error('recorder.write_failed', { message: error.message }) };
  const live = new LiveSession({
    clock,
    log,
    store,
    recordingsDir,
    openRecorder: (dir, meta) => SessionRecorder.create(dir, { sessionId: String(meta.sessionId), display: (meta.display as never) ?? null, metadata: meta }, recorderOptions),
    reopenRecorder: async (dir) => {
      const recorder = await SessionRecorder.reopen(dir, recorderOptions);
      const { sessionId, display, metadata } = recorder.info;
      return { recorder, sessionId, display: displayGeometry.parse(display), source: gazeSourceChoice.parse(metadata.source) };
    },
    toStage: { command: (command) => hub.emit('onStageCommand', command), events: (chunk) => hub.emit('onStageEvents', chunk) },
    publish: (status) => hub.emit('onLiveStatus', status),
  });

  firstRun.add(dataFolderJob(options.dataDir));
  firstRun.add(recovered.job());
  if (!options.noDemo) firstRun.add(demoClipsJob(store, changed));
  firstRun.add(flashScreening.job());
  const demoStudy = new DemoStudyCache(options.dataDir, recordingsDir, !options.noDemo);
  if (!options.noDemo) firstRun.add(demoStudy.job());
  for (const job of options.firstRunJobs ?? []) firstRun.add(job);

  const info: AppInfo = {
    name: 'Gazeloom',
    version: appVersion(),
    mode: options.mode,
    platform: process.platform,
    dataDir: options.dataDir,
    startedAt: new Date().toISOString(),
  };
  const stageStatuses = new Map<string, StageStatus>();
  const handlers: GazeloomHandlers = {
    ...appHandlers({
      info,
      clock,
      log,
      stage: options.stage,
      hub,
      firstRun,
      stageStatuses,
      // A stage page reloaded during a blank must come back blank.
      stageReported: () => {
        const blank = live.blank;
        if (blank) live.blankStage(blank.by, blank.reason);
      },
    }),
    ...stimulusHandlers({ store, service: stimuli, jobs, changed }),
    ...liveHandlers(live, recovered),
    ...archiveHandlers({ dataDir: options.dataDir, recordingsDir, demo: demoStudy }),
    ...preflightHandlers(recordingsDir),
    ...qualityHandlers(recordingsDir),
  };
  const dispatch = createDispatcher(channels, handlers, log);

  let nextConnection = 1;
  return {
    info,
    dataDir: options.dataDir,
    attach(page, send) {
      const id = `${page}-${nextConnection++}`;
      const removeSink = hub.addSink({ page, send });
      log.info('page.attached', { connection: id });
      return {
        id,
        dispatch: (channel, payload) => dispatch(channel, payload, { page, connectionId: id }),
        detach() {
          removeSink();
          const last = stageStatuses.get(id);
          if (last) {
            stageStatuses.delete(id);
            hub.emit('onStageStatus', { ...last, visible: false, connected: false });
          }
          log.info('page.detached', { connection: id });
        },
      };
    },
    startFirstRun: () => firstRun.start(),
    close: () => live.dispose(),
  };
}

export const hostLogFile = (dataDir: string): string => join(dataDir, 'logs', 'host.log');
