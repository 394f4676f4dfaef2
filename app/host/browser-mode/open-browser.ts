import { spawn } from 'node:child_process';
import { accessSync, constants } from 'node:fs';
import { delimiter, join } from 'node:path';

const candidates = ['chromium', 'chromium-browser', 'google-chrome', 'google-chrome-stable'];

export function findChromium(pathEnv = process.env.PATH ?? ''): string | null {
  for (const dir of pathEnv.split(delimiter)) {
    for (const name of candidates) {
      const file = join(dir, name);
      try {
        accessSync(file, constants.X_OK);
        return file;
      } catch {
        // not here
      }
    }
  }
  return null;
}

/**
 * Opens the console in a local Chromium, as web dev servers do; BROWSER=none turns it off.
 * Returns what happened so the caller can say it in one line.
 */
export function openInChromium(url: string, env = process.env): string {
  if (env.BROWSER === 'none') return 'BROWSER=none: open the URL yourself';
  const chromium = findChromium(env.PATH);
  if (!chromium) return 'no local Chromium found: open the URL in a Chromium-based browser';
  const child = spawn(chromium, ['--new-window', url], { detached: true, stdio: 'ignore' });
  child.on('error', () => undefined);
  child.unref();
  return `opening it in ${chromium}`;
}
