import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { createSocket } from 'node:dgram';
import { promisify } from 'node:util';

const run = promisify(execFile);

/** Runs the built `gazeloom` command and returns its parsed --json output. */
export async function gazeloomJson(...args: string[]): Promise<Record<string, unknown>> {
  const { stdout } = await run(process.execPath, ['bin/gazeloom.mjs', ...args, '--json'], { maxBuffer: 64 << 20 });
  return JSON.parse(stdout) as Record<string, unknown>;
}

/** Starts a long-running `gazeloom` command (e.g. the simulated tracker process). */
export function gazeloomProcess(...args: string[]): ChildProcess {
  return spawn(process.execPath, ['bin/gazeloom.mjs', ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
}

/** A UDP port nobody is using right now on 127.0.0.1. */
export async function freeUdpPort(): Promise<number> {
  const socket = createSocket('udp4');
  await new Promise<void>((resolve) => socket.bind(0, '127.0.0.1', resolve));
  const { port } = socket.address();
  await new Promise<void>((resolve) => socket.close(() => resolve()));
  return port;
}
