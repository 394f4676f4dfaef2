import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { createMonotonicClock } from '../monotonic-clock';
import { defaultDataDir } from '../data-dir';
import { createHostLog } from '../log';
import { hostLogFile } from '../create-host';
import { openInChromium } from './open-browser';
import { startBrowserMode } from './start';

/**
 * `npm run start:browser`: the host in a plain Node process. Prints the console's URL as
 * soon as it listens; first-run work continues in the background with progress shown in
 * the console.
 */
export async function main(argv: readonly string[]): Promise<void> {
  const { values } = parseArgs({
    args: [...argv],
    options: {
      port: { type: 'string', default: process.env.GAZELOOM_PORT ?? '0' },
      'data-dir': { type: 'string' },
      'renderer-dir': { type: 'string' },
      'no-demo': { type: 'boolean', default: process.env.GAZELOOM_NO_DEMO === '1' },
      'no-open': { type: 'boolean', default: false },
    },
    strict: true,
  });
  const port = Number(values.port);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`--port must be an integer from 0 to 65535, got "${values.port}"`);
  const dataDir = values['data-dir'] ?? defaultDataDir();
  const rendererDir = values['renderer-dir'] ?? fileURLToPath(new URL('../renderer', import.meta.url));
  const log = createHostLog({ file: hostLogFile(dataDir), echo: true });
  const mode = await startBrowserMode({ port, dataDir, rendererDir, clock: createMonotonicClock(), log, noDemo: values['no-demo'] });
  process.stdout.write(`Gazeloom is running in browser mode at ${mode.url}\n`);
  if (!values['no-open']) process.stdout.write(`(${openInChromium(mode.url)})\n`);
  void mode.host.startFirstRun();
  const stop = (): void => {
    void mode.close().then(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main(process.argv.slice(2)).catch((error: Error) => {
  process.stderr.write(`gazeloom: ${error.message}\n`);
  process.exit(2);
});
