import { existsSync, mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { channels, type GazeloomHandlers } from '../../app/contract';
import { createDispatcher } from '../../app/contract/dispatcher';
import { tableNames } from '../../app/core/archive/archive-manifest';
import { countRecords } from '../../app/core/archive/table-codec';
import { DemoStudyCache } from '../../app/host/demo/demo-study-cache';
import { archiveHandlers } from '../../app/host/handlers/archive-handlers';

// The archive channels through the host's validating dispatcher, with the demo study the
// first-run job builds: build, back up, list, inspect, restore into another data folder.
const log = { warn: () => undefined, error: (event: string, fields: unknown) => console.error(event, fields) };
const context = { page: 'console' as const, connectionId: 'console-1' };

function hostOf(dataDir: string, demo: DemoStudyCache) {
  const dispatch = createDispatcher(channels, archiveHandlers({ dataDir, recordingsDir: join(dataDir, 'recordings'), demo }) as unknown as GazeloomHandlers, log);
  return async (channel: string, payload: unknown): Promise<any> => dispatch(channel, payload, context);
}

describe('archive channels and the demo study', () => {
  it('say "none" when the demo is switched off', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-nodemo-'));
    const call = hostOf(dataDir, new DemoStudyCache(dataDir, join(dataDir, 'recordings'), false));
    expect(await call('getDemoStudy', {})).toMatchObject({ ok: true, value: { state: 'none' } });
    expect(await call('listLabBackups', {})).toEqual({ ok: true, value: { backupsDir: join(dataDir, 'backups'), backups: [] } });
  });

  it('build the demo once, back it up, and restore it into an empty data folder', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-demo-host-'));
    const demo = new DemoStudyCache(dataDir, join(dataDir, 'recordings'), true);
    const call = hostOf(dataDir, demo);
    expect(await call('getDemoStudy', {})).toMatchObject({ ok: true, value: { state: 'building' } });
    expect(await demo.job().run(() => undefined)).toBe(`demo study of 6 simulated participants; ${tableNames.length} tables`);
    const ready = await call('getDemoStudy', {});
    expect(ready.value.state).toBe('ready');
    expect(countRecords(ready.value.tables.participants)).toBe(6);
    const sessions = readdirSync(join(dataDir, 'recordings'));
    expect(sessions).toHaveLength(6);
    // A second host on the same data folder finds the cache and builds nothing.
    expect(await new DemoStudyCache(dataDir, join(dataDir, 'recordings'), true).job().run(() => undefined)).toMatch(/\(cached\)/);

    const backup = await call('backupLabArchive', { tables: ready.value.tables, sessionIds: [...sessions, 'session-not-here'], zip: true });
    expect(backup.ok).toBe(true);
    expect(backup.value.path).toMatch(/backups\/lab-\d{8}-\d{6}\.zip$/);
    const again = await call('backupLabArchive', { tables: ready.value.tables, sessionIds: [], zip: true });
    expect(again.value.path).not.toBe(backup.value.path);
    expect(backup.value.missingRecordings).toEqual(['session-not-here']);
    expect(backup.value.manifest.demo).toBe(true);
    expect(Object.keys(backup.value.manifest.recordings).sort()).toEqual([...sessions].sort());
    expect(await call('backupLabArchive', { tables: {}, sessionIds: ['../../etc'] })).toMatchObject({ ok: false, code: 'bad_input', path: 'request.sessionIds' });

    const listed = await call('listLabBackups', {});
    expect(listed.value.backups.map((b: { path: string }) => b.path)).toEqual([again.value.path, backup.value.path]);
    expect(listed.value.backups[1]).toMatchObject({ path: backup.value.path, kind: 'zip', problem: null });
    expect((await call('inspectLabArchive', { path: backup.value.path })).value.manifest).toEqual(backup.value.manifest);

    const fresh = mkdtempSync(join(tmpdir(), 'gz-fresh-'));
    const other = hostOf(fresh, new DemoStudyCache(fresh, join(fresh, 'recordings'), false));
    const restored = await other('restoreLabArchive', { path: backup.value.path });
    expect(restored.ok).toBe(true);
    expect(restored.value.tables).toEqual(ready.value.tables);
    expect(restored.value.restored.sort()).toEqual([...sessions].sort());
    expect(readdirSync(join(fresh, 'recordings')).sort()).toEqual([...sessions].sort());
    expect((await other('restoreLabArchive', { path: backup.value.path })).value.alreadyPresent).toHaveLength(6);
    const missing = await other('restoreLabArchive', { path: join(fresh, 'no-such.zip') });
    expect(missing).toMatchObject({ ok: false, code: 'bad_input' });
    expect(missing.message).toContain('no-such.zip');
    expect(existsSync(join(dataDir, 'demo-study', 'archive', 'manifest.json'))).toBe(true);
  });
});
