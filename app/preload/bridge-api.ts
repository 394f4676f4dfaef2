import type { IpcRenderer, IpcRendererEvent } from 'electron';

/**
 * What the preload exposes as `window.gazeloomBridge`: one function per contract channel
 * and one subscription per host event, nothing else (never ipcRenderer itself).
 */
export function buildBridge(
  ipcRenderer: Pick<IpcRenderer, 'invoke' | 'on' | 'removeListener'>,
  channelNames: readonly string[],
  eventNames: readonly string[],
): Record<string, (arg: unknown) => unknown> {
  const bridge: Record<string, (arg: unknown) => unknown> = {};
  for (const channel of channelNames) {
    bridge[channel] = (payload: unknown) => ipcRenderer.invoke(channel, payload);
  }
  for (const eventName of eventNames) {
    bridge[eventName] = (listener: unknown) => {
      if (typeof listener !== 'function') throw new TypeError(`${eventName} needs a listener function`);
      const forward = (_event: IpcRendererEvent, payload: unknown) => (listener as (p: unknown) => void)(payload);
      ipcRenderer.on(eventName, forward);
      return () => ipcRenderer.removeListener(eventName, forward);
    };
  }
  return Object.freeze(bridge);
}
