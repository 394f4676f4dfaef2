import type { Event, Session, WebContents, WebPreferences } from 'electron';
import type { HostLog } from '../host/log';

/** The app's own pages are served from this origin by the app:// protocol (see renderer-protocol.ts). */
export const appOrigin = 'app://gazeloom';

export type PageKind = 'console' | 'stage';

export const pageUrl = (page: PageKind): string => `${appOrigin}/${page}/index.html`;

/**
 * Web preferences for every window, per the Electron security checklist: isolated,
 * sandboxed, no Node in web content, web security on. The stage must keep drawing at full
 * rate even when another window has focus, so only it turns background throttling off.
 */
export function webPreferencesFor(page: PageKind, preloadPath: string): WebPreferences {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    experimentalFeatures: false,
    webviewTag: false,
    navigateOnDragDrop: false,
    spellcheck: false,
    backgroundThrottling: page !== 'stage',
  };
}

/** True only for frames showing the app's own pages; IPC from anything else is refused. */
export function isTrustedFrame(frame: { url: string } | null | undefined): boolean {
  if (!frame) return false;
  try {
    const url = new URL(frame.url);
    return `${url.protocol}//${url.host}` === appOrigin;
  } catch {
    return false;
  }
}

type SessionGuardTarget = Pick<Session, 'setPermissionRequestHandler' | 'setPermissionCheckHandler' | 'setDevicePermissionHandler'>;

/** Every permission (camera, notifications, USB, ...) is denied, and each request is logged. */
export function guardSession(target: SessionGuardTarget, log: HostLog): void {
  target.setPermissionRequestHandler((_contents, permission, callback) => {
    log.warn('security.permission_denied', { permission });
    callback(false);
  });
  target.setPermissionCheckHandler(() => false);
  target.setDevicePermissionHandler(() => false);
}

type ContentsGuardTarget = Pick<WebContents, 'on' | 'setWindowOpenHandler'>;

/** No page may navigate away, open windows or attach webviews; each attempt is logged. */
export function guardWebContents(contents: ContentsGuardTarget, log: HostLog): void {
  const block = (kind: string) => (event: Event, url: string) => {
    event.preventDefault();
    log.warn('security.navigation_blocked', { kind, url });
  };
  contents.on('will-navigate', block('will-navigate'));
  contents.on('will-redirect', block('will-redirect'));
  contents.on('will-attach-webview', (event) => {
    event.preventDefault();
    log.warn('security.webview_blocked', {});
  });
  contents.setWindowOpenHandler(({ url }) => {
    log.warn('security.window_open_denied', { url });
    return { action: 'deny' };
  });
}
