import { spawn } from 'node:child_process';
import { connect as connectTcp } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import WebSocket from 'ws';
import { ManualClock, type HostNs } from '../../app/core/clock/host-clock';
import type { ControlMessage } from '../../app/core/gaze/control-message';
import { encodeHello, encodeSampleNdjson, encodeSampleTsv, FeedQualityCounter } from '../../app/core/gaze/feed';
import type { GazeHello, GazeSample } from '../../app/core/gaze/gaze-sample';
import { connectFeedSender, createFeedListener, formatFeedUrl, parseFeedUrl, type FeedListener, type FeedSender } from '../../app/host/gaze/feed';
import type { GazeSink } from '../../app/host/gaze/gaze-source';
import { createHostLog, type LogRecord } from '../../app/host/log';

// Real sockets on 127.0.0.1 for the three transports of the gaze feed (our own protocol,
// defined in the README; common practice, no source). Arrival times come from a
// ManualClock, so they show which send a sample belonged to.

type Seen =
  | { kind: 'hello'; hello: GazeHello; peer: string }
  | { kind: 'sample'; sample: GazeSample; arrivalNs: HostNs }
  | { kind: 'garbage'; reason: string; peer: string }
  | { kind: 'connection'; state: 'connected' | 'disconnected'; peer: string };

function collector() {
  const seen: Seen[] = [];
  const sink: GazeSink = {
    hello: (hello, peer) => seen.push({ kind: 'hello', hello, peer }),
    sample: (sample, arrivalNs) => seen.push({ kind: 'sample', sample, arrivalNs }),
    garbage: (reason, peer) => seen.push({ kind: 'garbage', reason, peer }),
    connection: (state, peer) => seen.push({ kind: 'connection', state, peer }),
  };
  const of = <K extends Seen['kind']>(kind: K) => seen.filter((s): s is Extract<Seen, { kind: K }> => s.kind === kind);
  return { seen, sink, of };
}

/** Polls until `ready()` holds; gives up after 20 s (a hang, not a timing check). */
async function until(ready: () => boolean, what: string): Promise<void> {
  for (let i = 0; i < 4000 && !ready(); i++) await new Promise((r) => setTimeout(r, 5));
  if (!ready()) throw new Error(`timed out waiting for ${what}`);
}

const hello: GazeHello = { protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 500, eyes: 'both', screen: { widthPx: 1920, heightPx: 1080 }, pupilUnit: 'mm', source: 'beacon test rig' };
const eye = (x: number, valid = true) => ({ x, y: x / 2, valid, pupil: valid ? 3.5 : null });
const sampleAt = (seq: number): GazeSample => ({ seq, trackerTimeS: 100 + seq / 500, left: eye(seq), right: eye(seq + 1, seq % 7 !== 0) });

let listener: FeedListener | null = null;
let senders: FeedSender[] = [];
afterEach(async () => {
  await Promise.all(senders.map((s) => s.close()));
  senders = [];
  await listener?.stop();
  listener = null;
});

async function listen(transport: 'udp' | 'tcp' | 'ws', clock = new ManualClock(), records: LogRecord[] = []) {
  const c = collector();
  listener = createFeedListener(`${transport}://127.0.0.1:0`, { clock, log: createHostLog({ file: null, echo: false, sink: (r) => records.push(r) }) });
  await listener.start(c.sink);
  const url = formatFeedUrl(listener.address!);
  return { ...c, url, clock };
}

async function sender(url: string, onControl?: (m: ControlMessage) => void): Promise<FeedSender> {
  const s = await connectFeedSender(url, onControl ? { onControl } : {});
  senders.push(s);
  return s;
}

describe('feed addresses', () => {
  it('read udp://, tcp:// and ws:// with a host name, an IPv4 or a bracketed IPv6 address', () => {
    expect(parseFeedUrl('udp://127.0.0.1:4242')).toEqual({ transport: 'udp', host: '127.0.0.1', port: 4242 });
    expect(parseFeedUrl('tcp://tracker-pc.local:0')).toEqual({ transport: 'tcp', host: 'tracker-pc.local', port: 0 });
    expect(parseFeedUrl('ws://[::1]:9000/')).toEqual({ transport: 'ws', host: '::1', port: 9000 });
    expect(formatFeedUrl({ transport: 'ws', host: '::1', port: 9000 })).toBe('ws://[::1]:9000');
  });

  it.each([
    ['http://127.0.0.1:80', 'the transport must be udp, tcp or ws, got "http"'],
    ['udp://127.0.0.1', 'feed address must look like udp://HOST:PORT'],
    ['udp://127.0.0.1:70000', 'the port must be from 0 to 65535'],
    ['127.0.0.1:4242', 'feed address must look like udp://HOST:PORT'],
  ])('refuse %s', (url, message) => {
    expect(() => parseFeedUrl(url)).toThrow(RangeError);
    expect(() => parseFeedUrl(url)).toThrow(message);
  });

  it('refuse a batch of lines too big for one UDP datagram', async () => {
    const { url } = await listen('udp');
    const s = await sender(url);
    await expect(s.send(['x'.repeat(70_000)])).rejects.toThrow(/do not fit one UDP datagram/);
  });
});

