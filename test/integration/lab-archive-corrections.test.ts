import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { MANIFEST_FILE } from '../../app/core/archive/archive-manifest';
import { decodeTable, encodeTable } from '../../app/core/archive/table-codec';
import type { CorrectionRecord, TableName } from '../../app/core/study/records';
import { readLabArchive, verifyLabArchive } from '../../app/host/archive/verify-lab-archive';
import { writeLabArchive } from '../../app/host/archive/write-lab-archive';
import { sampleTables } from '../unit/core/archive/lab-records';

const root = mkdtempSync(join(tmpdir(), 'gz-archive-corr-'));
const correction: CorrectionRecord = {
  id: 'corr-1',
  sessionId: 'session-1',
  model: 'polynomial2',
  params: { centre: { x: 950, y: 530 }, scale: { x: 770, y: 430 }, ax: [960, 770, 2, 1, 0.5, -0.2], ay: [540, 1, 430, 0.3, -0.1, 0.4] },
  fromValidationIds: ['val-1'],
  heldOutValidationIds: ['val-2'],
  fit: { points: 9, rmsResidualPx: 6.7, heldOutErrorBeforeDeg: 1.41, heldOutErrorAfterDeg: 0.41 },
  createdAt: '2026-03-02T11:00:00.000Z',
  createdBy: 'op-1',
  enabled: true,
  removedAt: null,
};
const tablesWith = (extra: Partial<Record<TableName, string>>) => ({ ...Object.fromEntries(Object.entries(sampleTables()).map(([t, records]) => [t, encodeTable(t as TableName, records)])), ...extra });

describe('the lab archive and the corrections table', () => {
  it('keeps a session’s corrections like any other table', async () => {
    const text = encodeTable('corrections', [correction]);
    const dest = join(root, 'with');
    const manifest = await writeLabArchive(dest, { tables: tablesWith({ corrections: text }), sessionDirs: [], demo: false });
    expect(manifest.tables.corrections).toMatchObject({ file: 'tables/corrections.ndjson', records: 1 });
    const archive = await readLabArchive(dest);
    expect(archive.tables.corrections).toBe(text);
    expect(decodeTable('corrections', archive.tables.corrections, 'tables/corrections.ndjson')).toEqual([correction]);
  });

  it('reads an archive written before corrections existed (no tables/corrections.ndjson) as an empty table', async () => {
    const dest = join(root, 'older');
    await writeLabArchive(dest, { tables: tablesWith({}), sessionDirs: [], demo: false });
    // What an archive from before the corrections table looks like: no file, no manifest entry.
    const manifest = JSON.parse(readFileSync(join(dest, MANIFEST_FILE), 'utf8')) as { tables: Record<string, unknown> };
    delete manifest.tables.corrections;
    writeFileSync(join(dest, MANIFEST_FILE), `${JSON.stringify(manifest, null, 2)}\n`);
    rmSync(join(dest, 'tables', 'corrections.ndjson'));
    expect((await verifyLabArchive(dest)).problems).toEqual([]);
    const archive = await readLabArchive(dest);
    expect(archive.tables.corrections).toBe('');
    expect(decodeTable('corrections', archive.tables.corrections, 'tables/corrections.ndjson')).toEqual([]);
    expect(archive.tables.participants).toBe(tablesWith({}).participants);
  });

  it('refuses a correction record that does not match the schema, naming the table and line', async () => {
    const bad = `${JSON.stringify({ ...correction, model: 'spline' })}\n`;
    await expect(writeLabArchive(join(root, 'bad'), { tables: tablesWith({ corrections: bad }), sessionDirs: [], demo: false })).rejects.toThrow(/tables\/corrections\.ndjson:1: model/);
  });
});
