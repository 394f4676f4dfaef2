import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import WebSocket from 'ws';
import { decodeFrame, encodeFrame, type WireMessage } from '../../app/contract/wire';
import { startBrowserMode, type BrowserMode } from '../../app/host/browser-mode/start';
import { createHostLog, type LogRecord } from '../../app/host/log';
import { createMonotonicClock } from '../../app/host/monotonic-clock';

// The real host and bridge, in this process, against a tiny renderer folder.
let mode: BrowserMode;
const records: LogRecord[] = [];

beforeAll(async () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'gz-browser-'));
  const rendererDir = join(dataDir, 'renderer');
  mkdirSync(join(rendererDir, 'console'), { recursive: true });
  writeFileSync(join(rendererDir, 'console', 'index.html'), '<!doctype html><title>console</title>');
  const log = createHostLog({ file: null, echo: false, sink: (record) => records.push(record) });
  mode = await startBrowserMode({ port: 0, dataDir, rendererDir, clock: createMonotonicClock(), log });
});
afterAll(() => mode.close());

const cookieFor = (setCookie: string | null) => (setCookie ?? '').split(';')[0]!;

function connect(headers: Record<string, string>, page = 'console'): Promise<WebSocket> {
  return new Promise((resolve, reject) => {
    const ws = new WebSocket(`${mode.origin.replace('http', 'ws')}/ws?page=${page}`, { headers });
    ws.once('open', () => resolve(ws));
    ws.once('unexpected-response', (_req, res) => reject(new Error(`HTTP ${res.statusCode}`)));
    ws.once('error', reject);
  });
}

function nextMessage(ws: WebSocket, kind: WireMessage['kind']): Promise<WireMessage> {
  return new Promise((resolve) => {
    const onMessage = (data: Buffer) => {
      const message = decodeFrame(new Uint8Array(data.buffer, data.byteOffset, data.byteLength));
      if (message.kind === kind) {
        ws.off('message', onMessage);
        resolve(message);
      }
    };
    ws.on('message', onMessage);
  });
}

describe('browser mode', () => {
  it('prints a URL bound to 127.0.0.1 that carries the token', () => {
    expect(mode.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/console\/\?token=[\w-]{20,}$/);
  });

  it('answers 401 to requests without the token, and logs them', async () => {
    const response = await fetch(`${mode.origin}/console/`);
    expect(response.status).toBe(401);
    expect((await fetch(`${mode.origin}/console/?token=guess`)).status).toBe(401);
    expect(records.some((r) => r.event === 'bridge.refused' && r.fields.path === '/console/')).toBe(true);
  });

  it('turns the token into an HttpOnly, SameSite=Strict cookie that later requests may use', async () => {
    const first = await fetch(mode.url);
    expect(first.status).toBe(200);
    const setCookie = first.headers.get('set-cookie') ?? '';
    expect(setCookie).toMatch(/HttpOnly/);
    expect(setCookie).toMatch(/SameSite=Strict/);
    expect(first.headers.get('content-security-policy')).toContain("default-src 'self'");
    const later = await fetch(`${mode.origin}/console/`, { headers: { cookie: cookieFor(setCookie) } });
    expect(later.status).toBe(200);
  });

  it('refuses WebSocket upgrades without the token or from a foreign origin', async () => {
    await expect(connect({})).rejects.toThrow('HTTP 401');
    const setCookie = (await fetch(mode.url)).headers.get('set-cookie');
    await expect(connect({ cookie: cookieFor(setCookie), origin: 'http://evil.example' })).rejects.toThrow('HTTP 401');
  });

  it('carries the contract over the WebSocket, and answers malformed messages with typed errors', async () => {
    const setCookie = (await fetch(mode.url)).headers.get('set-cookie');
    const ws = await connect({ cookie: cookieFor(setCookie), origin: mode.origin });

    const info = nextMessage(ws, 'response');
    ws.send(encodeFrame({ kind: 'request', id: 1, channel: 'getAppInfo', payload: {} }));
    expect(await info).toMatchObject({ id: 1, result: { ok: true, value: { name: 'Gazeloom', mode: 'browser' } } });

    const invalid = nextMessage(ws, 'response');
    ws.send(encodeFrame({ kind: 'request', id: 2, channel: 'ping', payload: { clientSentMs: 'now' } }));
    expect(await invalid).toMatchObject({ id: 2, result: { ok: false, code: 'invalid_request', path: 'request.clientSentMs' } });

    const garbage = nextMessage(ws, 'rejected');
    ws.send(Buffer.from([1, 2, 3, 4, 5, 6]));
    expect(await garbage).toMatchObject({ failure: { ok: false, code: 'invalid_request' } });

    const text = nextMessage(ws, 'rejected');
    ws.send('{"kind":"request"}');
    expect(await text).toMatchObject({ failure: { message: expect.stringContaining('text frames') } });

    // The host is still serving after all of that.
    const ping = nextMessage(ws, 'response');
    ws.send(encodeFrame({ kind: 'request', id: 3, channel: 'ping', payload: { clientSentMs: 5 } }));
    const pong = (await ping) as { result: { ok: true; value: { hostReceivedNs: number; hostSentNs: number } } };
    expect(pong.result.value.hostSentNs).toBeGreaterThanOrEqual(pong.result.value.hostReceivedNs);
    expect(records.some((r) => r.event === 'bridge.malformed_frame')).toBe(true);
    ws.close();
  });

  it('tells the console when a stage connects and when it goes away', async () => {
    const setCookie = (await fetch(mode.url)).headers.get('set-cookie');
    const headers = { cookie: cookieFor(setCookie), origin: mode.origin };
    const consoleWs = await connect(headers, 'console');
    const stageWs = await connect(headers, 'stage');
    const connected = nextMessage(consoleWs, 'event');
    stageWs.send(encodeFrame({ kind: 'request', id: 1, channel: 'reportStageStatus', payload: { visible: false, width: 800, height: 600, devicePixelRatio: 1, renderer: 'webgl2' } }));
    expect(await connected).toMatchObject({ name: 'onStageStatus', payload: { connected: true, visible: false } });
    expect(records.some((r) => r.event === 'stage.hidden')).toBe(true);
    const gone = nextMessage(consoleWs, 'event');
    stageWs.close();
    expect(await gone).toMatchObject({ name: 'onStageStatus', payload: { connected: false } });
    consoleWs.close();
  });
});
