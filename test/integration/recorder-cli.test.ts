import { createSocket } from 'node:dgram';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { recordCommand } from '../../app/cli/commands/record';
import { recordingExportCommand } from '../../app/cli/commands/recording/export';
import { recordingInspectCommand } from '../../app/cli/commands/recording/inspect';
import { runCli } from '../../app/cli/run-cli';
import { encodeHello, encodeSampleNdjson, parseRecordedGazeTsv } from '../../app/core/gaze/feed';
import { connectFeedSender } from '../../app/host/gaze/feed';
import { readSession } from '../../app/host/recording/read-session';

// `gazeloom record` end to end over UDP, then `recording inspect` and `recording export`;
// the exported TSV is read back with the reader `feed replay` uses.
const root = mkdtempSync(join(tmpdir(), 'gz-record-'));
const commands = [recordCommand, recordingInspectCommand, recordingExportCommand];
const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function cli(args: string[]): Promise<{ code: number; doc: Record<string, unknown> | null; stderr: string }> {
  const out: string[] = [];
  const err: string[] = [];
  const code = await runCli(args, commands, { stdout: { write: (t: string) => out.push(t) }, stderr: { write: (t: string) => err.push(t) } }, 'test');
  return { code, doc: out.length > 0 ? JSON.parse(out.join('')) : null, stderr: err.join('') };
}

async function freeUdpPort(): Promise<number> {
  const s = createSocket('udp4');
  await new Promise<void>((resolve) => s.bind(0, '127.0.0.1', resolve));
  const { port } = s.address();
  await new Promise<void>((resolve) => s.close(() => resolve()));
  return port;
}

const trackerTime = (k: number) => 7200.5 + k / 500;

describe('gazeloom record', () => {
  it('records a UDP feed into a new session that inspects and exports cleanly', async () => {
    const port = await freeUdpPort();
    const dir = join(root, 'p01', 'session');
    const recording = cli(['record', '--listen', `udp://127.0.0.1:${port}`, '--seconds', '1.6', '--out', dir, '--screen-mm', '531x299', '--resolution', '1920x1080', '--distance-mm', '650', '--json']);
    await pause(200);
    const sender = await connectFeedSender(`udp://127.0.0.1:${port}`);
    await sender.send([encodeHello({ protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 500, eyes: 'both', screen: { widthPx: 1920, heightPx: 1080 }, pupilUnit: 'mm', source: 'conveyor bridge' })]);
    for (let k = 0; k < 500; k += 10) {
      const lines = [];
      for (let j = k; j < k + 10; j++) {
        const blink = j % 100 >= 95;
        const eye = (dx: number) => ({ x: blink ? Number.NaN : 800 + dx + (j % 13), y: blink ? Number.NaN : 400 + (j % 7), valid: !blink, pupil: blink ? null : 3.5 });
        lines.push(encodeSampleNdjson({ seq: j, trackerTimeS: trackerTime(j), left: eye(0), right: eye(4) }));
      }
      await sender.send(lines);
      await pause(20);
    }
    await sender.send(['this is not a feed line']);
    await sender.close();
    const { code, doc, stderr } = await recording;
    expect(stderr).toBe('');
    expect(code).toBe(0);
    expect(doc).toMatchObject({ out: dir, samples: 500, garbage_lines: 1, disconnects: 0, interrupted: false, clean_close: true, warnings: ['1 garbage lines were ignored'] });
    const reader = await readSession(dir);
    expect(reader.info.display).toEqual({ widthMm: 531, heightMm: 299, widthPx: 1920, heightPx: 1080, distanceMm: 650 });
    const kinds = new Set<string>();
    for await (const m of reader.messages()) kinds.add(m.kind);
    expect([...kinds].sort()).toEqual(['clock_fit', 'recording_open', 'tracker_connection', 'tracker_hello']);

    // Stopping a UDP listener "disconnects" its senders: that is the end of the recording, not a gap.
    expect((await cli(['recording', 'inspect', dir, '--json'])).doc).toEqual({ samples: 500, first_timestamp: 7200.5, last_timestamp: trackerTime(499), gaps: [], corrupt_chunks: 0, torn_tail_bytes: 0, clean_close: true, warnings: [] });

    const tsv = join(root, 'p01', 'gaze.tsv');
    const exported = await cli(['recording', 'export', dir, '--out', tsv, '--json']);
    expect(exported.code).toBe(0);
    expect(exported.doc).toMatchObject({ samples: 500, warnings: [] });
    const rows = parseRecordedGazeTsv(readFileSync(tsv, 'utf8'), tsv);
    expect(rows.map((r) => r.trackerTimeS)).toEqual(Array.from({ length: 500 }, (_, k) => trackerTime(k)));
    expect(rows.filter((r) => r.x === null)).toHaveLength(25);
    expect(rows[1]).toEqual({ trackerTimeS: trackerTime(1), x: 800 + 2 + 1, y: 401, pupil: 3.5 });
    // Mapped times are one straight line in tracker time (one run, one fit: the sender's
    // made-up clock runs a little slow against the host's, and the fit finds that skew) ...
    const timestamps = readFileSync(tsv, 'utf8').trimEnd().split('\n').slice(1).map((line) => Number(line.split('\t')[0]));
    const step = (timestamps[499]! - timestamps[0]!) / 499;
    for (let k = 1; k < 500; k++) expect(timestamps[k]! - timestamps[k - 1]!).toBeCloseTo(step, 5);
    // ... on the session clock, where each sample arrived shortly after its mapped time (datagrams of 20 ms, loopback delay).
    let k = 0;
    for await (const g of reader.gaze()) {
      const arrivalS = (g.arrivalNs - reader.info.createdHostNs) / 1e9;
      expect(Math.abs(arrivalS - timestamps[k++]!)).toBeLessThan(0.1);
    }
    expect(timestamps[0]).toBeGreaterThan(0.1); // the session clock starts at the session's creation, before the sender
  });

  it('says plainly when a folder is not a session', async () => {
    const inspected = await cli(['recording', 'inspect', root, '--json']);
    expect(inspected.code).toBe(2);
    expect(inspected.stderr).toBe(`gazeloom recording inspect: ${root}: not a session folder (no session.json)\n`);
    const exported = await cli(['recording', 'export', join(root, 'nowhere'), '--out', join(root, 'x.tsv')]);
    expect(exported.code).toBe(2);
    expect(exported.stderr).toMatch(/nowhere: not a session folder/);
  });

  it('refuses a folder that is not empty before listening, and a malformed address', async () => {
    const busy = join(root, 'busy');
    mkdirSync(busy);
    writeFileSync(join(busy, 'forklift.csv'), 't,x,y,p\n');
    const refused = await cli(['record', '--listen', 'udp://127.0.0.1:0', '--seconds', '1', '--out', busy]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toMatch(/busy: is not empty \(1 entry, e.g. "forklift.csv"\)/);
    expect(readdirSync(busy)).toEqual(['forklift.csv']);
    const bad = await cli(['record', '--listen', 'udp:/127.0.0.1', '--seconds', '1', '--out', join(root, 'never')]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/feed address must look like udp:\/\/HOST:PORT/);
    const half = await cli(['record', '--listen', 'udp://127.0.0.1:0', '--seconds', '1', '--out', join(root, 'never'), '--resolution', '1920x1080']);
    expect(half.stderr).toMatch(/give --screen-mm, --resolution and --distance-mm together/);
    expect(readdirSync(root)).not.toContain('never');
  });
});
