import { createSocket } from 'node:dgram';
import { connect as connectTcp, type Socket } from 'node:net';
import WebSocket from 'ws';
import type { ControlMessage } from '../../../core/gaze/control-message';
import { parseControlLine } from '../../../core/gaze/feed';
import { parseFeedUrl } from './feed-url';

/** The tracker's side of a feed: what bridges do, for the headless tools, replay and tests. */
export interface FeedSender {
  readonly url: string;
  /** Sends lines (without newlines) as one datagram, one WebSocket text frame or one stream write. */
  send(lines: readonly string[]): Promise<void>;
  /** Control lines that could not be read (TCP and WebSocket). */
  readonly badControlLines: number;
  close(): Promise<void>;
}

export interface FeedSenderOptions {
  /** Called for each control message the host sends back (TCP and WebSocket only). */
  readonly onControl?: (message: ControlMessage) => void;
  /** Called when the host closes a TCP or WebSocket connection. */
  readonly onClose?: () => void;
}

/** The most a UDP datagram can carry over IPv4. */
const MAX_DATAGRAM_BYTES = 65_507;

/** Splits a received stream into control lines, whatever the chunk boundaries. */
function controlReader(onControl: ((m: ControlMessage) => void) | undefined, onBad: () => void): (text: string) => void {
  let pending = '';
  return (text) => {
    const lines = (pending + text).split('\n');
    pending = lines.pop()!;
    for (const line of lines) {
      if (line.trim() === '') continue;
      const message = parseControlLine(line);
      if (typeof message === 'string') onBad();
      else onControl?.(message);
    }
  };
}

/** Connects to a listener at udp://, tcp:// or ws://HOST:PORT. */
export async function connectFeedSender(url: string, options: FeedSenderOptions = {}): Promise<FeedSender> {
  const address = parseFeedUrl(url);
  let bad = 0;
  const read = controlReader(options.onControl, () => bad++);
  if (address.transport === 'udp') {
    const socket = createSocket(address.host.includes(':') ? 'udp6' : 'udp4');
    await new Promise<void>((resolve, reject) => {
      socket.once('error', reject);
      socket.connect(address.port, address.host, () => {
        socket.off('error', reject);
        resolve();
      });
    });
    return {
      url,
      badControlLines: 0,
      send(lines) {
        const data = Buffer.from(lines.join('\n'), 'utf8');
        if (data.length > MAX_DATAGRAM_BYTES) return Promise.reject(new RangeError(`lines: ${data.length} bytes do not fit one UDP datagram (at most ${MAX_DATAGRAM_BYTES})`));
        return new Promise((resolve, reject) => socket.send(data, (error) => (error ? reject(error) : resolve())));
      },
      close: () => new Promise((resolve) => socket.close(() => resolve())),
    };
  }
  if (address.transport === 'tcp') {
    const socket: Socket = await new Promise((resolve, reject) => {
      const s = connectTcp({ host: address.host, port: address.port, noDelay: true }, () => {
        s.off('error', reject);
        resolve(s);
      });
      s.once('error', reject);
    });
    socket.setEncoding('utf8');
    socket.on('data', (text: string) => read(text));
    socket.on('error', () => undefined); // a reset shows as 'close', reported through onClose
    socket.on('close', () => options.onClose?.());
    return {
      url,
      get badControlLines() {
        return bad;
      },
      send: (lines) => new Promise((resolve, reject) => socket.write(`${lines.join('\n')}\n`, (error) => (error ? reject(error) : resolve()))),
      close: () =>
        new Promise((resolve) => {
          if (socket.destroyed) return resolve();
          socket.once('close', () => resolve());
          socket.end();
        }),
    };
  }
  const ws = new WebSocket(`ws://${address.host.includes(':') ? `[${address.host}]` : address.host}:${address.port}`);
  await new Promise<void>((resolve, reject) => {
    ws.once('open', () => {
      ws.off('error', reject);
      resolve();
    });
    ws.once('error', reject);
  });
  ws.on('message', (data: Buffer) => read(`${data.toString('utf8')}\n`));
  ws.on('error', () => undefined); // reported through 'close'
  ws.on('close', () => options.onClose?.());
  return {
    url,
    get badControlLines() {
      return bad;
    },
    send: (lines) => new Promise((resolve, reject) => ws.send(lines.join('\n'), (error) => (error ? reject(error) : resolve()))),
    close: () =>
      new Promise((resolve) => {
        if (ws.readyState === ws.CLOSED) return resolve();
        ws.once('close', () => resolve());
        ws.close();
      }),
  };
}
