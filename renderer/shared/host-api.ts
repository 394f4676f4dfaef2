import { contract, type GazeloomApi } from '../../app/contract';
import { createContractClient, type ContractTransport } from '../../app/contract/client';
import { createWebSocketTransport, type ConnectionState } from './ws-transport';

/** What app/preload puts on `window` in Electron: one function per channel and per event. */
type PreloadBridge = Record<string, (arg: unknown) => unknown>;

declare global {
  interface Window {
    gazeloomBridge?: PreloadBridge;
  }
}

function preloadTransport(bridge: PreloadBridge): ContractTransport {
  return {
    request: async (channel, payload) => bridge[channel]!(payload),
    subscribe: (eventName, listener) => bridge[eventName]!(listener) as () => void,
  };
}

/**
 * The page's connection to the host: Electron's preload bridge when present, otherwise the
 * browser-mode WebSocket. Either way the page talks through the same validated contract.
 */
export function connectToHost(
  page: 'console' | 'stage',
  onState?: (state: ConnectionState, detail: string) => void,
): GazeloomApi {
  const transport = window.gazeloomBridge
    ? preloadTransport(window.gazeloomBridge)
    : createWebSocketTransport(page, onState);
  if (window.gazeloomBridge) onState?.('open', 'electron');
  return createContractClient(contract, transport, {
    onInvalidEvent: (name, message) => console.error(`Gazeloom: dropped invalid ${name} event: ${message}`),
  });
}
