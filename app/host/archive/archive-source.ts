import { stat } from 'node:fs/promises';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { openFolderSource } from './folder-source';
import { openZipSource } from './zip-source';

/** A lab archive being read, folder or .zip alike. */
export interface ArchiveSource {
  readonly path: string;
  /** Every file, named relative to the archive's root with "/" separators, and its size. */
  readonly files: ReadonlyMap<string, number>;
  /** The file's bytes as stored (a zip entry's CRC-32 and size are checked as it inflates). */
  read(name: string): AsyncIterable<Uint8Array>;
}

/** Opens `path` as a folder archive or, when it is a file, as a .zip. */
export async function openArchiveSource(path: string): Promise<ArchiveSource> {
  let info;
  try {
    info = await stat(path);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new ArchiveFormatError(path, 'no such file or folder');
    throw error;
  }
  return info.isDirectory() ? openFolderSource(path) : openZipSource(path, info.size);
}

export async function readAll(source: ArchiveSource, name: string): Promise<Uint8Array> {
  const chunks: Uint8Array[] = [];
  for await (const chunk of source.read(name)) chunks.push(chunk);
  return Buffer.concat(chunks);
}
