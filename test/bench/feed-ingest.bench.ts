import { spawn } from 'node:child_process';
import { createSocket } from 'node:dgram';
import { mkdtempSync, rmSync } from 'node:fs';
import { open, type FileHandle } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { FeedQualityCounter } from '../../app/core/gaze/feed';
import { percentileInPlace } from '../../app/core/gaze/feed/percentile';
import { createFeedListener } from '../../app/host/gaze/feed';
import { createHostLog } from '../../app/host/log';
import { createMonotonicClock } from '../../app/host/monotonic-clock';
import { duration, rate, type Benchmark } from './harness';

/**
 * A tracker bridge in its own process: one TSV sample per datagram at `rate` Hz for
 * `seconds`, sent at absolute deadlines to every port given, stamped with process.hrtime
 * at the moment of sending (the receiver reads the same CLOCK_MONOTONIC, so stamp to
 * handler is the whole trip). Sequence numbers let the receiver count every loss.
 */
const SENDER = `
  const dgram = require('node:dgram');
  const [rateHz, seconds, ...ports] = process.argv.slice(1).map(Number);
  const now = () => Number(process.hrtime.bigint()) / 1e9;
  const sockets = ports.map((port) => {
    const socket = dgram.createSocket('udp4');
    socket.on('error', () => undefined);
    socket.connect(port, '127.0.0.1');
    return socket;
  });
  const sendAll = (line) => sockets.forEach((s) => s.send(line));
  setTimeout(() => {
    sendAll('{"gazeloom_feed":1,"units":"screen_px","rate_hz":' + rateHz + ',"eyes":"both","pupil":"mm","tsv_seq":true,"source":"feed ingest bench"}');
    const start = now() + 0.05;
    const total = Math.round(rateHz * seconds);
    let k = 0;
    const step = () => {
      while (k < total && now() >= start + k / rateHz) {
        const x = 960 + 300 * Math.sin(k / 400);
        sendAll(k + '\\t' + now().toFixed(9) + '\\t' + x.toFixed(2) + '\\t540.00\\t1\\t3.41\\t' + (x + 12).toFixed(2) + '\\t541.00\\t1\\t3.39');
        k++;
      }
      if (k < total) {
        const waitS = start + k / rateHz - now();
        if (waitS > 0.002) setTimeout(step, (waitS - 0.002) * 1000); else setImmediate(step);
      } else setTimeout(() => process.exit(0), 100);
    };
    step();
  }, 100);`;

function runSender(rateHz: number, seconds: number, ports: readonly number[]): Promise<void> {
  const child = spawn(process.execPath, ['-e', SENDER, String(rateHz), String(seconds), ...ports.map(String)], { stdio: 'inherit' });
  return new Promise((resolve, reject) => child.once('exit', (code) => (code === 0 ? resolve() : reject(new Error(`sender exited with ${code}`)))));
}

/**
 * The least a recorder must do: append each sample's line to a file and fsync it every
 * 50 ms; a sample's receipt-to-disk latency ends when the fsync covering it returns.
 * (The session recorder replaces this; it stands in here so the figure exists.)
 */
class MinimalAppender {
  private pending: string[] = [];
  private pendingArrivals: number[] = [];
  private busy = false;
  readonly toDiskMs: number[] = [];
  private readonly timer: NodeJS.Timeout;

  private constructor(
    private readonly file: FileHandle,
    private readonly nowNs: () => number,
  ) {
    this.timer = setInterval(() => void this.flush(), 50);
  }

  static async open(path: string, nowNs: () => number): Promise<MinimalAppender> {
    return new MinimalAppender(await open(path, 'a'), nowNs);
  }

  append(line: string, arrivalNs: number): void {
    this.pending.push(line);
    this.pendingArrivals.push(arrivalNs);
  }

  private async flush(): Promise<void> {
    if (this.busy || this.pending.length === 0) return;
    this.busy = true;
    const lines = this.pending;
    const arrivals = this.pendingArrivals;
    this.pending = [];
    this.pendingArrivals = [];
    await this.file.write(`${lines.join('\n')}\n`);
    await this.file.sync();
    const doneNs = this.nowNs();
    for (const a of arrivals) this.toDiskMs.push((doneNs - a) / 1e6);
    this.busy = false;
  }

  async close(): Promise<void> {
    clearInterval(this.timer);
    while (this.busy) await new Promise((r) => setTimeout(r, 5));
    await this.flush();
    await this.file.close();
  }
}

const p99 = (values: number[]): number => percentileInPlace(Float64Array.from(values), 99) ?? Number.NaN;

export interface IngestResult {
  readonly samples: number;
  readonly lost: number;
  readonly garbageLines: number;
  readonly measuredRateHz: number | null;
  readonly jitterMsP99: number | null;
  readonly receiptToHandlerMsP99: number;
  readonly sendToHandlerMsP99: number;
  readonly receiptToDiskMsP99: number;
  readonly receiveBufferBytes: number | null;
}

export interface PeerResult {
  readonly received: number;
  readonly sendToHandlerMsP99: number;
  readonly receiptToDiskMsP99: number;
}

