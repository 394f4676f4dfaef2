import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { JobRunner } from '../../app/host/jobs';
import { createHostLog } from '../../app/host/log';
import { demoClipsJob } from '../../app/host/stimuli/demo-clips';
import { StimulusService } from '../../app/host/stimuli/stimulus-service';
import { StimulusStore } from '../../app/host/stimuli/stimulus-store';

let dir: string;
let store: StimulusStore;
let service: StimulusService;
let jobs: JobRunner;
const changes: string[][] = [];

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'gz-library-'));
  const log = createHostLog({ file: null, echo: false });
  store = new StimulusStore(dir, log);
  jobs = new JobRunner(() => undefined, log, 0);
  service = new StimulusService(store, jobs, (ids) => changes.push(ids));
});

const finished = async (jobId: string) => {
  for (;;) {
    const job = jobs.list().find((j) => j.id === jobId)!;
    if (job.state !== 'running') return job;
    await new Promise((r) => setTimeout(r, 5));
  }
};

function writeCsv(name: string, text: string): string {
  const file = join(dir, name);
  writeFileSync(file, text);
  return file;
}

const libraryFolders = () => readdirSync(join(dir, 'stimuli')).filter((n) => !n.startsWith('.'));
const stagingLeftovers = () => {
  try {
    return readdirSync(join(dir, 'stimuli', '.incoming'));
  } catch {
    return [];
  }
};

describe('the stimulus library on the host', () => {
  it('imports a text file with its statistics, and previews a time window of it', async () => {
    const rows = Array.from({ length: 1000 }, (_, i) => `${i * 1000},${i % 32},${(i * 7) % 24},${i % 2}`);
    const path = writeCsv('aisle.csv', `# width=32 height=24\nt,x,y,p\n${rows.join('\n')}\n`);
    const job = await finished(service.startImport({ path }));
    expect(job.state).toBe('done');
    const meta = (await store.get(job.resultId!))!;
    expect(meta).toMatchObject({ name: 'aisle', eventCount: 1000, sensor: { width: 32, height: 24 }, resolution: 'us', tStartUs: 0, tEndUs: 999_000 });
    expect(meta.source).toEqual({ kind: 'import', file: path });
    const stats = (await store.stats(meta.id))!;
    expect(stats).toMatchObject({ count: 1000, on_count: 500, off_count: 500 });
    const window = (await service.readWindow({ id: meta.id, fromUs: 100_000, toUs: 200_000 }))!;
    expect(window.events.t.length).toBe(100);
    expect(window.events.t[0]).toBe(100_000);
    const capped = (await service.readWindow({ id: meta.id, fromUs: 0, toUs: 1e9, maxEvents: 10 }))!;
    expect(capped.truncated).toBe(true);
    expect(Array.from(capped.events.t)).toEqual(Array.from({ length: 10 }, (_, i) => (990 + i) * 1000)); // the latest ones
  });

  it('refuses a bad file with its line, leaving the library unchanged', async () => {
    const good = await finished(service.startImport({ path: writeCsv('good.csv', '# width=4 height=4\nt,x,y,p\n0,1,1,1\n5,2,2,0\n') }));
    expect(good.state).toBe('done');
    const before = libraryFolders();
    for (const [name, text, expected] of [
      ['backwards.csv', 't,x,y,p\n10,1,1,1\n5,1,1,1\n', 'backwards.csv line 3'],
      ['outside.csv', '# width=4 height=4\nt,x,y,p\n0,9,1,1\n', 'outside.csv line 3'],
      ['empty.csv', '', 'empty.csv'],
    ] as const) {
      const job = await finished(service.startImport({ path: writeCsv(name, text) }));
      expect(job.state).toBe('failed');
      expect(job.message).toContain(expected);
    }
    const missing = await finished(service.startImport({ path: join(dir, 'nowhere.csv') }));
    expect(missing.state).toBe('failed');
    expect(libraryFolders()).toEqual(before);
    expect(stagingLeftovers()).toEqual([]);
  });

  it('makes derived stimuli that name their parent, and removal can be undone', async () => {
    const rows = Array.from({ length: 100 }, (_, i) => `${i * 10_000},${i % 8},${i % 6},1`);
    const parent = (await finished(service.startImport({ path: writeCsv('clip.csv', `# width=8 height=6\nt,x,y,p\n${rows.join('\n')}\n`) }))).resultId!;
    const trimmed = await finished(service.startOperation({ id: parent, apply: { operation: 'trim', fromUs: 100_000, toUs: 300_000 } }));
    const meta = (await store.get(trimmed.resultId!))!;
    expect(meta.eventCount).toBe(20);
    expect(meta.source).toEqual({ kind: 'operation', parentId: parent, operation: 'trim', parameters: { fromUs: 100_000, toUs: 300_000 } });
    const cropped = await finished(service.startOperation({ id: parent, apply: { operation: 'crop', x0: 0, y0: 0, width: 4, height: 3 } }));
    expect((await store.get(cropped.resultId!))!.sensor).toEqual({ width: 4, height: 3 });
    await service.forget(parent);
    await store.remove(parent);
    expect(await store.get(parent)).toBeNull();
    expect(await store.restore(parent)).toBe(true);
    expect((await store.get(parent))!.eventCount).toBe(100);
  });

  it('makes demo clips once per data folder, with their ground-truth tracks', async () => {
    const recipes = [{ id: 'demo-test-beacon', name: 'Demo: beacon', objects: ['beacon'] as const, durationS: 0.05, seed: 7, mayFlash: true }];
    const first = await demoClipsJob(store, () => undefined, recipes).run(() => undefined);
    expect(first).toBe('made 1 demo clips');
    const meta = (await store.get('demo-test-beacon'))!;
    expect(meta).toMatchObject({ demo: true, hasTracks: true, mayFlash: true, source: { kind: 'simulation', seed: 7 } });
    expect(readdirSync(store.files('demo-test-beacon').dir).sort()).toEqual(['events.glev', 'meta.json', 'stats.json', 'tracks.tsv']);
    const second = await demoClipsJob(store, () => undefined, recipes).run(() => undefined);
    expect(second).toBe('1 demo clips already in the library');
  });
});
