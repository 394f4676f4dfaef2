// `npm start`: the desktop app when a working Electron binary is installed, otherwise
// browser mode (the same host in Node, serving the console on 127.0.0.1).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const args = process.argv.slice(2);
const forceBrowser = args.includes('--browser');
const rest = args.filter((arg) => arg !== '--browser');

if (!existsSync(`${root}/dist/host/browser-mode.mjs`) || !existsSync(`${root}/dist/renderer/console/index.html`)) {
  const built = spawnSync(process.execPath, [`${root}/scripts/build.mjs`], { stdio: 'inherit' });
  if (built.status !== 0) process.exit(built.status ?? 1);
}

/** The Electron binary's path if the package is installed and the binary actually runs. */
function workingElectron() {
  let binary;
  try {
    binary = createRequire(import.meta.url)('electron');
  } catch {
    return null; // package absent: npm skipped the optional dependency
  }
  if (typeof binary !== 'string' || !existsSync(binary)) return null;
  const probe = spawnSync(binary, ['--version'], { env: { ...process.env, ELECTRON_RUN_AS_NODE: '1' }, timeout: 15000, encoding: 'utf8' });
  return probe.status === 0 ? binary : null;
}

const electron = forceBrowser ? null : workingElectron();
if (electron) {
  const child = spawn(electron, [root, ...rest], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
} else {
  if (!forceBrowser) process.stdout.write('Electron is not installed on this machine; starting browser mode instead.\n');
  process.argv = [process.argv[0], `${root}/dist/host/browser-mode.mjs`, ...rest];
  await import(`${root}/dist/host/browser-mode.mjs`);
}
