import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { HostClock } from '../../core/clock/host-clock';
import { createHost, type Host } from '../create-host';
import type { FirstRunJob } from '../first-run';
import type { HostLog } from '../log';
import { browserStagePresenter } from '../stage-presenter';
import { createBrowserAuth } from './auth';
import { attachBridge } from './bridge';

export interface BrowserModeOptions {
  readonly port: number;
  readonly dataDir: string;
  readonly rendererDir: string;
  readonly clock: HostClock;
  readonly log: HostLog;
  readonly firstRunJobs?: readonly FirstRunJob[];
  readonly noDemo?: boolean;
  /** Fixed token for tests that need to know it in advance; random otherwise. */
  readonly token?: string;
}

export interface BrowserMode {
  readonly url: string;
  readonly origin: string;
  readonly token: string;
  readonly host: Host;
  close(): Promise<void>;
}

/** Runs the real host in this Node process and serves the renderer to a browser on 127.0.0.1. */
export async function startBrowserMode(options: BrowserModeOptions): Promise<BrowserMode> {
  const server = createServer();
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  const origin = `http://127.0.0.1:${port}`;
  const auth = createBrowserAuth(port, options.token);
  let host: Host;
  try {
    host = createHost({
      mode: 'browser',
      dataDir: options.dataDir,
      clock: options.clock,
      log: options.log,
      stage: browserStagePresenter(() => `${origin}/stage/`),
      firstRunJobs: options.firstRunJobs,
      noDemo: options.noDemo,
    });
  } catch (error) {
    server.close();
    throw error;
  }
  const bridge = attachBridge(server, { host, auth, rendererDir: options.rendererDir, origin, log: options.log });
  return {
    url: `${origin}/console/?token=${auth.token}`,
    origin,
    token: auth.token,
    host,
    close: () =>
      new Promise<void>((resolve) => {
        bridge.close();
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
