import { readdir, stat } from 'node:fs/promises';
import { homedir } from 'node:os';
import { dirname, extname, join, resolve } from 'node:path';
import { fail, type Failure } from '../contract/result';
import type { DirectoryListing } from '../contract/schemas/files';

const importableExtensions = new Set(['.glev', '.csv', '.txt', '.tsv']);

export const isImportable = (name: string): boolean => importableExtensions.has(extname(name).toLowerCase());

/**
 * The host-side file chooser behind the library's import dialog: lists one folder of the
 * host machine (folders first, then files, hidden entries left out), so a recording of
 * many gigabytes is read where it lies and never passes through the page.
 */
export async function listDirectory(path: string | null, places: DirectoryListing['places']): Promise<DirectoryListing | Failure> {
  const target = resolve(path ?? homedir());
  const info = await stat(target).catch(() => null);
  if (!info) return fail('not_found', `${target} does not exist`);
  if (!info.isDirectory()) return fail('bad_input', `${target} is a file, not a folder`);
  let names: string[];
  try {
    names = await readdir(target);
  } catch (error) {
    return fail('unavailable', `cannot read ${target}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  }
  const entries = (
    await Promise.all(
      names
        .filter((name) => !name.startsWith('.'))
        .map(async (name) => {
          const entry = await stat(join(target, name)).catch(() => null);
          if (!entry || !(entry.isDirectory() || entry.isFile())) return null;
          const kind = entry.isDirectory() ? ('directory' as const) : ('file' as const);
          return { name, kind, sizeBytes: kind === 'file' ? entry.size : 0, importable: kind === 'file' && isImportable(name) };
        }),
    )
  )
    .filter((entry) => entry !== null)
    .sort((a, b) => (a.kind === b.kind ? a.name.localeCompare(b.name) : a.kind === 'directory' ? -1 : 1));
  const parent = dirname(target);
  return { path: target, parent: parent === target ? null : parent, entries, places };
}
