import type { IncomingMessage } from 'node:http';
import { WebSocketServer, type WebSocket } from 'ws';
import type { HostClock } from '../../../core/clock/host-clock';
import { encodeControl } from '../../../core/gaze/feed';
import type { HostLog } from '../../log';
import { FeedPeer } from './feed-peer';
import type { FeedListener } from './feed-listener';
import { formatFeedUrl, type FeedAddress } from './feed-url';

/** Larger than any batch of lines a bridge sends in one frame. */
const MAX_FRAME_BYTES = 1024 * 1024;

/**
 * Web pages always send an Origin header and could otherwise feed gaze into a listener on
 * localhost. Bridges send none, or (some client libraries) the listener's own address.
 */
function fromBridge(request: IncomingMessage): boolean {
  const origin = request.headers.origin;
  if (origin === undefined) return true;
  const host = request.headers.host;
  return host !== undefined && (origin === `http://${host}` || origin === `https://${host}`);
}

/**
 * The feed over WebSocket: text frames of one or more whole lines. Control messages go
 * back to every connected peer, one NDJSON line per text frame.
 */
export function createWsFeedListener(requested: FeedAddress, options: { clock: HostClock; log: HostLog }): FeedListener {
  const { clock, log } = options;
  let server: WebSocketServer | null = null;
  let bound: FeedAddress | null = null;
  const clients = new Set<WebSocket>();

  return {
    kind: 'feed-ws',
    get description() {
      return `WebSocket feed on ${formatFeedUrl(bound ?? requested).slice('ws://'.length)}`;
    },
    get address() {
      return bound;
    },
    receiveBufferBytes: null,
    async start(sink) {
      if (server) throw new Error('the WebSocket feed listener is already started');
      const s = new WebSocketServer({
        host: requested.host,
        port: requested.port,
        maxPayload: MAX_FRAME_BYTES,
        verifyClient: ({ req }: { req: IncomingMessage }) => {
          const ok = fromBridge(req);
          if (!ok) log.warn('feed.ws_refused', { origin: req.headers.origin, reason: 'a web page origin; bridges connect without one' });
          return ok;
        },
      });
      s.on('connection', (ws, request) => {
        const remote = request.socket;
        const peer = new FeedPeer(`ws://${remote.remoteFamily === 'IPv6' ? `[${remote.remoteAddress}]` : remote.remoteAddress}:${remote.remotePort}`, sink, log);
        clients.add(ws);
        sink.connection('connected', peer.name);
        ws.on('message', (data: Buffer, isBinary: boolean) => {
          const arrivalNs = clock.nowNs();
          peer.message(isBinary ? data : data.toString('utf8'), arrivalNs);
        });
        ws.on('error', (error) => log.warn('feed.peer_error', { peer: peer.name, message: error.message }));
        ws.on('close', () => {
          clients.delete(ws);
          log.info('feed.peer_summary', { peer: peer.name, ...peer.summary() });
          sink.connection('disconnected', peer.name);
        });
      });
      await new Promise<void>((resolve, reject) => {
        s.once('error', reject);
        s.once('listening', () => {
          s.off('error', reject);
          resolve();
        });
      });
      s.on('error', (error) => log.error('feed.ws_error', { message: error.message }));
      const address = s.address();
      bound = { ...requested, port: typeof address === 'object' && address ? address.port : requested.port };
      server = s;
      log.info('feed.listening', { url: formatFeedUrl(bound) });
    },
    async stop() {
      const s = server;
      if (!s) return;
      server = null;
      const closed = [...clients].map((ws) => new Promise<void>((resolve) => ws.once('close', () => resolve())));
      for (const ws of clients) ws.terminate();
      await Promise.all([...closed, new Promise<void>((resolve) => s.close(() => resolve()))]);
      log.info('feed.stopped', { url: formatFeedUrl(bound ?? requested) });
    },
    control(message) {
      const line = `${encodeControl(message)}\n`;
      for (const ws of clients) if (ws.readyState === ws.OPEN) ws.send(line);
    },
  };
}
