export type FeedTransport = 'udp' | 'tcp' | 'ws';

export interface FeedAddress {
  readonly transport: FeedTransport;
  readonly host: string;
  readonly port: number;
}

const TRANSPORTS: readonly FeedTransport[] = ['udp', 'tcp', 'ws'];

/**
 * Reads udp://HOST:PORT, tcp://HOST:PORT or ws://HOST:PORT (IPv6 hosts in brackets).
 * Port 0 asks a listener for any free port. Throws a RangeError naming what was expected.
 */
export function parseFeedUrl(url: string): FeedAddress {
  const match = /^([a-z]+):\/\/(\[[0-9a-fA-F:.]+\]|[^:/[\]]+):(\d{1,5})\/?$/.exec(url);
  if (!match) throw new RangeError(`feed address must look like udp://HOST:PORT, tcp://HOST:PORT or ws://HOST:PORT, got "${url}"`);
  const [, scheme, rawHost, portText] = match;
  if (!(TRANSPORTS as readonly string[]).includes(scheme!)) throw new RangeError(`feed address "${url}": the transport must be udp, tcp or ws, got "${scheme}"`);
  const port = Number(portText);
  if (port > 65535) throw new RangeError(`feed address "${url}": the port must be from 0 to 65535`);
  const host = rawHost!.startsWith('[') ? rawHost!.slice(1, -1) : rawHost!;
  return { transport: scheme as FeedTransport, host, port };
}

export const formatFeedUrl = (a: FeedAddress): string => `${a.transport}://${a.host.includes(':') ? `[${a.host}]` : a.host}:${a.port}`;
