import type { GazeloomHandlers, StageStatus } from '../../contract';
import type { EventHub } from '../../contract/event-hub';
import type { Events, AppInfo } from '../../contract';
import type { HostClock } from '../../core/clock/host-clock';
import type { FirstRunQueue } from '../first-run';
import type { HostLog } from '../log';
import type { StagePresenter } from '../stage-presenter';

type AppChannels = 'getAppInfo' | 'ping' | 'listDisplays' | 'openStage' | 'reportStageStatus' | 'getStageStatus' | 'getFirstRunStatus';

interface Deps {
  readonly info: AppInfo;
  readonly clock: HostClock;
  readonly log: HostLog;
  readonly stage: StagePresenter;
  readonly hub: EventHub<Events>;
  readonly firstRun: FirstRunQueue;
  /** Last status each stage connection reported, by connection id. */
  readonly stageStatuses: Map<string, StageStatus>;
  /** Called after each stage report, so a stage page that (re)connects gets the state it must show. */
  readonly stageReported?: () => void;
}

/** The installation, clocks, displays and the stage's presence. */
export function appHandlers({ info, clock, log, stage, hub, firstRun, stageStatuses, stageReported }: Deps): Pick<GazeloomHandlers, AppChannels> {
  return {
    getAppInfo: () => info,
    ping: () => {
      const hostReceivedNs = clock.nowNs();
      return { hostReceivedNs, hostSentNs: clock.nowNs() };
    },
    listDisplays: () => stage.listDisplays(),
    openStage: ({ displayId }) => stage.open(displayId),
    reportStageStatus: (status, context) => {
      stageStatuses.set(context.connectionId, status);
      if (!status.visible) log.warn('stage.hidden', { connection: context.connectionId });
      hub.emit('onStageStatus', { ...status, connected: true });
      stageReported?.();
      return {};
    },
    getStageStatus: () => {
      const last = [...stageStatuses.values()].at(-1);
      return { stage: last ? { ...last, connected: true } : null };
    },
    getFirstRunStatus: () => ({ tasks: firstRun.status() }),
  };
}
