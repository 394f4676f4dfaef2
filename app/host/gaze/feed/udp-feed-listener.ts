import { createSocket, type Socket } from 'node:dgram';
import type { HostClock } from '../../../core/clock/host-clock';
import type { HostLog } from '../../log';
import type { GazeSink } from '../gaze-source';
import { FeedPeer } from './feed-peer';
import { UDP_RECEIVE_BUFFER_BYTES, type FeedListener } from './feed-listener';
import { formatFeedUrl, type FeedAddress } from './feed-url';

/**
 * The feed over UDP: one or more whole lines per datagram. Each sender (address and port)
 * has its own hello. UDP has no connections, so a sender is reported connected at its first
 * datagram and disconnected when the listener stops. Control messages need a stream and
 * are not sent over UDP.
 */
export function createUdpFeedListener(requested: FeedAddress, options: { clock: HostClock; log: HostLog }): FeedListener {
  const { clock, log } = options;
  let socket: Socket | null = null;
  let bound: FeedAddress | null = null;
  let granted: number | null = null;
  let peers = new Map<string, FeedPeer>();
  let currentSink: GazeSink | null = null;

  return {
    kind: 'feed-udp',
    get description() {
      return `UDP feed on ${formatFeedUrl(bound ?? requested).slice('udp://'.length)}`;
    },
    get address() {
      return bound;
    },
    get receiveBufferBytes() {
      return granted;
    },
    async start(sink) {
      if (socket) throw new Error('the UDP feed listener is already started');
      currentSink = sink;
      const s = createSocket({ type: requested.host.includes(':') ? 'udp6' : 'udp4' });
      s.on('message', (data, remote) => {
        const arrivalNs = clock.nowNs(); // first, before any decoding
        const name = `udp://${remote.family === 'IPv6' ? `[${remote.address}]` : remote.address}:${remote.port}`;
        let peer = peers.get(name);
        if (!peer) {
          peer = new FeedPeer(name, sink, log);
          peers.set(name, peer);
          sink.connection('connected', name);
        }
        peer.message(data, arrivalNs);
      });
      s.on('error', (error) => log.error('feed.udp_error', { message: error.message }));
      await new Promise<void>((resolve, reject) => {
        s.once('error', reject);
        s.bind(requested.port, requested.host, () => {
          s.off('error', reject);
          resolve();
        });
      });
      try {
        s.setRecvBufferSize(UDP_RECEIVE_BUFFER_BYTES);
      } catch (error) {
        log.warn('feed.udp_buffer_refused', { requested: UDP_RECEIVE_BUFFER_BYTES, message: (error as Error).message });
      }
      granted = s.getRecvBufferSize();
      socket = s;
      bound = { ...requested, port: s.address().port };
      log.info('feed.listening', { url: formatFeedUrl(bound), receive_buffer_requested: UDP_RECEIVE_BUFFER_BYTES, receive_buffer_granted: granted });
    },
    async stop() {
      const s = socket;
      if (!s) return;
      socket = null;
      await new Promise<void>((resolve) => s.close(() => resolve()));
      for (const [name, peer] of peers) {
        log.info('feed.peer_summary', { peer: name, ...peer.summary() });
        currentSink?.connection('disconnected', name);
      }
      peers = new Map();
      log.info('feed.stopped', { url: formatFeedUrl(bound ?? requested) });
    },
    control() {
      // UDP carries no control messages back: bridges that need them connect over TCP or WebSocket.
    },
  };
}
