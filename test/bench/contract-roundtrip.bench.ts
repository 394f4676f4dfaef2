import { mkdtempSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { WebSocketServer } from 'ws';
import { contract } from '../../app/contract';
import { createContractClient } from '../../app/contract/client';
import { encodeFrame } from '../../app/contract/wire';
import { startBrowserMode } from '../../app/host/browser-mode/start';
import { createHostLog } from '../../app/host/log';
import { createMonotonicClock } from '../../app/host/monotonic-clock';
import { opsPerSecond, rate, type Benchmark } from './harness';
import { nodeTransport, openSocket as open } from './node-contract-client';

export const benchmark: Benchmark = {
  name: 'contract round trips over the browser-mode WebSocket',
  async run(log) {
    const seconds = 3;
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-bench-'));
    const mode = await startBrowserMode({
      port: 0,
      dataDir,
      rendererDir: dataDir,
      clock: createMonotonicClock(),
      log: createHostLog({ file: null, echo: false }),
    });
    const ws = await open(`${mode.origin.replace('http', 'ws')}/ws?page=console&token=${mode.token}`);
    const api = createContractClient(contract, nodeTransport(ws));
    const ours = await opsPerSecond(seconds, async () => {
      const result = await api.ping({ clientSentMs: 1 });
      if (!result.ok) throw new Error(result.message);
    });
    ws.close();
    await mode.close();
    log(`contract ping: ${ours.toFixed(0)} round trips/s`);

    // Peer: the same socket library echoing the same bytes, with no contract at all.
    const echo = new WebSocketServer({ port: 0, host: '127.0.0.1' });
    echo.on('connection', (socket) => socket.on('message', (data) => socket.send(data)));
    await new Promise((resolve) => echo.once('listening', resolve));
    const raw = await open(`ws://127.0.0.1:${(echo.address() as AddressInfo).port}`);
    const frame = encodeFrame({ kind: 'request', id: 1, channel: 'ping', payload: { clientSentMs: 1 } });
    const peer = await opsPerSecond(seconds, () => new Promise<void>((resolve) => {
      raw.once('message', () => resolve());
      raw.send(frame);
    }));
    raw.close();
    echo.close();
    log(`raw echo: ${peer.toFixed(0)} round trips/s`);
    return [rate('contract round trips (ping, WebSocket)', ours, 'round trips/s', { name: 'raw ws echo of the same frame', value: peer })];
  },
};
