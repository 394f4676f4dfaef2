import type { IncomingMessage, Server, ServerResponse } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import { events } from '../../contract';
import { decodeFrame, encodeFrame, FrameError, streamedFramePrefix, type WireMessage } from '../../contract/wire';
import { fail } from '../../contract/result';
import { contentSecurityPolicy } from '../content-security-policy';
import type { Host } from '../create-host';
import type { HostLog } from '../log';
import type { BrowserAuth } from './auth';
import { serveStatic } from './static-files';

export interface BridgeOptions {
  readonly host: Host;
  readonly auth: BrowserAuth;
  readonly rendererDir: string;
  readonly origin: string;
  readonly log: HostLog;
}

const pages = new Set(['console', 'stage']);

/**
 * Browser mode's loopback bridge: serves the built renderer and carries the contract over
 * a WebSocket at /ws. Every HTTP request and upgrade must carry the launch token (query)
 * or its cookie; anything else gets 401 and a log line.
 */
export function attachBridge(server: Server, options: BridgeOptions): { close(): void } {
  const { host, auth, log, origin } = options;
  const wsOrigin = origin.replace(/^http/, 'ws');
  const csp = contentSecurityPolicy([wsOrigin]);
  const sockets = new WebSocketServer({ noServer: true, maxPayload: 64 * 1024 * 1024 });

  const refuse = (request: IncomingMessage, reason: string): void =>
    log.warn('bridge.refused', { reason, method: request.method, path: (request.url ?? '').split('?')[0], remote: request.socket.remoteAddress });

  server.on('request', (request: IncomingMessage, response: ServerResponse) => {
    void (async () => {
      const proof = auth.check(request);
      if (!proof) {
        refuse(request, 'missing or wrong token');
        response.writeHead(401, { 'Content-Type': 'text/plain; charset=utf-8' }).end('401: open the URL that Gazeloom printed at start (it carries the token)\n');
        return;
      }
      if (request.method !== 'GET' && request.method !== 'HEAD') {
        response.writeHead(405, { Allow: 'GET, HEAD' }).end();
        return;
      }
      const url = new URL(request.url ?? '/', origin);
      const path = url.pathname;
      if (path === '/bulk') return openBulkStream(url.searchParams.get('connection') ?? '', request, response);
      if (path === '/') {
        response.writeHead(302, { Location: '/console/', ...(proof === 'query' ? { 'Set-Cookie': auth.setCookieHeader() } : {}) }).end();
        return;
      }
      const headers: Record<string, string> = {
        'Content-Security-Policy': csp,
        'Referrer-Policy': 'no-referrer',
        'Cross-Origin-Opener-Policy': 'same-origin',
      };
      if (proof === 'query') headers['Set-Cookie'] = auth.setCookieHeader();
      const served = await serveStatic(options.rendererDir, path, response, headers);
      if (!served) response.writeHead(404, { 'Content-Type': 'text/plain; charset=utf-8' }).end(`404: ${path}\n`);
    })().catch((error: Error) => {
      log.error('bridge.request_failed', { message: error.message });
      if (!response.headersSent) response.writeHead(500).end();
    });
  });

  server.on('upgrade', (request: IncomingMessage, socket: Duplex, head: Buffer) => {
    const url = new URL(request.url ?? '/', origin);
    const page = url.searchParams.get('page') ?? '';
    const deny = (status: number, reason: string): void => {
      refuse(request, reason);
      socket.end(`HTTP/1.1 ${status} ${status === 401 ? 'Unauthorized' : 'Bad Request'}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
    };
    if (url.pathname !== '/ws') return deny(400, 'upgrade to an unknown path');
    if (!auth.check(request)) return deny(401, 'websocket without token');
    const requestOrigin = request.headers.origin;
    if (requestOrigin !== undefined && requestOrigin !== origin) return deny(401, `websocket from foreign origin ${requestOrigin}`);
    if (!pages.has(page)) return deny(400, `websocket for unknown page "${page}"`);
    sockets.handleUpgrade(request, socket, head, (ws) => serveConnection(ws, page as 'console' | 'stage'));
  });

  /** Open bulk streams by connection id: bulk events for that page go here instead of its WebSocket. */
  const bulkStreams = new Map<string, ServerResponse | null>();

  function openBulkStream(connectionId: string, request: IncomingMessage, response: ServerResponse): void {
    if (!bulkStreams.has(connectionId) || bulkStreams.get(connectionId) !== null) {
      refuse(request, `bulk stream for unknown or already streaming connection "${connectionId}"`);
      response.writeHead(409, { 'Content-Type': 'text/plain; charset=utf-8' }).end('409: no such connection, or it already has a bulk stream\n');
      return;
    }
    response.writeHead(200, { 'Content-Type': 'application/octet-stream', 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' });
    response.flushHeaders();
    bulkStreams.set(connectionId, response);
    response.on('close', () => {
      if (bulkStreams.get(connectionId) === response) bulkStreams.set(connectionId, null);
    });
  }

  function serveConnection(ws: WebSocket, page: 'console' | 'stage'): void {
    const send = (message: WireMessage): void => {
      if (ws.readyState === ws.OPEN) ws.send(encodeFrame(message));
    };
    const isBulk = (name: string) => (events as Record<string, { bulk?: boolean }>)[name]?.bulk === true;
    const connection = host.attach(page, (name, payload) => {
      const stream = bulkStreams.get(connection.id);
      if (stream && isBulk(name)) {
        const frame = encodeFrame({ kind: 'event', name, payload });
        stream.write(streamedFramePrefix(frame.byteLength));
        stream.write(frame);
      } else send({ kind: 'event', name, payload });
    });
    bulkStreams.set(connection.id, null);
    send({ kind: 'welcome', connectionId: connection.id });
    ws.on('message', (data, isBinary) => {
      let message: WireMessage;
      try {
        if (!isBinary) throw new FrameError('text frames are not part of the protocol; send binary frames');
        const bytes = Array.isArray(data) ? Buffer.concat(data) : Buffer.isBuffer(data) ? data : Buffer.from(data);
        message = decodeFrame(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength));
      } catch (error) {
        log.warn('bridge.malformed_frame', { connection: connection.id, message: (error as Error).message });
        send({ kind: 'rejected', failure: fail('invalid_request', `malformed frame: ${(error as Error).message}`) });
        return;
      }
      if (message.kind !== 'request') {
        log.warn('bridge.unexpected_message', { connection: connection.id, kind: message.kind });
        send({ kind: 'rejected', failure: fail('invalid_request', `pages may only send requests, not "${message.kind}"`) });
        return;
      }
      const { id } = message;
      void connection.dispatch(message.channel, message.payload).then((result) => send({ kind: 'response', id, result }));
    });
    ws.on('close', () => {
      bulkStreams.get(connection.id)?.end();
      bulkStreams.delete(connection.id);
      connection.detach();
    });
    ws.on('error', (error) => log.warn('bridge.socket_error', { connection: connection.id, message: error.message }));
  }

  return {
    close() {
      for (const client of sockets.clients) client.terminate();
      sockets.close();
    },
  };
}