describe.each(['udp', 'tcp', 'ws'] as const)('the feed over %s', (transport) => {
  it('binds a free port for port 0 and reports it', async () => {
    const { url } = await listen(transport);
    expect(listener!.address!.port).toBeGreaterThan(0);
    expect(listener!.kind).toBe(`feed-${transport}`);
    expect(listener!.description).toContain(`127.0.0.1:${listener!.address!.port}`);
    expect(url).toBe(`${transport}://127.0.0.1:${listener!.address!.port}`);
  });

  it('delivers hello and samples (NDJSON and TSV, several per packet) with the arrival time of their packet', async () => {
    const { url, clock, of } = await listen(transport);
    const s = await sender(url);
    clock.advanceNs(1e9);
    await s.send([encodeHello(hello, { tsvSeq: true })]);
    await until(() => of('hello').length === 1, 'the hello');
    await s.send([1, 2, 3].map((i) => encodeSampleNdjson(sampleAt(i))));
    await until(() => of('sample').length === 3, 'three samples');
    clock.advanceNs(1e9);
    await s.send([4, 5].map((i) => encodeSampleTsv(sampleAt(i), { hello, tsvSeq: true })));
    await until(() => of('sample').length === 5, 'five samples');
    expect(of('hello')[0]!.hello).toEqual(hello);
    expect(of('sample').map((x) => x.sample)).toEqual([1, 2, 3, 4, 5].map(sampleAt));
    expect(of('sample').map((x) => x.arrivalNs)).toEqual([1e9, 1e9, 1e9, 2e9, 2e9]);
    expect(of('connection')).toEqual([{ kind: 'connection', state: 'connected', peer: of('hello')[0]!.peer }]);
    expect(of('hello')[0]!.peer).toMatch(new RegExp(`^${transport}://127\\.0\\.0\\.1:\\d+$`));
  });

  it('counts garbage with a reason and goes on; accepts a new hello mid-stream', async () => {
    const records: LogRecord[] = [];
    const { url, of } = await listen(transport, new ManualClock(), records);
    const s = await sender(url);
    await s.send(['7\t1\t2\t1']);
    await s.send([encodeHello(hello), '{"t":', '{"t":1,"l":[1,2,1]}', encodeSampleNdjson(sampleAt(1))]);
    await until(() => of('sample').length === 1 && of('garbage').length === 3, 'garbage and a sample');
    expect(of('garbage').map((g) => g.reason)).toEqual(['sample before any hello', 'not valid JSON: "{\\"t\\":"', 'sample: missing "r" (right eye; the hello declared eyes both)']);
    const restarted: GazeHello = { ...hello, rateHz: 250, eyes: 'left', pupilUnit: null };
    await s.send([encodeHello(restarted), '3.5\t10\t20\t1']);
    await until(() => of('sample').length === 2, 'a sample after the new hello');
    expect(of('hello').map((h) => h.hello)).toEqual([hello, restarted]);
    expect(of('sample')[1]!.sample).toEqual({ seq: null, trackerTimeS: 3.5, left: { x: 10, y: 20, valid: true, pupil: null }, right: null });
    expect(records.filter((r) => r.event === 'feed.hello_again')).toHaveLength(1);
    expect(records.filter((r) => r.event === 'feed.garbage')).toHaveLength(3);
  });
});

describe.each(['tcp', 'ws'] as const)('control messages and connections over %s', (transport) => {
  it('sends control messages to every connected peer, as the tracker side reads them', async () => {
    const { url, of } = await listen(transport);
    const got: ControlMessage[][] = [[], []];
    await sender(url, (m) => got[0]!.push(m));
    await sender(url, (m) => got[1]!.push(m));
    await until(() => of('connection').length === 2, 'two peers');
    const messages: ControlMessage[] = [
      { type: 'session_started', session: 'S012', hostTimeS: 1 },
      { type: 'target_shown', purpose: 'calibration', id: 'c5', x: 1700, y: 950, hostTimeS: 2.5 },
      { type: 'target_removed', id: 'c5', hostTimeS: 3.5 },
      { type: 'clip_started', clip: 'conveyor-parcels-03', hostTimeS: 10 },
      { type: 'clip_ended', clip: 'conveyor-parcels-03', hostTimeS: 40 },
    ];
    messages.forEach((m) => listener!.control(m));
    await until(() => got.every((g) => g.length === messages.length), 'control messages at both peers');
    expect(got).toEqual([messages, messages]);
    expect(senders.map((s) => s.badControlLines)).toEqual([0, 0]);
  });

  it('reports a disconnection and a reconnection through the sink', async () => {
    const { url, of } = await listen(transport);
    const first = await sender(url);
    await first.send([encodeHello(hello), encodeSampleNdjson(sampleAt(1))]);
    await until(() => of('sample').length === 1, 'the first sample');
    await first.close();
    await until(() => of('connection').length === 2, 'the disconnection');
    const second = await sender(url);
    await second.send([encodeHello(hello), encodeSampleNdjson(sampleAt(2))]);
    await until(() => of('sample').length === 2, 'a sample after reconnecting');
    const [c1, d1, c2] = of('connection');
    expect([c1!.state, d1!.state, c2!.state]).toEqual(['connected', 'disconnected', 'connected']);
    expect(d1!.peer).toBe(c1!.peer);
    expect(c2!.peer).not.toBe(c1!.peer);
    expect(of('hello')).toHaveLength(2);
  });

  it('reports connected peers as disconnected when the listener stops', async () => {
    const { url, of } = await listen(transport);
    await sender(url);
    await until(() => of('connection').length === 1, 'a peer');
    await listener!.stop();
    listener = null;
    expect(of('connection').map((c) => c.state)).toEqual(['connected', 'disconnected']);
  });
});

