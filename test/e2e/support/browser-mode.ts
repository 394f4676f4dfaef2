import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { test as base } from '@playwright/test';

export interface RunningHost {
  readonly url: string;
  readonly origin: string;
  readonly dataDir: string;
  readonly child: ChildProcess;
  readonly output: () => string;
}

/** Starts the built browser mode on a free port with a fresh data folder, as a user would. */
export async function startHost(extraArgs: readonly string[] = [], dataDir = mkdtempSync(join(tmpdir(), 'gazeloom-e2e-'))): Promise<RunningHost> {
  const child = spawn(process.execPath, ['dist/host/browser-mode.mjs', '--port', '0', '--data-dir', dataDir, '--no-open', '--no-demo', ...extraArgs], {
    env: { ...process.env, BROWSER: 'none' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk) => (output += chunk));
  child.stderr!.on('data', (chunk) => (output += chunk));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`browser mode printed no URL within 20 s:\n${output}`)), 20_000);
    const look = (): void => {
      const match = /browser mode at (http:\/\/127\.0\.0\.1:\d+\/console\/\?token=[\w-]+)/.exec(output);
      if (match) {
        clearTimeout(timer);
        resolve(match[1]!);
      }
    };
    child.stdout!.on('data', look);
    child.on('exit', (code) => reject(new Error(`browser mode exited with ${code}:\n${output}`)));
  });
  return { url, origin: new URL(url).origin, dataDir, child, output: () => output };
}

/** Stops the host (SIGTERM: a clean shutdown; SIGKILL: a crash) and, unless kept, removes its data folder. */
export async function stopHost(host: RunningHost, { signal = 'SIGTERM', keepData = false }: { signal?: NodeJS.Signals; keepData?: boolean } = {}): Promise<void> {
  if (host.child.exitCode === null && host.child.signalCode === null) {
    const exited = new Promise((resolve) => host.child.once('exit', resolve));
    host.child.kill(signal);
    await exited;
  }
  if (!keepData) rmSync(host.dataDir, { recursive: true, force: true });
}

/** A Playwright test with a fresh browser-mode host per test. */
export const test = base.extend<{ host: RunningHost }>({
  host: async ({}, use) => {
    const host = await startHost();
    await use(host);
    await stopHost(host);
  },
});

export { expect } from '@playwright/test';
