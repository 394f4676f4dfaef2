import type { GazeSource } from '../gaze-source';
import type { FeedAddress } from './feed-url';

/** A gaze source listening for a feed, with the address it actually bound (port 0 becomes a free port). */
export interface FeedListener extends GazeSource {
  readonly kind: 'feed-udp' | 'feed-tcp' | 'feed-ws';
  /** The bound address once started, else null. */
  readonly address: FeedAddress | null;
  /** UDP only: the receive buffer the OS granted, in bytes (null for TCP and WebSocket, or before start). */
  readonly receiveBufferBytes: number | null;
}

/** The receive buffer a UDP listener asks for, to absorb bursts while the event loop is busy. */
export const UDP_RECEIVE_BUFFER_BYTES = 4 * 1024 * 1024;