describe('TCP streams', () => {
  it('joins a line split across writes and reads a last line without its newline', async () => {
    const { url, of } = await listen('tcp');
    const port = Number(url.split(':').at(-1));
    const socket = connectTcp({ host: '127.0.0.1', port });
    await new Promise((r) => socket.once('connect', r));
    const text = `${encodeHello(hello)}\n${encodeSampleNdjson(sampleAt(1))}\n${encodeSampleNdjson(sampleAt(2))}`;
    for (const piece of [text.slice(0, 10), text.slice(10, 150), text.slice(150, -3)]) {
      socket.write(piece);
      await new Promise((r) => setTimeout(r, 20));
    }
    socket.end(text.slice(-3));
    await until(() => of('connection').length === 2, 'the stream to end');
    expect(of('sample').map((s) => s.sample)).toEqual([sampleAt(1), sampleAt(2)]);
    expect(of('garbage')).toEqual([]);
  });
});

describe('WebSocket origins', () => {
  const open = (url: string, origin: string) =>
    new Promise<number>((resolve) => {
      const ws = new WebSocket(url, { headers: { Origin: origin } });
      ws.once('open', () => {
        ws.close();
        resolve(101);
      });
      ws.once('unexpected-response', (_request, response) => resolve(response.statusCode ?? 0));
    });

  it('refuses a web page origin and accepts a bridge that names the listener itself', async () => {
    const records: LogRecord[] = [];
    const { url } = await listen('ws', new ManualClock(), records);
    expect(await open(url, 'https://example.org')).toBe(401);
    expect(await open(url, `http://${url.slice('ws://'.length)}`)).toBe(101);
    expect(records.filter((r) => r.event === 'feed.ws_refused')).toHaveLength(1);
  });
});

describe('UDP bursts', () => {
  // A sender in another process (as a tracker bridge is) sends bursts of datagrams while
  // this process's event loop is stalled, as a long garbage collection or a busy handler
  // would stall it: the socket's receive buffer must hold each whole burst. With the
  // operating system's default buffer (about 200 KiB on Linux) most of a burst is lost.
  const bridge = `
    const socket = require('node:dgram').createSocket('udp4');
    let seq = 0;
    socket.connect(Number(process.argv[1]), '127.0.0.1', () => {
      socket.send('{"gazeloom_feed":1,"units":"screen_px","rate_hz":2000,"eyes":"left","tsv_seq":true}');
      process.stdin.on('data', (text) => {
        const count = Number(text);
        let sent = 0;
        for (let i = 0; i < count; i++, seq++) {
          socket.send(seq + '\t' + (seq / 2000).toFixed(6) + '\t' + (400 + (seq % 100)) + '\t300\t1', () => {
            if (++sent === count) process.stdout.write('sent\\n');
          });
        }
      });
    });`;

  it('loses none of 20 000 datagrams sent in bursts of 4 000 while the receiver stalls', async () => {
    const { of } = await listen('udp');
    expect(listener!.receiveBufferBytes).toBeGreaterThanOrEqual(4 * 1024 * 1024);
    const child = spawn(process.execPath, ['-e', bridge, String(listener!.address!.port)], { stdio: ['pipe', 'pipe', 'inherit'] });
    try {
      let sentBursts = 0;
      child.stdout.on('data', (text: Buffer) => (sentBursts += text.toString().split('sent').length - 1));
      await until(() => of('hello').length === 1, 'the hello');
      const burst = 4000;
      for (let b = 1; b <= 5; b++) {
        await new Promise((resolve) => child.stdin.write(`${burst}\n`, resolve));
        const stallUntil = process.hrtime.bigint() + 300_000_000n;
        while (process.hrtime.bigint() < stallUntil); // the event loop reads nothing meanwhile
        await until(() => sentBursts === b && of('sample').length === b * burst, `burst ${b}`);
      }
    } finally {
      child.kill();
    }
    const counter = new FeedQualityCounter();
    counter.hello(of('hello')[0]!.hello);
    for (const x of of('sample')) counter.sample(x.sample, x.arrivalNs);
    expect(counter.report()).toMatchObject({ samples: 20_000, lost: 0, outOfOrder: 0, garbageLines: 0, lossFrom: 'seq' });
  });
});
