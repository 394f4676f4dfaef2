import { mkdir, readFile, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { tableNames } from '../../core/archive/archive-manifest';
import type { FirstRunJob } from '../first-run';
import { writeFileDurably } from '../fs/durable';
import { restoreRecordings } from '../archive/restore-recordings';
import { readLabArchive } from '../archive/verify-lab-archive';
import { writeLabArchive } from '../archive/write-lab-archive';
import { demoRecipeVersion } from '../stimuli/demo-clips';
import { buildDemoStudy } from './build-demo-study';

export type DemoStudyState = { state: 'building' | 'ready' | 'none' | 'failed'; tables?: Record<string, string>; message?: string };

/** What the cached demo was built from; a different recipe version or builder version rebuilds it. */
const BUILD = { builder: 1, recipeVersion: demoRecipeVersion, participants: 6, seed: 1 };

/**
 * The demo study, built once per host into dataDir/demo-study/ (a lab archive folder and a
 * note of what it was built from) by a first-run job, its recordings copied into the data
 * folder's recordings/, and handed to the console (getDemoStudy) to import into an empty
 * database, so a new user sees every screen filled. Invented data, marked demo throughout.
 */
export class DemoStudyCache {
  private status: DemoStudyState;
  private tables: Record<string, string> | null = null;
  private readonly folder: string;

  constructor(
    dataDir: string,
    private readonly recordingsDir: string,
    enabled: boolean,
  ) {
    this.folder = join(dataDir, 'demo-study');
    this.status = enabled ? { state: 'building', message: 'waiting for the first-run work' } : { state: 'none', message: 'the demo study is switched off (--no-demo or GAZELOOM_NO_DEMO=1)' };
  }

  get archivePath(): string {
    return join(this.folder, 'archive');
  }

  private get notePath(): string {
    return join(this.folder, 'built.json');
  }

  async get(): Promise<DemoStudyState> {
    if (this.status.state !== 'ready') return this.status;
    this.tables ??= (await readLabArchive(this.archivePath)).tables;
    return { ...this.status, tables: this.tables };
  }

  private async cached(): Promise<boolean> {
    try {
      return JSON.stringify(JSON.parse(await readFile(this.notePath, 'utf8'))) === JSON.stringify(BUILD);
    } catch {
      return false;
    }
  }

  job(): FirstRunJob {
    return {
      id: 'demo-study',
      label: 'Build the demo study',
      run: async (report) => {
        try {
          const reused = await this.cached();
          if (!reused) {
            await rm(this.folder, { recursive: true, force: true });
            const work = join(this.folder, '.recordings');
            await mkdir(work, { recursive: true });
            const study = await buildDemoStudy({ participants: BUILD.participants, seed: BUILD.seed, recordingsDir: work, onProgress: (f, label) => report(f * 0.9, label) });
            report(0.9, 'writing the demo lab archive');
            await writeLabArchive(this.archivePath, { tables: study.tables, sessionDirs: study.sessionDirs, demo: true });
            await rm(work, { recursive: true, force: true });
            await writeFileDurably(this.notePath, `${JSON.stringify(BUILD)}\n`);
          }
          const archive = await readLabArchive(this.archivePath);
          await restoreRecordings(archive, this.recordingsDir);
          this.tables = archive.tables;
          const participants = archive.manifest.tables.participants?.records ?? 0;
          this.status = { state: 'ready', message: `demo study of ${participants} simulated participants${reused ? ' (cached)' : ''}` };
          return `${this.status.message}; ${tableNames.length} tables`;
        } catch (error) {
          this.status = { state: 'failed', message: (error as Error).message };
          throw error;
        }
      },
    };
  }
}
