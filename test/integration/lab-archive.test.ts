import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ArchiveFormatError } from '../../app/core/archive/archive-error';
import { encodeTable } from '../../app/core/archive/table-codec';
import type { TableName } from '../../app/core/study/records';
import { inspectLabArchive } from '../../app/host/archive/inspect-lab-archive';
import { restoreRecordings, RestoreConflictError } from '../../app/host/archive/restore-recordings';
import { readLabArchive, verifyLabArchive } from '../../app/host/archive/verify-lab-archive';
import { writeLabArchive } from '../../app/host/archive/write-lab-archive';
import { writeFixtureSession } from '../fixtures/recording/session-fixture';
import { sampleTables } from '../unit/core/archive/lab-records';

const root = mkdtempSync(join(tmpdir(), 'gz-archive-'));
const python = '/usr/bin/python3';

async function setUp(name: string): Promise<{ tables: Partial<Record<TableName, string>>; sessionDir: string }> {
  const sessionDir = join(root, name, 'recordings', 'fixture-session');
  await writeFixtureSession(sessionDir, 4);
  const tables = Object.fromEntries(Object.entries(sampleTables()).map(([t, records]) => [t, encodeTable(t as TableName, records)]));
  return { tables, sessionDir };
}

const sessionFiles = (dir: string) => Object.fromEntries(readdirSync(dir).map((f) => [f, readFileSync(join(dir, f)).toString('hex')]));

