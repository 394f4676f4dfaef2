import { createServer, type Server, type Socket } from 'node:net';
import type { HostClock } from '../../../core/clock/host-clock';
import { encodeControl } from '../../../core/gaze/feed';
import type { HostLog } from '../../log';
import { FeedPeer } from './feed-peer';
import type { FeedListener } from './feed-listener';
import { formatFeedUrl, type FeedAddress } from './feed-url';

const peerName = (s: Socket): string => `tcp://${s.remoteFamily === 'IPv6' ? `[${s.remoteAddress}]` : s.remoteAddress}:${s.remotePort}`;

/**
 * The feed over TCP: a stream of newline-terminated lines per connection, each with its own
 * hello. Control messages go back to every connected peer as NDJSON lines. A connection that
 * closes is reported disconnected; a tracker that reconnects is a new peer.
 */
export function createTcpFeedListener(requested: FeedAddress, options: { clock: HostClock; log: HostLog }): FeedListener {
  const { clock, log } = options;
  let server: Server | null = null;
  let bound: FeedAddress | null = null;
  const sockets = new Set<Socket>();

  return {
    kind: 'feed-tcp',
    get description() {
      return `TCP feed on ${formatFeedUrl(bound ?? requested).slice('tcp://'.length)}`;
    },
    get address() {
      return bound;
    },
    receiveBufferBytes: null,
    async start(sink) {
      if (server) throw new Error('the TCP feed listener is already started');
      const s = createServer({ noDelay: true }, (socket) => {
        const peer = new FeedPeer(peerName(socket), sink, log);
        sockets.add(socket);
        sink.connection('connected', peer.name);
        socket.on('data', (data) => peer.chunk(data, clock.nowNs()));
        socket.on('end', () => {
          peer.end(clock.nowNs());
          socket.end();
        });
        socket.on('error', (error) => log.warn('feed.peer_error', { peer: peer.name, message: error.message }));
        socket.on('close', () => {
          sockets.delete(socket);
          log.info('feed.peer_summary', { peer: peer.name, ...peer.summary() });
          sink.connection('disconnected', peer.name);
        });
      });
      await new Promise<void>((resolve, reject) => {
        s.once('error', reject);
        s.listen(requested.port, requested.host, () => {
          s.off('error', reject);
          resolve();
        });
      });
      s.on('error', (error) => log.error('feed.tcp_error', { message: error.message }));
      const address = s.address();
      bound = { ...requested, port: typeof address === 'object' && address ? address.port : requested.port };
      server = s;
      log.info('feed.listening', { url: formatFeedUrl(bound) });
    },
    async stop() {
      const s = server;
      if (!s) return;
      server = null;
      const closed = [...sockets].map((socket) => new Promise<void>((resolve) => socket.once('close', () => resolve())));
      for (const socket of sockets) socket.destroy();
      await Promise.all([...closed, new Promise<void>((resolve) => s.close(() => resolve()))]);
      log.info('feed.stopped', { url: formatFeedUrl(bound ?? requested) });
    },
    control(message) {
      const line = `${encodeControl(message)}\n`;
      for (const socket of sockets) if (socket.writable) socket.write(line);
    },
  };
}
