import { BrowserWindow, type Screen } from 'electron';
import { fail } from '../contract/result';
import type { Host, HostConnection } from '../host/create-host';
import type { StagePresenter } from '../host/stage-presenter';
import { describeDisplays } from './displays';
import { pageUrl, webPreferencesFor, type PageKind } from './security';

/**
 * The console and stage windows, each attached to the host as a page. The stage opens
 * fullscreen and frameless on the display the operator picks.
 */
export class WindowManager {
  private readonly connections = new Map<number, HostConnection>();
  private stage: BrowserWindow | null = null;
  private host: Host | null = null;

  constructor(
    private readonly preloadPath: string,
    private readonly screen: Pick<Screen, 'getAllDisplays' | 'getPrimaryDisplay'>,
  ) {}

  bind(host: Host): void {
    this.host = host;
  }

  connectionFor = (senderId: number): HostConnection | undefined => this.connections.get(senderId);

  openConsole(): BrowserWindow {
    const window = new BrowserWindow({ width: 1280, height: 860, title: 'Gazeloom', show: false, webPreferences: webPreferencesFor('console', this.preloadPath) });
    this.track(window, 'console');
    window.once('ready-to-show', () => window.show());
    void window.loadURL(pageUrl('console'));
    return window;
  }

  readonly stagePresenter: StagePresenter = {
    listDisplays: () => ({ displays: describeDisplays(this.screen), canChoose: true }),
    open: (displayId) => {
      const displays = describeDisplays(this.screen);
      const target = displays.find((d) => d.id === displayId) ?? displays.find((d) => d.primary);
      if (!target) return fail('not_found', `no display with id ${displayId ?? '(none)'}`);
      this.stage?.destroy();
      const { x, y, width, height } = target.bounds;
      const window = new BrowserWindow({
        x,
        y,
        width,
        height,
        frame: false,
        fullscreen: true,
        backgroundColor: '#808080',
        title: 'Gazeloom stage',
        webPreferences: webPreferencesFor('stage', this.preloadPath),
      });
      this.track(window, 'stage');
      this.stage = window;
      window.on('closed', () => {
        if (this.stage === window) this.stage = null;
      });
      void window.loadURL(pageUrl('stage'));
      return { how: 'window', displayId: target.id };
    },
  };

  private track(window: BrowserWindow, page: PageKind): void {
    const contents = window.webContents;
    const id = contents.id;
    const connection = this.host!.attach(page, (eventName, payload) => {
      if (!contents.isDestroyed()) contents.send(eventName, payload);
    });
    this.connections.set(id, connection);
    window.on('closed', () => {
      connection.detach();
      this.connections.delete(id);
    });
  }
}
