import type { HostClock } from '../../../core/clock/host-clock';
import type { HostLog } from '../../log';
import type { FeedListener } from './feed-listener';
import { parseFeedUrl } from './feed-url';
import { createTcpFeedListener } from './tcp-feed-listener';
import { createUdpFeedListener } from './udp-feed-listener';
import { createWsFeedListener } from './ws-feed-listener';

/**
 * A gaze source listening on udp://HOST:PORT, tcp://HOST:PORT or ws://HOST:PORT (port 0:
 * any free port, see `address` after start). Arrival times come from `clock`, taken as the
 * data reaches JavaScript, before decoding. Throws a RangeError for a malformed address.
 */
export function createFeedListener(url: string, options: { clock: HostClock; log: HostLog }): FeedListener {
  const address = parseFeedUrl(url);
  switch (address.transport) {
    case 'udp':
      return createUdpFeedListener(address, options);
    case 'tcp':
      return createTcpFeedListener(address, options);
    case 'ws':
      return createWsFeedListener(address, options);
  }
}
