import { homedir } from 'node:os';
import { join } from 'node:path';

/**
 * The same folder Electron's app.getPath('userData') gives for the product name Gazeloom,
 * so browser mode and the desktop app share recordings and stimuli on one machine.
 * GAZELOOM_DATA_DIR overrides it (tests use a temporary folder).
 */
export function defaultDataDir(env: NodeJS.ProcessEnv = process.env, platform = process.platform): string {
  if (env.GAZELOOM_DATA_DIR) return env.GAZELOOM_DATA_DIR;
  const home = homedir();
  if (platform === 'win32') return join(env.APPDATA ?? join(home, 'AppData', 'Roaming'), 'Gazeloom');
  if (platform === 'darwin') return join(home, 'Library', 'Application Support', 'Gazeloom');
  return join(env.XDG_CONFIG_HOME ?? join(home, '.config'), 'Gazeloom');
}
