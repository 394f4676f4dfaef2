import { execFile, execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';
import { tableFile } from '../../app/core/archive/archive-manifest';
import { decodeTable } from '../../app/core/archive/table-codec';
import type { ValidationRecord } from '../../app/core/study/records';
import { readLabArchive } from '../../app/host/archive/verify-lab-archive';
import { readSession } from '../../app/host/recording/read-session';

// `gazeloom quality` and `gazeloom quality validation` as a user runs them (the built bundle).
const run = promisify(execFile);
const bin = join(__dirname, '../../bin/gazeloom.mjs');
const fixtures = join(__dirname, '../fixtures/quality');
const hasNumpy = spawnSync('/usr/bin/python3', ['-c', 'import numpy'], { stdio: 'ignore' }).status === 0;
let dir: string;

async function gazeloom(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, [bin, ...args], { cwd: dir, maxBuffer: 64 << 20 });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

type Printed = {
  session: string;
  participant: string;
  validations: { time_s: number; mean_accuracy_deg: number; max_accuracy_deg: number; precision_rms_s2s_deg: number; precision_sd_deg: number; data_loss_pct: number; accepted: boolean }[];
  drift: { time_s: number; dx_deg: number; dy_deg: number; offset_deg: number }[];
  drift_rate_deg_per_min: number | null;
  flags: string[];
};

const mean = (values: number[]) => values.reduce((a, b) => a + b, 0) / values.length;

describe('gazeloom quality --archive on a demo study of 3 participants', () => {
  let archive: string;
  let demo: { participants: { session_id: string; drift_deg_per_min: number }[] };

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'gz-quality-cli-'));
    archive = join(dir, 'demo3');
    const made = await gazeloom('demo', '--out', archive, '--participants', '3', '--json');
    expect(made.code).toBe(0);
    demo = JSON.parse(made.stdout);
  }, 60_000);

  it('flags the heavy-drift participant with drift_exceeded, and only that one', async () => {
    const { code, stdout, stderr } = await gazeloom('quality', '--archive', archive, '--json');
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const doc = JSON.parse(stdout) as { sessions: Printed[]; warnings: string[] };
    expect(doc.warnings).toEqual([]);
    expect(doc.sessions).toHaveLength(3);
    const heavy = demo.participants.find((p) => p.drift_deg_per_min >= 1)!.session_id;
    for (const s of doc.sessions) {
      if (s.session === heavy) expect(s.flags).toContain('drift_exceeded');
      else expect(s.flags).not.toContain('drift_exceeded');
    }
    const text = await gazeloom('quality', '--archive', archive);
    expect(text.stdout).toMatch(new RegExp(`${heavy} \\(participant [^)]+\\): FLAGGED .*drift_exceeded`));
  });

  it('prints the figures of the archive\'s own validation records, with times from each session\'s first gaze sample', async () => {
    const doc = JSON.parse((await gazeloom('quality', '--archive', archive, '--json')).stdout) as { sessions: Printed[] };
    const tables = (await readLabArchive(archive)).tables;
    const sessions = decodeTable('sessions', tables.sessions, tableFile('sessions'));
    const records = decodeTable('validations', tables.validations, tableFile('validations'));
    expect(doc.sessions.map((s) => s.session)).toEqual(sessions.map((s) => s.id));
    for (const s of doc.sessions) {
      expect(s.participant).toBe(sessions.find((r) => r.id === s.session)!.participantId);
      let firstNs = Infinity;
      for await (const g of (await readSession(join(archive, 'recordings', s.session))).gaze()) firstNs = Math.min(firstNs, g.hostNs);
      const own = (kind: ValidationRecord['kind']) => records.filter((v) => v.sessionId === s.session && v.kind === kind).sort((a, b) => a.hostNs - b.hostNs);
      const validations = own('validation');
      expect(s.validations).toHaveLength(validations.length);
      validations.forEach((v, i) => {
        const got = s.validations[i]!;
        expect(got.mean_accuracy_deg).toBe(v.meanAccuracyDeg);
        expect(got.max_accuracy_deg).toBe(v.maxAccuracyDeg);
        expect(got.accepted).toBe(v.accepted);
        expect(got.precision_rms_s2s_deg).toBeCloseTo(mean(v.points.map((p) => p.precisionRmsS2SDeg!)), 12);
        expect(got.precision_sd_deg).toBeCloseTo(mean(v.points.map((p) => p.precisionSdDeg!)), 12);
        expect(got.data_loss_pct).toBeCloseTo(mean(v.points.map((p) => p.dataLossPct)), 12);
        expect(got.time_s).toBeCloseTo((v.hostNs - firstNs) / 1e9, 9);
      });
      const checks = own('drift_check');
      expect(checks.length).toBeGreaterThanOrEqual(2);
      expect(s.drift.map((d) => d.offset_deg)).toEqual(checks.map((c) => c.meanAccuracyDeg));
      expect(s.drift.map((d) => d.dx_deg)).toEqual(checks.map((c) => c.points[0]!.dxDeg));
      expect(s.drift.map((d) => d.dy_deg)).toEqual(checks.map((c) => c.points[0]!.dyDeg));
      s.drift.forEach((d, i) => expect(d.time_s).toBeCloseTo((checks[i]!.hostNs - firstNs) / 1e9, 9));
    }
  });

  it.skipIf(!hasNumpy)('gives each drift rate equal to numpy.polyfit on the printed drift checks (quality_reference.py)', async () => {
    const doc = JSON.parse((await gazeloom('quality', '--archive', archive, '--json')).stdout) as { sessions: Printed[] };
    const drift = doc.sessions.map((s) => ({ t: s.drift.map((d) => d.time_s), offset: s.drift.map((d) => d.offset_deg) }));
    const numpy = JSON.parse(execFileSync('/usr/bin/python3', [join(fixtures, 'quality_reference.py'), '--stdin'], { input: JSON.stringify({ drift, gaze: [] }), encoding: 'utf8' })) as { drift: { rate_deg_per_min: number }[] };
    doc.sessions.forEach((s, i) => expect(Math.abs(s.drift_rate_deg_per_min! - numpy.drift[i]!.rate_deg_per_min)).toBeLessThan(1e-9));
  });

  it('reads one session of a .zip archive the same way, and names what is wrong with bad input', async () => {
    const zip = join(dir, 'demo3.zip');
    expect((await gazeloom('demo', '--out', zip, '--participants', '3')).code).toBe(0);
    const folder = JSON.parse((await gazeloom('quality', '--archive', archive, '--json')).stdout) as { sessions: Printed[] };
    const id = folder.sessions[1]!.session;
    const one = JSON.parse((await gazeloom('quality', '--archive', zip, '--session', id, '--json')).stdout) as { sessions: Printed[] };
    expect(one.sessions).toEqual([folder.sessions[1]]);

    const unknown = await gazeloom('quality', '--archive', archive, '--session', 'nobody', '--json');
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/^gazeloom quality: .*demo3: no session "nobody" \(the archive holds demo-session-1-/);
    expect(await gazeloom('quality', '--json')).toMatchObject({ code: 2, stderr: 'gazeloom quality: --archive is required\n' });
    expect((await gazeloom('quality', '--archive', join(dir, 'nowhere'))).code).toBe(2);
  }, 60_000);
});

