import { execFile } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';
import { decodeTable } from '../../app/core/archive/table-codec';
import { tableFile, tableNames } from '../../app/core/archive/archive-manifest';
import { decryptText, unlockWithPassphrase } from '../../app/core/crypto';
import { checkParticipantCode } from '../../app/core/study/participant-code';
import { inspectSession } from '../../app/host/recording/inspect-session';
import { readLabArchive } from '../../app/host/archive/verify-lab-archive';

// `gazeloom demo`, `archive inspect` and `archive verify` as a user runs them (the built bundle).
const run = promisify(execFile);
const bin = join(__dirname, '../../bin/gazeloom.mjs');
let dir: string;

async function gazeloom(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, [bin, ...args], { cwd: dir, maxBuffer: 16 << 20 });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'gz-demo-cli-'));
});

describe('gazeloom demo', () => {
  it('--participants 2 writes a lab archive that reads back, validates, and has one heavily drifting participant', async () => {
    const out = join(dir, 'demo2');
    const { code, stdout, stderr } = await gazeloom('demo', '--out', out, '--participants', '2', '--seed', '3', '--json');
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc).toMatchObject({ out, demo: true, sessions: 2, passphrase: 'gazeloom-demo', recovery_key: null, warnings: [] });

    const archive = await readLabArchive(out);
    expect(archive.manifest.demo).toBe(true);
    const rows = Object.fromEntries(tableNames.map((t) => [t, decodeTable(t, archive.tables[t], tableFile(t))]));
    expect(rows.studies).toHaveLength(1);
    expect((rows.studies as { demo: boolean }[])[0]!.demo).toBe(true);
    const participants = rows.participants as { code: string; enrolment: number }[];
    expect(participants.map((p) => p.enrolment)).toEqual([1, 2]);
    for (const p of participants) expect(checkParticipantCode(p.code)).toEqual({ ok: true });
    expect(rows.consents).toHaveLength(2);
    expect(rows.sessions).toHaveLength(2);
    expect(rows.calibrations).toHaveLength(2);
    expect((rows.settings as { demo: boolean }[])[0]!.demo).toBe(true);
    // Each session ran the whole plan, and its recording closed cleanly with the gaze in it.
    const trials = rows.trials as { sessionId: string; kind: string; state: string }[];
    for (const s of rows.sessions as { id: string }[]) {
      const own = trials.filter((t) => t.sessionId === s.id);
      expect(own.filter((t) => t.kind === 'clip')).toHaveLength(5);
      expect(own.every((t) => t.state === 'done')).toBe(true);
      // Read the recording from the archive folder itself: recordings/SESSION is the recorder's folder as it was.
      const report = await inspectSession(join(out, 'recordings', s.id));
      expect(report.cleanClose).toBe(true);
      expect(report.samples).toBeGreaterThan(30_000);
      // A 60 Hz frame log, so gaze maps onto each clip's own time axis.
      expect(report.recovery.streams.frames.records).toBeGreaterThan(60 * 60);
    }
    // The drifting participant (the second) has the larger drift at the drift checks.
    const drift = (sessionId: string) => Math.max(...(rows.validations as { sessionId: string; kind: string; meanAccuracyDeg: number }[]).filter((v) => v.sessionId === sessionId && v.kind === 'drift_check').map((v) => v.meanAccuracyDeg));
    const [first, second] = (rows.sessions as { id: string; participantId: string }[]).sort((a, b) => a.participantId.localeCompare(b.participantId));
    expect(drift(second!.id)).toBeGreaterThan(drift(first!.id) + 0.5);
    expect(doc.participants[1].drift_deg_per_min).toBe(1.5);

    const inspected = await gazeloom('archive', 'inspect', out, '--json');
    expect(inspected.code).toBe(0);
    expect(JSON.parse(inspected.stdout).manifest).toEqual(archive.manifest);
    const verified = await gazeloom('archive', 'verify', out);
    expect(verified.code).toBe(0);
    expect(verified.stdout).toMatch(/intact/);
  });

  it('archive verify exits 1 and names each file that does not match', async () => {
    const out = join(dir, 'tampered.zip');
    expect((await gazeloom('demo', '--out', out, '--participants', '1')).code).toBe(0);
    expect((await gazeloom('archive', 'verify', out)).code).toBe(0);
    const folder = join(dir, 'tampered');
    expect((await gazeloom('demo', '--out', folder, '--participants', '1')).code).toBe(0);
    const file = join(folder, 'tables', 'consents.ndjson');
    writeFileSync(file, readFileSync(file, 'utf8').replace('"publicRelease":true', '"publicRelease":false'));
    const { code, stderr } = await gazeloom('archive', 'verify', folder);
    expect(code).toBe(1);
    expect(stderr).toMatch(/1 problem\(s\): tables\/consents\.ndjson: SHA-256 does not match the manifest/);
    const notArchive = await gazeloom('archive', 'verify', join(dir, 'nowhere'));
    expect(notArchive.code).toBe(2);
  });

  it('--personal-data seals names, e-mail, birth dates and consent notes with the passphrase from the file', async () => {
    const tsv = join(dir, 'people.tsv');
    writeFileSync(tsv, 'name\temail\tbirth_date\tconsent_note\tshare\twithdrawn\nAda Forklift\tada@example.org\t1990-04-01\tprefers mornings\tyes\tno\nBo Conveyor\tbo@example.org\t1985-12-24\t\tno\tyes\n');
    const pass = join(dir, 'pass.txt');
    writeFileSync(pass, 'correct horse aisle\n');
    const out = join(dir, 'personal');
    const { code, stdout, stderr } = await gazeloom('demo', '--out', out, '--personal-data', tsv, '--passphrase-file', pass, '--json');
    expect(stderr).toBe('');
    expect(code).toBe(0);
    expect(JSON.parse(stdout).recovery_key).toMatch(/\S{10,}/);
    // No personal value appears in the archive in the clear.
    for (const t of readdirSync(join(out, 'tables'))) {
      const text = readFileSync(join(out, 'tables', t), 'utf8');
      for (const secret of ['Ada', 'ada@example.org', '1990-04-01', 'prefers mornings', 'Bo Conveyor']) expect(text, t).not.toContain(secret);
    }
    const archive = await readLabArchive(out);
    const [keyring] = decodeTable('settings', archive.tables.settings, 'settings');
    expect(keyring!.demo).toBe(false);
    expect(await unlockWithPassphrase(keyring!, 'correct horse aisle\n')).toBeNull();
    const key = (await unlockWithPassphrase(keyring!, 'correct horse aisle'))!;
    const participants = decodeTable('participants', archive.tables.participants, 'participants');
    expect(await decryptText(key, participants[0]!.name!)).toBe('Ada Forklift');
    expect(await decryptText(key, participants[1]!.contact!)).toBe('bo@example.org');
    expect(await decryptText(key, participants[0]!.birthDate!)).toBe('1990-04-01');
    const consents = decodeTable('consents', archive.tables.consents, 'consents');
    expect(await decryptText(key, consents[0]!.note!)).toBe('prefers mornings');
    expect(consents[0]!.scopes.publicRelease).toBe(true);
    expect(consents[1]!.scopes.publicRelease).toBe(false);
    expect(consents[0]!.withdrawal).toBeNull();
    expect(consents[1]!.withdrawal?.scope).toBe('all_use');
  });

  it('bad personal data is refused naming the line and column', async () => {
    const tsv = join(dir, 'bad.tsv');
    writeFileSync(tsv, 'name\temail\tbirth_date\tconsent_note\tshare\twithdrawn\nAda\tada@example.org\t1990-04-01\t\tmaybe\tno\n');
    const pass = join(dir, 'pass.txt');
    writeFileSync(pass, 'secret\n');
    const bad = await gazeloom('demo', '--out', join(dir, 'never'), '--personal-data', tsv, '--passphrase-file', pass);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toBe(`gazeloom demo: ${tsv}:2: column "share": expected yes or no, got "maybe"\n`);
    const count = await gazeloom('demo', '--out', join(dir, 'never'), '--personal-data', tsv, '--passphrase-file', pass, '--participants', '3');
    expect(count.code).toBe(2);
    const noPass = await gazeloom('demo', '--out', join(dir, 'never'), '--personal-data', tsv);
    expect(noPass.stderr).toMatch(/--personal-data needs --passphrase-file/);
    expect(readdirSync(dir)).not.toContain('never');
    const taken = await gazeloom('demo', '--out', dir);
    expect(taken).toMatchObject({ code: 2, stderr: `gazeloom demo: ${dir}: already exists; choose a new name (an archive is never overwritten)\n` });
  });
});
