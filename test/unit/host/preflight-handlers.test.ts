import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { channels } from '../../../app/contract';
import { expectedRecordingBytes, preflightHandlers } from '../../../app/host/handlers/preflight-handlers';

const root = mkdtempSync(join(tmpdir(), 'gazeloom-preflight-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
const context = { page: 'console', connectionId: 'console-1' } as const;

/** Free bytes as Python's os.statvfs reports them (f_bavail × f_frsize): an independent reader of statfs(2). */
function pythonFreeBytes(dir: string): number {
  const run = spawnSync('/usr/bin/python3', ['-c', 'import os,sys; s=os.statvfs(sys.argv[1]); print(s.f_bavail*s.f_frsize)', dir], { encoding: 'utf8' });
  if (run.status !== 0) throw new Error(run.stderr);
  return Number(run.stdout.trim());
}

describe('the pre-flight disk check', () => {
  it('reports the free space of the recordings folder as statvfs does, creating the folder first', async () => {
    const dir = join(root, 'recordings');
    const result = await preflightHandlers(dir).getPreflight({ expectedSeconds: 600, rateHz: 1000 }, context);
    expect(existsSync(dir)).toBe(true);
    if (!('freeBytes' in result)) throw new Error(JSON.stringify(result));
    expect(result.recordingsDir).toBe(dir);
    // Other processes write meanwhile: agree within 64 MiB.
    expect(Math.abs(result.freeBytes - pythonFreeBytes(dir))).toBeLessThan(64 * 2 ** 20);
    expect(result.neededBytes).toBe(expectedRecordingBytes(600, 1000));
    expect(channels.getPreflight.response.safeParse(result).success).toBe(true);
  });

  it('sizes a recording from the gaze and frame records it will hold, with margin', () => {
    // 10 min at 1000 Hz: 88-byte gaze records and up to 240 48-byte frame records a second, twice over, plus 256 MiB.
    expect(expectedRecordingBytes(600, 1000)).toBe(Math.ceil(600 * (1000 * 88 + 240 * 48) * 2) + 256 * 2 ** 20);
    expect(expectedRecordingBytes(1200, 1000)).toBeGreaterThan(expectedRecordingBytes(600, 1000));
    expect(expectedRecordingBytes(600, 2000)).toBeGreaterThan(expectedRecordingBytes(600, 1000));
  });

  it('says clearly when the folder cannot be used', async () => {
    const blocked = join(root, 'file');
    await import('node:fs/promises').then((fs) => fs.writeFile(blocked, 'not a folder'));
    const result = await preflightHandlers(join(blocked, 'recordings')).getPreflight({ expectedSeconds: 60, rateHz: 500 }, context);
    expect(result).toMatchObject({ ok: false, code: 'unavailable' });
    expect((result as { message: string }).message).toContain(join(blocked, 'recordings'));
  });

  it('refuses impossible requests at the boundary', () => {
    expect(channels.getPreflight.request.safeParse({ expectedSeconds: -1, rateHz: 500 }).success).toBe(false);
    expect(channels.getPreflight.request.safeParse({ expectedSeconds: 60, rateHz: 0 }).success).toBe(false);
    expect(channels.getPreflight.request.safeParse({ expectedSeconds: 60, rateHz: 500, extra: 1 }).success).toBe(false);
  });
});
