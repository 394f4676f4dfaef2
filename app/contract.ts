/**
 * The one typed contract between the renderer (console and stage pages) and the host.
 * Every request, response and host event is declared here with its schema; both ends
 * validate against it (app/contract/client.ts in the renderer, app/contract/dispatcher.ts
 * in the host). Channels are verbs the renderer calls; events are named `onSomething`.
 */
import { channel, hostEvent, type ClientApi, type HostHandlers } from './contract/define';
import { empty } from './contract/schemas/common';
import * as app from './contract/schemas/app';

export const channels = {
  getAppInfo: channel({ request: empty, response: app.appInfo, summary: 'Version, mode and data folder of the running host' }),
  ping: channel({ request: app.pingRequest, response: app.pingResponse, summary: 'Clock exchange: host receive and send times' }),
  listDisplays: channel({ request: empty, response: app.displayList, summary: 'Displays the stage can be shown on' }),
  openStage: channel({ request: app.openStageRequest, response: app.openStageResponse, summary: 'Show the stage on a display' }),
  reportStageStatus: channel({ request: app.stageStatus.strict(), response: empty, summary: 'The stage says whether it is visible and how it draws' }),
  getFirstRunStatus: channel({ request: empty, response: app.firstRunStatus, summary: 'Background first-run work and its progress' }),
} as const;

export const events = {
  onFirstRunProgress: hostEvent({ payload: app.firstRunTask, audience: 'console', summary: 'A first-run task moved on' }),
  onStageStatus: hostEvent({ payload: app.stageStatusEvent, audience: 'console', summary: 'The stage connected, disconnected, or changed visibility' }),
} as const;

export const contract = { channels, events } as const;

export type Channels = typeof channels;
export type Events = typeof events;
export type GazeloomApi = ClientApi<Channels, Events>;
export type GazeloomHandlers = HostHandlers<Channels>;

export * from './contract/result';
export type { CallContext } from './contract/define';
export type { AppInfo, DisplayInfo, StageStatus, StageStatusEvent, FirstRunTask } from './contract/schemas/app';
