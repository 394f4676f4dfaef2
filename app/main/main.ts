import { app, ipcMain, protocol, screen, session } from 'electron';
import { join } from 'node:path';
import { channels } from '../contract';
import { createHost, hostLogFile } from '../host/create-host';
import { createHostLog } from '../host/log';
import { createMonotonicClock } from '../host/monotonic-clock';
import { registerContractIpc } from './ipc';
import { rendererProtocolHandler } from './renderer-protocol';
import { guardSession, guardWebContents } from './security';
import { WindowManager } from './windows';

// The composition root of the desktop app: security first, then the host, then windows.
protocol.registerSchemesAsPrivileged([{ scheme: 'app', privileges: { standard: true, secure: true, supportFetchAPI: true } }]);

app.on('web-contents-created', (_event, contents) => guardWebContents(contents, log));
const dataDir = process.env.GAZELOOM_DATA_DIR ?? app.getPath('userData');
const log = createHostLog({ file: hostLogFile(dataDir), echo: true });

void app.whenReady().then(() => {
  guardSession(session.defaultSession, log);
  protocol.handle('app', rendererProtocolHandler(join(__dirname, '..', 'renderer')));
  const windows = new WindowManager(join(__dirname, '..', 'preload', 'preload.cjs'), screen);
  const noDemo = process.env.GAZELOOM_NO_DEMO === '1' || process.argv.includes('--no-demo');
  const host = createHost({ mode: 'electron', dataDir, clock: createMonotonicClock(), log, stage: windows.stagePresenter, noDemo });
  windows.bind(host);
  registerContractIpc(ipcMain, Object.keys(channels), windows.connectionFor, log);
  windows.openConsole();
  void host.startFirstRun();
});

app.on('window-all-closed', () => app.quit());
