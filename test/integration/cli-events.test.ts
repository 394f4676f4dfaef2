import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';

// The built `gazeloom` command, run as a user runs it (npm test builds dist/ first).
const run = promisify(execFile);
const bin = join(__dirname, '../../bin/gazeloom.mjs');
let dir: string;

async function gazeloom(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, [bin, ...args], { cwd: dir });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

const file = (name: string, text: string) => {
  writeFileSync(join(dir, name), text);
  return join(dir, name);
};

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'gz-cli-'));
});

describe('gazeloom events', () => {
  it('stats --json prints exactly one document with every figure, warnings inside it', async () => {
    const csv = file('s.csv', 't,x,y,p\n0,0,0,1\n500,3,1,0\n1000,3,1,1\n1000,2,2,1\n');
    const { code, stdout, stderr } = await gazeloom('events', 'stats', csv, '--json');
    expect(code).toBe(0);
    expect(stderr).toBe('');
    const doc = JSON.parse(stdout);
    expect(doc).toMatchObject({ count: 4, t_start_us: 0, t_end_us: 1000, duration_s: 0.001, width: 4, height: 3, on_count: 3, off_count: 1 });
    expect(doc.mean_rate_hz).toBeCloseTo(4000, 9);
    expect(doc.peak_rate_hz).toBe(2000); // 1 ms bins from t_start: [0,1) ms holds 2 events, [1,2) ms holds 2
    expect(doc.warnings).toEqual([expect.stringContaining('does not state its sensor size; using 4x3')]);
    expect(doc).toHaveProperty('rate_series');
    expect(doc).toHaveProperty('hot_pixels');
  });

  it('converts text to .glev and back without losing anything, for µs and ns streams', async () => {
    const us = file('us.csv', '# width=640 height=480\nt,x,y,p\n5,639,479,1\n5,0,0,0\n70000000,10,20,1\n');
    expect((await gazeloom('events', 'convert', us, join(dir, 'us.glev'))).code).toBe(0);
    expect((await gazeloom('events', 'convert', join(dir, 'us.glev'), join(dir, 'us-back.csv'))).code).toBe(0);
    expect(readFileSync(join(dir, 'us-back.csv'), 'utf8')).toBe(readFileSync(us, 'utf8'));

    const seconds = file('ns.txt', '# width=240 height=180\n0.000000001 1 2 1\n1.234567891 3 4 -1\n');
    expect((await gazeloom('events', 'convert', seconds, join(dir, 'ns.glev'))).code).toBe(0);
    expect((await gazeloom('events', 'convert', join(dir, 'ns.glev'), join(dir, 'ns.csv'))).code).toBe(0);
    expect(readFileSync(join(dir, 'ns.csv'), 'utf8')).toBe('# width=240 height=180\nt_ns,x,y,p\n1,1,2,1\n1234567891,3,4,0\n');
    expect((await gazeloom('events', 'convert', join(dir, 'ns.csv'), join(dir, 'ns2.glev'))).code).toBe(0);
    expect(readFileSync(join(dir, 'ns2.glev'))).toEqual(readFileSync(join(dir, 'ns.glev')));
  });

  it('trims, crops and filters into new files', async () => {
    const rows = Array.from({ length: 100 }, (_, i) => `${1_000_000 + i * 10_000},${i % 10},${Math.floor(i / 10)},1`);
    const csv = file('grid.csv', `# width=10 height=10\nt,x,y,p\n${rows.join('\n')}\n`);
    const trim = JSON.parse((await gazeloom('events', 'trim', csv, join(dir, 't.glev'), '--from', '0.1', '--to', '0.3', '--json')).stdout);
    expect(trim).toMatchObject({ events_read: 100, events_written: 20 });
    const crop = JSON.parse((await gazeloom('events', 'crop', csv, join(dir, 'c.glev'), '--region', '0,0,5,2', '--json')).stdout);
    expect(crop).toMatchObject({ events_written: 10, width: 5, height: 2 });
    const filter = JSON.parse((await gazeloom('events', 'filter', csv, join(dir, 'f.glev'), '--background-activity-ms', '15', '--json')).stdout);
    // Each event's left neighbour fired 10 ms earlier, except at the start of every row.
    expect(filter.events_written).toBe(90);
  });

  it('simulates the warehouse scene with its tracks', async () => {
    const { code, stdout } = await gazeloom('events', 'simulate', '--scene', 'warehouse', '--duration', '0.05', '--seed', '3', '--out', join(dir, 'sim.glev'), '--tracks', join(dir, 'sim.tsv'), '--width', '160', '--height', '120', '--json');
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc.events).toBeGreaterThan(0);
    const tracks = readFileSync(join(dir, 'sim.tsv'), 'utf8').split('\n');
    expect(tracks[0]).toBe('t_s\tobject_id\tkind\tcx\tcy\tx0\ty0\tx1\ty1');
    expect(tracks.filter(Boolean).length - 1).toBe(doc.track_rows);
    const stats = JSON.parse((await gazeloom('events', 'stats', join(dir, 'sim.glev'), '--json')).stdout);
    expect(stats).toMatchObject({ count: doc.events, width: 160, height: 120, warnings: [] });
  });

  it.each([
    [['events', 'stats', 'missing.csv'], 'missing.csv: no such file'],
    [['events', 'stats', 'bad.csv'], 'bad.csv line 3: '],
    [['events', 'stats', 'bad.csv', '--width', '10'], 'give --width and --height together'],
    [['events', 'convert', 'bad.csv', 'out.bin'], 'OUT must end in .glev or .csv'],
    [['events', 'crop', 'bad.csv', 'o.glev', '--region', '1,2,3'], '--region must be X,Y,WIDTH,HEIGHT'],
    [['events', 'stats', 'bad.csv', '--time-unit', 'hours'], '--time-unit must be one of us, ns, ms, s'],
    [['events', 'simulate', '--scene', 'harbour', '--duration', '1', '--seed', '1', '--out', 'a.glev', '--tracks', 'a.tsv'], '--scene must be "warehouse"'],
  ])('gazeloom %j exits 2 with one line saying what is wrong', async (args, message) => {
    file('bad.csv', 't,x,y,p\n0,1,1,1\n1,x,1,1\n');
    const { code, stdout, stderr } = await gazeloom(...args, '--json');
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(stderr).toContain(message);
  });
});
