import { createReadStream } from 'node:fs';
import { readdir, stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { ArchiveSource } from './archive-source';

async function walk(root: string, prefix: string, out: Map<string, number>): Promise<void> {
  for (const entry of await readdir(join(root, prefix), { withFileTypes: true })) {
    const name = prefix === '' ? entry.name : `${prefix}/${entry.name}`;
    if (entry.isDirectory()) await walk(root, name, out);
    else out.set(name, (await stat(join(root, name))).size);
  }
}

export async function openFolderSource(path: string): Promise<ArchiveSource> {
  const files = new Map<string, number>();
  await walk(path, '', files);
  return { path, files, read: (name) => createReadStream(join(path, ...name.split('/'))) };
}