describe('lab archive', () => {
  for (const kind of ['folder', 'zip'] as const) {
    it(`round trip (${kind}): tables and recordings come back byte for byte`, async () => {
      const { tables, sessionDir } = await setUp(`round-${kind}`);
      const dest = join(root, `round-${kind}`, kind === 'zip' ? 'lab.zip' : 'lab');
      const manifest = await writeLabArchive(dest, { tables, sessionDirs: [sessionDir], demo: false });
      expect(manifest.tables.participants).toMatchObject({ file: 'tables/participants.ndjson', records: 1 });
      expect(manifest.tables.audit!.records).toBe(2);
      expect(manifest.tables.sessions!.records).toBe(0);
      expect(Object.keys(manifest.recordings['fixture-session']!.files)).toContain('gaze.chunks');
      expect(await inspectLabArchive(dest)).toEqual(manifest);

      const archive = await readLabArchive(dest);
      expect(archive.problems).toEqual([]);
      expect(archive.tables.participants).toBe(tables.participants);
      expect(archive.tables.audit).toBe(tables.audit);
      expect(archive.tables.calibrations).toBe('');

      const recordings = join(root, `round-${kind}`, 'restored');
      expect(await restoreRecordings(archive, recordings)).toEqual({ restored: ['fixture-session'], alreadyPresent: [] });
      expect(sessionFiles(join(recordings, 'fixture-session'))).toEqual(sessionFiles(sessionDir));
      // Restoring again finds the same session already there and leaves it.
      expect(await restoreRecordings(archive, recordings)).toEqual({ restored: [], alreadyPresent: ['fixture-session'] });
    });
  }

  it('never overwrites an existing archive or a different session of the same id', async () => {
    const { tables, sessionDir } = await setUp('conflict');
    const dest = join(root, 'conflict', 'lab');
    await writeLabArchive(dest, { tables, sessionDirs: [sessionDir], demo: false });
    await expect(writeLabArchive(dest, { tables, sessionDirs: [], demo: false })).rejects.toThrow(/already exists/);
    const other = join(root, 'conflict', 'data');
    await writeFixtureSession(join(other, 'fixture-session'), 2, 9);
    const before = sessionFiles(join(other, 'fixture-session'));
    await expect(restoreRecordings(await readLabArchive(dest), other)).rejects.toThrow(RestoreConflictError);
    expect(sessionFiles(join(other, 'fixture-session'))).toEqual(before);
  });

  it('refuses a table with a bad record before writing anything', async () => {
    const dest = join(root, 'bad-table', 'lab.zip');
    await expect(writeLabArchive(dest, { tables: { studies: '{"id":"s"}\n' }, sessionDirs: [], demo: false })).rejects.toThrow(/^tables\/studies\.ndjson:1: name: /);
    expect(() => readdirSync(join(root, 'bad-table'))).toThrow();
  });

  it('detects a tampered table and names the file (folder)', async () => {
    const { tables, sessionDir } = await setUp('tamper');
    const dest = join(root, 'tamper', 'lab');
    await writeLabArchive(dest, { tables, sessionDirs: [sessionDir], demo: false });
    const file = join(dest, 'tables', 'participants.ndjson');
    writeFileSync(file, readFileSync(file, 'utf8').replace('"age":31', '"age":32'));
    const gaze = join(dest, 'recordings', 'fixture-session', 'gaze.chunks');
    const bytes = readFileSync(gaze);
    bytes[bytes.length - 1] ^= 1;
    writeFileSync(gaze, bytes);
    writeFileSync(join(dest, 'tables', 'extra.txt'), 'hello');
    const { problems } = await verifyLabArchive(dest);
    expect(problems).toEqual([
      { file: 'tables/participants.ndjson', problem: 'SHA-256 does not match the manifest: the file was changed or damaged' },
      { file: 'recordings/fixture-session/gaze.chunks', problem: 'SHA-256 does not match the manifest: the file was changed or damaged' },
      { file: 'tables/extra.txt', problem: 'not listed in the manifest' },
    ]);
    await expect(readLabArchive(dest)).rejects.toThrow(new ArchiveFormatError('tables/participants.ndjson', 'SHA-256 does not match the manifest: the file was changed or damaged (and 2 more problems)'));
  });

  it('detects a damaged zip entry by its CRC and names the entry', async () => {
    const { tables } = await setUp('tamper-zip');
    const dest = join(root, 'tamper-zip', 'lab.zip');
    await writeLabArchive(dest, { tables, sessionDirs: [], demo: false });
    // Python's zipfile stores nothing we rely on; use it to find where the entry's data is.
    const offset = Number(execFileSync(python, ['-c', 'import sys,zipfile,struct\nz=zipfile.ZipFile(sys.argv[1]);i=z.getinfo("tables/studies.ndjson");f=open(sys.argv[1],"rb");f.seek(i.header_offset);h=f.read(30);n,e=struct.unpack("<HH",h[26:30]);print(i.header_offset+30+n+e+i.compress_size//2)', dest]).toString());
    const bytes = readFileSync(dest);
    bytes[offset] ^= 0x55;
    writeFileSync(dest, bytes);
    const { problems } = await verifyLabArchive(dest);
    expect(problems).toHaveLength(1);
    expect(problems[0]!.file).toBe('tables/studies.ndjson');
  });

  it("writes zips that Python's zipfile reads and tests cleanly (an independent reader)", async () => {
    const { tables, sessionDir } = await setUp('python');
    const dest = join(root, 'python', 'lab.zip');
    const manifest = await writeLabArchive(dest, { tables, sessionDirs: [sessionDir], demo: true });
    const script = [
      'import sys, zipfile, json, hashlib',
      'z = zipfile.ZipFile(sys.argv[1])',
      'assert z.testzip() is None',
      'm = json.loads(z.read("manifest.json"))',
      'out = {"names": sorted(z.namelist()), "manifest": m, "sha": {n: hashlib.sha256(z.read(n)).hexdigest() for n in z.namelist()}, "time": z.getinfo("manifest.json").date_time}',
      'print(json.dumps(out))',
    ].join('\n');
    const seen = JSON.parse(execFileSync(python, ['-c', script, dest]).toString()) as { names: string[]; manifest: unknown; sha: Record<string, string>; time: number[] };
    expect(seen.manifest).toEqual(manifest);
    // The entry's MS-DOS time (two-second resolution) is the archive's creation time in UTC.
    const made = new Date(manifest.createdAt);
    expect(seen.time).toEqual([made.getUTCFullYear(), made.getUTCMonth() + 1, made.getUTCDate(), made.getUTCHours(), made.getUTCMinutes(), made.getUTCSeconds() & ~1]);
    for (const [t, entry] of Object.entries(manifest.tables)) expect(seen.sha[entry.file], t).toBe(entry.sha256);
    for (const [rel, f] of Object.entries(manifest.recordings['fixture-session']!.files)) expect(seen.sha[`recordings/fixture-session/${rel}`]).toBe(f.sha256);
    expect(seen.names).toHaveLength(Object.keys(manifest.tables).length + Object.keys(manifest.recordings['fixture-session']!.files).length + 1);
    // And `python3 -m zipfile -t`, the command-line check, agrees.
    expect(execFileSync(python, ['-m', 'zipfile', '-t', dest]).toString()).toMatch(/Done testing/);
  });

  it("reads zips made by Python's zipfile, at the root or under one top folder", async () => {
    const { tables, sessionDir } = await setUp('from-python');
    const folder = join(root, 'from-python', 'lab');
    await writeLabArchive(folder, { tables, sessionDirs: [sessionDir], demo: false });
    for (const [name, prefix, method] of [['flat.zip', '', 'ZIP_DEFLATED'], ['nested.zip', 'lab/', 'ZIP_STORED']] as const) {
      const zip = join(root, 'from-python', name);
      const script = `import os, sys, zipfile\nz = zipfile.ZipFile(sys.argv[2], "w", zipfile.${method})\nfor d, _, fs in os.walk(sys.argv[1]):\n  for f in fs:\n    p = os.path.join(d, f); z.write(p, sys.argv[3] + os.path.relpath(p, sys.argv[1]))\nz.close()`;
      execFileSync(python, ['-c', script, folder, zip, prefix]);
      const archive = await readLabArchive(zip);
      expect(archive.tables.participants).toBe(tables.participants);
      const restored = join(root, 'from-python', `restored-${name}`);
      await restoreRecordings(archive, restored);
      expect(sessionFiles(join(restored, 'fixture-session'))).toEqual(sessionFiles(sessionDir));
    }
  });
});