describe('gazeloom quality validation from files', () => {
  const geometryArgs = (e: { screen_mm: string; resolution: string; distance_mm: number }) => ['--screen-mm', e.screen_mm, '--resolution', e.resolution, '--distance-mm', String(e.distance_mm)];
  type Point = { x: number; y: number; accuracy_deg: number | null; precision_rms_s2s_deg: number | null; precision_sd_deg: number | null; data_loss_pct: number; samples: number };
  const expected = JSON.parse(readFileSync(join(fixtures, 'validation_expected.json'), 'utf8')) as { screen_mm: string; resolution: string; distance_mm: number; rate_hz: number; points: Point[]; mean_accuracy_deg: number; max_accuracy_deg: number };

  beforeAll(() => {
    dir ??= mkdtempSync(join(tmpdir(), 'gz-quality-cli-'));
  });

  it('matches numpy on the same samples (validation_files.py, numpy 1.24), a target without valid gaze included', async () => {
    const { code, stdout, stderr } = await gazeloom('quality', 'validation', '--input', join(fixtures, 'validation_gaze.tsv'), '--targets', join(fixtures, 'validation_targets.tsv'), ...geometryArgs(expected), '--json');
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const doc = JSON.parse(stdout) as { points: Point[]; mean_accuracy_deg: number; max_accuracy_deg: number; rate_hz: number };
    expect(doc.points).toHaveLength(expected.points.length);
    doc.points.forEach((p, i) => {
      const e = expected.points[i]!;
      expect({ x: p.x, y: p.y, samples: p.samples }).toEqual({ x: e.x, y: e.y, samples: e.samples });
      expect(p.data_loss_pct).toBeCloseTo(e.data_loss_pct, 9);
      for (const key of ['accuracy_deg', 'precision_rms_s2s_deg', 'precision_sd_deg'] as const) {
        if (e[key] === null) expect(p[key], `${key} of point ${i}`).toBeNull();
        else expect(Math.abs(p[key]! - e[key]!), `${key} of point ${i}`).toBeLessThan(1e-10);
      }
    });
    expect(Math.abs(doc.mean_accuracy_deg - expected.mean_accuracy_deg)).toBeLessThan(1e-10);
    expect(doc.max_accuracy_deg).toBeCloseTo(expected.max_accuracy_deg, 10);
    expect(doc.rate_hz).toBeCloseTo(expected.rate_hz, 6);
  });

  it.skipIf(!hasNumpy)('the stored files and values are what validation_files.py writes today', () => {
    const fresh = mkdtempSync(join(tmpdir(), 'gz-quality-fixture-'));
    execFileSync('/usr/bin/python3', [join(fixtures, 'validation_files.py'), fresh]);
    for (const f of ['validation_gaze.tsv', 'validation_targets.tsv', 'validation_expected.json']) expect(readFileSync(join(fresh, f), 'utf8'), f).toBe(readFileSync(join(fixtures, f), 'utf8'));
  });

  it('gives the REFERENCES.md section 3 values on that check turned into screen pixels through the section 1 geometry', async () => {
    // Holmqvist, Nyström and Mulvey 2012 (ETRA), via REFERENCES.md §3: gx, gy in degrees around a
    // target at (0, 0), placed at the screen centre of §1's 53 cm / 1920 px screen at 60 cm
    // (square pixels: 1080 px are 298.125 mm), each axis's angle turned into pixels as tan(θ)·D.
    const gx = [0.5, 0.62, 0.41, 0.55, 0.47, 0.58];
    const gy = [0.2, 0.31, 0.12, 0.26, 0.18, 0.22];
    const pxPerMm = 1920 / 530;
    const px = (deg: number, centre: number) => centre + Math.tan((deg * Math.PI) / 180) * 600 * pxPerMm;
    // 10 Hz rows; target 1's window (0.3–1.3 s) holds the six samples then four invalid ones,
    // target 2's holds the valid mask 1101110011 of §3 at the centre.
    const mask = '1101110011';
    const rows = Array.from({ length: 40 }, (_, k) => {
      const t = 0.05 + 0.1 * k;
      let cell = ['n/a', 'n/a'];
      if (k >= 3 && k <= 8) cell = [String(px(gx[k - 3]!, 960)), String(px(gy[k - 3]!, 540))];
      if (k >= 23 && k <= 32 && mask[k - 23] === '1') cell = ['960', '540'];
      return `${t.toFixed(6)}\t${cell[0]}\t${cell[1]}`;
    });
    const gaze = join(dir, 'ref3_gaze.tsv');
    const targets = join(dir, 'ref3_targets.tsv');
    writeFileSync(gaze, `timestamp\tx_coordinate\ty_coordinate\n${rows.join('\n')}\n`);
    writeFileSync(targets, 'onset\tduration\tx\ty\n0\t2\t960\t540\n2\t2\t960\t540\n');
    const { code, stdout } = await gazeloom('quality', 'validation', '--input', gaze, '--targets', targets, '--screen-mm', '530x298.125', '--resolution', '1920x1080', '--distance-mm', '600', '--json');
    expect(code).toBe(0);
    const [first, second] = (JSON.parse(stdout) as { points: Point[] }).points;
    // §3's values are flat arithmetic in degrees; seen from the eye, the same gaze in pixels
    // differs by under 1e-5° this close to the centre (the tangent's curvature), while the
    // per-sample accuracy 0.5651446443386273 differs from the offset of the mean by 9e-4°.
    expect(Math.abs(first!.accuracy_deg! - 0.5642349786313421)).toBeLessThan(2e-5);
    expect(Math.abs(first!.precision_rms_s2s_deg! - 0.1856879102149626)).toBeLessThan(2e-5);
    expect(Math.abs(first!.precision_sd_deg! - 0.09222556888171282)).toBeLessThan(2e-5);
    expect(first).toMatchObject({ samples: 6, data_loss_pct: 40 });
    expect(second).toMatchObject({ samples: 7, data_loss_pct: 30, accuracy_deg: 0 });
  });

  it('names the file, line and column of a bad cell, and refuses a bad window or a target shorter than it', async () => {
    const gaze = join(dir, 'bad_gaze.tsv');
    writeFileSync(gaze, 'timestamp\tx_coordinate\ty_coordinate\n0.000\t10\t20\n0.002\tleft\t20\n');
    const targets = join(dir, 'targets.tsv');
    writeFileSync(targets, 'onset\tduration\tx\ty\n0\t1.5\t960\t540\n');
    const geometry = ['--screen-mm', '531x299', '--resolution', '1920x1080', '--distance-mm', '650'];
    const bad = await gazeloom('quality', 'validation', '--input', gaze, '--targets', targets, ...geometry);
    expect(bad).toMatchObject({ code: 2, stderr: `gazeloom quality validation: ${gaze}:3: column "x_coordinate": expected a number or n/a, got "left"\n` });
    const good = join(dir, 'good_gaze.tsv');
    writeFileSync(good, 'timestamp\tx_coordinate\ty_coordinate\n0.000\t10\t20\n0.002\tn/a\tn/a\n');
    const window = await gazeloom('quality', 'validation', '--input', good, '--targets', targets, ...geometry, '--window-ms', '900-300');
    expect(window.stderr).toMatch(/--window-ms must be FROM-TO in milliseconds after onset with FROM < TO, e.g. 300-1300, got "900-300"/);
    const short = await gazeloom('quality', 'validation', '--input', good, '--targets', targets, ...geometry, '--window-ms', '300-1600');
    expect(short).toMatchObject({ code: 2, stderr: `gazeloom quality validation: ${targets}:2: the target is shown for 1500 ms, less than the sample window's end at 1600 ms after onset\n` });
    const noHeader = join(dir, 'noheader.tsv');
    writeFileSync(noHeader, 'onset\tx\ty\n0\t1\t1\n');
    expect((await gazeloom('quality', 'validation', '--input', good, '--targets', noHeader, ...geometry)).stderr).toMatch(/noheader.tsv:1: the header row lacks "duration"/);
    expect((await gazeloom('quality', 'validation', '--input', good, '--targets', targets)).stderr).toMatch(/--screen-mm, --resolution and --distance-mm are required/);
  });
});
