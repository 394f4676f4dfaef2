import type { ContractTransport } from '../../app/contract/client';
import { fail } from '../../app/contract/result';
import { decodeFrame, encodeFrame, StreamedFrameReader, type WireMessage } from '../../app/contract/wire';

export type ConnectionState = 'connecting' | 'open' | 'closed';

interface Pending {
  resolve(result: unknown): void;
}

/**
 * The contract over the browser-mode WebSocket. The page's HttpOnly cookie authenticates
 * the upgrade. When the socket drops, waiting requests fail with `transport_closed` and the
 * transport reconnects on its own, so a restarted host is picked up without a reload.
 */
export function createWebSocketTransport(
  page: 'console' | 'stage',
  onState: (state: ConnectionState, detail: string) => void = () => undefined,
): ContractTransport {
  const url = `${location.protocol === 'https:' ? 'wss' : 'ws'}://${location.host}/ws?page=${page}`;
  const pending = new Map<number, Pending>();
  const listeners = new Map<string, Set<(payload: unknown) => void>>();
  const queue: Uint8Array[] = [];
  let nextId = 1;
  let socket: WebSocket;
  let retryMs = 250;

  const connect = (): void => {
    onState('connecting', url);
    socket = new WebSocket(url);
    socket.binaryType = 'arraybuffer';
    socket.onopen = () => {
      retryMs = 250;
      onState('open', url);
      for (const frame of queue.splice(0)) socket.send(frame);
    };
    socket.onmessage = (event: MessageEvent<ArrayBuffer>) => receive(decodeFrame(new Uint8Array(event.data)));
    socket.onclose = () => {
      for (const [id, waiter] of pending) {
        pending.delete(id);
        waiter.resolve(fail('transport_closed', 'the connection to the Gazeloom host closed'));
      }
      onState('closed', `reconnecting in ${retryMs} ms`);
      setTimeout(connect, retryMs);
      retryMs = Math.min(retryMs * 2, 5000);
    };
  };

  const receive = (message: WireMessage): void => {
    if (message.kind === 'response') {
      pending.get(message.id)?.resolve(message.result);
      pending.delete(message.id);
    } else if (message.kind === 'event') {
      for (const listener of listeners.get(message.name) ?? []) listener(message.payload);
    } else if (message.kind === 'rejected') {
      console.error(`Gazeloom host rejected a frame: ${message.failure.message}`);
    } else if (message.kind === 'welcome' && page === 'stage') {
      void openBulkStream(message.connectionId);
    }
  };

  // The stage's bulk events (a clip's events) arrive on a streamed HTTP response, which
  // Chromium takes in several times faster than WebSocket messages.
  const openBulkStream = async (connectionId: string): Promise<void> => {
    try {
      const response = await fetch(`/bulk?connection=${encodeURIComponent(connectionId)}`, { cache: 'no-store' });
      if (!response.ok || !response.body) throw new Error(`HTTP ${response.status}`);
      const reader = response.body.getReader();
      const frames = new StreamedFrameReader();
      for (;;) {
        const { value, done } = await reader.read();
        if (done) return;
        for (const message of frames.push(value)) receive(message);
      }
    } catch (error) {
      console.error(`Gazeloom bulk stream stopped: ${(error as Error).message}; bulk events fall back to the WebSocket`);
    }
  };

  connect();
  return {
    request(channel, payload) {
      const id = nextId++;
      const frame = encodeFrame({ kind: 'request', id, channel, payload });
      return new Promise((resolve) => {
        pending.set(id, { resolve });
        if (socket.readyState === WebSocket.OPEN) socket.send(frame);
        else queue.push(frame);
      });
    },
    subscribe(eventName, listener) {
      const set = listeners.get(eventName) ?? new Set();
      set.add(listener);
      listeners.set(eventName, set);
      return () => set.delete(listener);
    },
  };
}
