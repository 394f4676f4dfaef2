import { mkdir, rm, statfs, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { FirstRunJob } from './first-run';

export const dataFolders = ['recordings', 'stimuli', 'archives', 'logs'] as const;

/** Makes the data folder's layout and proves it is writable, reporting the free space. */
export function dataFolderJob(dataDir: string): FirstRunJob {
  return {
    id: 'data-folder',
    label: 'Prepare the data folder',
    async run(report) {
      for (const [index, name] of dataFolders.entries()) {
        await mkdir(join(dataDir, name), { recursive: true });
        report((index + 1) / (dataFolders.length + 1), `created ${name}/`);
      }
      const probe = join(dataDir, `.write-check-${process.pid}`);
      await writeFile(probe, 'ok');
      await rm(probe);
      const fs = await statfs(dataDir);
      const freeGiB = (fs.bavail * fs.bsize) / 2 ** 30;
      return `${dataDir} is writable, ${freeGiB.toFixed(1)} GiB free`;
    },
  };
}
