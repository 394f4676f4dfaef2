import { createHash } from 'node:crypto';
import { mkdir, open, rm } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { publishDirectory, syncDirectory, temporarySibling } from '../fs/durable';
import { chunksOf, type ArchiveSink } from './archive-sink';

/** A folder archive: files go to a hidden staging sibling, each fsynced; commit renames it to `dest`. */
export async function createFolderSink(dest: string): Promise<ArchiveSink> {
  const staging = temporarySibling(dest);
  await mkdir(staging);
  const folders = new Set<string>([staging]);
  return {
    async add(name, content) {
      const path = join(staging, ...name.split('/'));
      const folder = dirname(path);
      if (!folders.has(folder)) {
        await mkdir(folder, { recursive: true });
        folders.add(folder);
      }
      const hash = createHash('sha256');
      let bytes = 0;
      const handle = await open(path, 'wx');
      try {
        for await (const chunk of chunksOf(content)) {
          hash.update(chunk);
          bytes += chunk.length;
          await handle.write(chunk);
        }
        await handle.sync();
      } finally {
        await handle.close();
      }
      return { bytes, sha256: hash.digest('hex') };
    },
    async commit() {
      // Deepest folders first, so every entry is durable before the rename publishes it.
      for (const folder of [...folders].sort((a, b) => b.length - a.length)) await syncDirectory(folder);
      await publishDirectory(staging, dest);
    },
    abort: () => rm(staging, { recursive: true, force: true }),
  };
}