/** Gazeloom's UDP listener, its sink appending to disk. */
async function startOurs(clock: ReturnType<typeof createMonotonicClock>, dir: string) {
  const epochNs = Number(clock.originNs);
  const appender = await MinimalAppender.open(join(dir, 'gaze.tsv'), () => clock.nowNs());
  const counter = new FeedQualityCounter();
  const toHandlerMs: number[] = [];
  const sendToHandlerMs: number[] = [];
  const listener = createFeedListener('udp://127.0.0.1:0', { clock, log: createHostLog({ file: null, echo: true }) });
  await listener.start({
    hello: (hello) => counter.hello(hello),
    sample(sample, arrivalNs) {
      const handlerNs = clock.nowNs();
      toHandlerMs.push((handlerNs - arrivalNs) / 1e6);
      sendToHandlerMs.push((handlerNs + epochNs) / 1e6 - sample.trackerTimeS * 1e3);
      counter.sample(sample, arrivalNs);
      appender.append(`${sample.seq}\t${sample.trackerTimeS}\t${sample.left?.x}\t${sample.left?.y}\t${sample.right?.x}\t${sample.right?.y}`, arrivalNs);
    },
    garbage: (reason) => counter.garbage(reason),
    connection: () => undefined,
  });
  return {
    port: listener.address!.port,
    async finish(expected: number): Promise<IngestResult> {
      const receiveBufferBytes = listener.receiveBufferBytes;
      await listener.stop();
      await appender.close();
      const q = counter.report();
      return {
        samples: q.samples,
        lost: Math.max(q.lost, expected - q.samples), // sequence gaps miss samples lost after the last one received
        garbageLines: q.garbageLines,
        measuredRateHz: q.measuredRateHz,
        jitterMsP99: q.jitterMsP99,
        receiptToHandlerMsP99: p99(toHandlerMs),
        sendToHandlerMsP99: p99(sendToHandlerMs),
        receiptToDiskMsP99: p99(appender.toDiskMs),
        receiveBufferBytes,
      };
    },
  };
}

/** The peer: a bare dgram socket on the same stream, reading only the timestamp, appending the raw bytes the same way. */
async function startPeer(clock: ReturnType<typeof createMonotonicClock>, dir: string) {
  const epochNs = Number(clock.originNs);
  const appender = await MinimalAppender.open(join(dir, 'raw.tsv'), () => clock.nowNs());
  const sendToHandlerMs: number[] = [];
  let received = 0;
  const socket = createSocket('udp4');
  socket.on('message', (data) => {
    const arrivalNs = clock.nowNs();
    const text = data.toString('utf8');
    const fields = text.split('\t');
    if (fields.length === 1) return; // the hello
    received++;
    sendToHandlerMs.push((clock.nowNs() + epochNs) / 1e6 - Number(fields[1]) * 1e3);
    appender.append(text, arrivalNs);
  });
  await new Promise<void>((resolve) => socket.bind(0, '127.0.0.1', resolve));
  socket.setRecvBufferSize(4 * 1024 * 1024);
  return {
    port: socket.address().port,
    async finish(): Promise<PeerResult> {
      await new Promise<void>((resolve) => socket.close(() => resolve()));
      await appender.close();
      return { received, sendToHandlerMsP99: p99(sendToHandlerMs), receiptToDiskMsP99: p99(appender.toDiskMs) };
    },
  };
}

/**
 * One ingest run. With `withPeer`, the bare socket takes the same stream in this same
 * process at the same time, so both see the same machine load, stalls and disk.
 */
export async function runFeedIngest(options: { seconds: number; rateHz: number; withPeer: boolean }): Promise<{ ours: IngestResult; peer: PeerResult | null }> {
  const clock = createMonotonicClock();
  const dir = mkdtempSync(join(tmpdir(), 'gz-feed-bench-'));
  try {
    const ours = await startOurs(clock, dir);
    const peer = options.withPeer ? await startPeer(clock, dir) : null;
    await runSender(options.rateHz, options.seconds, peer ? [ours.port, peer.port] : [ours.port]);
    await new Promise((r) => setTimeout(r, 200));
    return { ours: await ours.finish(Math.round(options.rateHz * options.seconds)), peer: (await peer?.finish()) ?? null };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export const benchmark: Benchmark = {
  name: 'gaze feed ingest, 2000 Hz over UDP on 127.0.0.1 from another process',
  async run(log) {
    const rateHz = 2000;
    const seconds = Number(process.env.GZ_FEED_SECONDS ?? 60);
    const { ours, peer } = await runFeedIngest({ seconds, rateHz, withPeer: true });
    log(`ours, ${seconds} s: ${ours.samples} samples, ${ours.lost} lost, ${ours.garbageLines} garbage; measured ${ours.measuredRateHz?.toFixed(3)} Hz; arrival jitter p99 ${ours.jitterMsP99?.toFixed(3)} ms; receive buffer granted ${ours.receiveBufferBytes} bytes`);
    log(`ours: p99 receipt to handler ${(ours.receiptToHandlerMsP99 * 1e3).toFixed(1)} µs, send to handler ${ours.sendToHandlerMsP99.toFixed(3)} ms, receipt to disk (fsync every 50 ms) ${ours.receiptToDiskMsP99.toFixed(2)} ms`);
    log(`bare dgram peer on the same stream: ${peer!.received} of ${seconds * rateHz} datagrams; p99 send to handler ${peer!.sendToHandlerMsP99.toFixed(3)} ms, receipt to disk ${peer!.receiptToDiskMsP99.toFixed(2)} ms`);
    return [
      rate(`gaze feed ingest: samples lost at ${rateHz} Hz for ${seconds} s (target 0)`, ours.lost, 'samples'),
      duration('gaze feed ingest: receipt to handler p99', ours.receiptToHandlerMsP99, 'ms'),
      duration('gaze feed ingest: send to handler p99', ours.sendToHandlerMsP99, 'ms', { name: 'bare dgram socket, same stream, same process', value: peer!.sendToHandlerMsP99 }),
      duration('gaze feed ingest: receipt to disk p99 (fsync every 50 ms)', ours.receiptToDiskMsP99, 'ms', { name: 'bare dgram socket appending the raw datagrams', value: peer!.receiptToDiskMsP99 }),
    ];
  },
};
