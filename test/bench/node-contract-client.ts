import WebSocket from 'ws';
import { contract, type GazeloomApi } from '../../app/contract';
import { createContractClient, type ContractTransport } from '../../app/contract/client';
import { decodeFrame, encodeFrame } from '../../app/contract/wire';

export function openSocket(url: string): Promise<WebSocket> {
  return new Promise((resolve, reject) => {
    const ws = new WebSocket(url);
    ws.once('open', () => resolve(ws));
    ws.once('error', reject);
  });
}

/** Request/response over a `ws` socket, framed as the renderer frames it. */
export function nodeTransport(ws: WebSocket): ContractTransport {
  const pending = new Map<number, (result: unknown) => void>();
  let nextId = 1;
  ws.on('message', (data: Buffer) => {
    const message = decodeFrame(new Uint8Array(data.buffer, data.byteOffset, data.byteLength));
    if (message.kind === 'response') {
      pending.get(message.id)?.(message.result);
      pending.delete(message.id);
    }
  });
  return {
    request: (channel, payload) =>
      new Promise((resolve) => {
        const id = nextId++;
        pending.set(id, resolve);
        ws.send(encodeFrame({ kind: 'request', id, channel, payload }));
      }),
    subscribe: () => () => undefined,
  };
}

/** A console-side contract client from Node, as benchmarks drive the host. */
export async function connectConsole(origin: string, token: string): Promise<{ api: GazeloomApi; close(): void }> {
  const ws = await openSocket(`${origin.replace('http', 'ws')}/ws?page=console&token=${token}`);
  return { api: createContractClient(contract, nodeTransport(ws)), close: () => ws.close() };
}
