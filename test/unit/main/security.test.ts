import { EventEmitter } from 'node:events';
import { describe, expect, it, vi } from 'vitest';
import { contentSecurityPolicy } from '../../../app/host/content-security-policy';
import { rendererProtocolHandler } from '../../../app/main/renderer-protocol';
import { guardSession, guardWebContents, isTrustedFrame, pageUrl, webPreferencesFor } from '../../../app/main/security';
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

// The settings follow the Electron project's security checklist
// (https://www.electronjs.org/docs/latest/tutorial/security), checked one by one.
const silentLog = () => ({ info: vi.fn(), warn: vi.fn(), error: vi.fn() });

describe('web preferences', () => {
  for (const page of ['console', 'stage'] as const) {
    it(`isolate and sandbox the ${page} with no Node integration`, () => {
      const prefs = webPreferencesFor(page, '/app/dist/preload/preload.cjs');
      expect(prefs.contextIsolation).toBe(true);
      expect(prefs.sandbox).toBe(true);
      expect(prefs.nodeIntegration).toBe(false);
      expect(prefs.nodeIntegrationInWorker).toBe(false);
      expect(prefs.nodeIntegrationInSubFrames).toBe(false);
      expect(prefs.webSecurity).toBe(true);
      expect(prefs.allowRunningInsecureContent).toBe(false);
      expect(prefs.experimentalFeatures).toBe(false);
      expect(prefs.webviewTag).toBe(false);
      expect(prefs.preload).toBe('/app/dist/preload/preload.cjs');
    });
  }

  it('keep the stage drawing at full rate in the background, and only the stage', () => {
    expect(webPreferencesFor('stage', 'p').backgroundThrottling).toBe(false);
    expect(webPreferencesFor('console', 'p').backgroundThrottling).toBe(true);
  });
});

describe('content security policy', () => {
  const csp = contentSecurityPolicy();
  const directive = (name: string) => csp.split('; ').find((d) => d.startsWith(`${name} `));

  it("allows only the app's own files", () => {
    expect(directive('default-src')).toBe("default-src 'self'");
    expect(directive('script-src')).toBe("script-src 'self'");
    expect(directive('style-src')).toBe("style-src 'self'");
    expect(directive('object-src')).toBe("object-src 'none'");
    expect(directive('frame-ancestors')).toBe("frame-ancestors 'none'");
    expect(csp).not.toMatch(/unsafe-inline|unsafe-eval|\*/);
  });

  it('is attached to every file the app:// protocol serves, and the path guard holds', async () => {
    const root = mkdtempSync(join(tmpdir(), 'gz-protocol-'));
    mkdirSync(join(root, 'console'));
    writeFileSync(join(root, 'console', 'index.html'), '<!doctype html>');
    writeFileSync(join(tmpdir(), 'gz-outside.txt'), 'secret');
    const handle = rendererProtocolHandler(root);
    const page = await handle(new Request(pageUrl('console')));
    expect(page.status).toBe(200);
    expect(page.headers.get('content-security-policy')).toBe(csp);
    expect((await handle(new Request('app://gazeloom/../gz-outside.txt'))).status).toBe(404);
    expect((await handle(new Request('app://gazeloom/console/%2e%2e/%2e%2e/gz-outside.txt'))).status).toBe(404);
    expect((await handle(new Request('app://elsewhere/console/index.html'))).status).toBe(404);
  });
});

describe('session guards', () => {
  it('deny every permission request and check, and log requests', () => {
    const handlers: Record<string, (...args: never[]) => unknown> = {};
    const session = {
      setPermissionRequestHandler: (h: never) => (handlers.request = h),
      setPermissionCheckHandler: (h: never) => (handlers.check = h),
      setDevicePermissionHandler: (h: never) => (handlers.device = h),
    };
    const log = silentLog();
    guardSession(session as never, log);
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read', 'fullscreen', 'hid']) {
      const callback = vi.fn();
      (handlers.request as (...a: unknown[]) => void)({}, permission, callback);
      expect(callback).toHaveBeenCalledWith(false);
    }
    expect((handlers.check as (...a: unknown[]) => boolean)({}, 'media')).toBe(false);
    expect((handlers.device as (...a: unknown[]) => boolean)({})).toBe(false);
    expect(log.warn).toHaveBeenCalledWith('security.permission_denied', { permission: 'media' });
  });
});

describe('web contents guards', () => {
  function guarded() {
    const contents = Object.assign(new EventEmitter(), { setWindowOpenHandler: vi.fn() });
    const log = silentLog();
    guardWebContents(contents as never, log);
    return { contents, log };
  }

  it.each(['will-navigate', 'will-redirect'])('block %s to any address', (eventName) => {
    const { contents, log } = guarded();
    const event = { preventDefault: vi.fn() };
    contents.emit(eventName, event, 'https://example.org/');
    expect(event.preventDefault).toHaveBeenCalled();
    expect(log.warn).toHaveBeenCalledWith('security.navigation_blocked', { kind: eventName, url: 'https://example.org/' });
  });

  it('block webviews and deny new windows', () => {
    const { contents } = guarded();
    const event = { preventDefault: vi.fn() };
    contents.emit('will-attach-webview', event);
    expect(event.preventDefault).toHaveBeenCalled();
    const openHandler = contents.setWindowOpenHandler.mock.calls[0]![0] as (d: { url: string }) => unknown;
    expect(openHandler({ url: 'https://example.org/' })).toEqual({ action: 'deny' });
  });
});

describe('IPC sender check', () => {
  it.each([
    ['app://gazeloom/console/index.html', true],
    ['app://gazeloom/stage/index.html', true],
    ['app://gazeloom.evil/console/index.html', false],
    ['file:///etc/passwd', false],
    ['https://gazeloom/console', false],
    ['not a url', false],
  ])('treats a frame at %s as trusted: %s', (url, trusted) => {
    expect(isTrustedFrame({ url })).toBe(trusted);
  });

  it('treats a missing frame as untrusted', () => {
    expect(isTrustedFrame(null)).toBe(false);
    expect(isTrustedFrame(undefined)).toBe(false);
  });
});
