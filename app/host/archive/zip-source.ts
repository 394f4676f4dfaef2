import { createReadStream } from 'node:fs';
import { open } from 'node:fs/promises';
import { createInflateRaw } from 'node:zlib';
import { ArchiveFormatError } from '../../core/archive/archive-error';
import { MANIFEST_FILE } from '../../core/archive/archive-manifest';
import { END_RECORD_BYTES, findCentralDirectory, LOCAL_HEADER_BYTES, localDataOffset, parseCentralDirectory, ZIP_STORED, type ZipEntry } from '../../core/archive/zip-layout';
import { crc32 } from '../../core/checksum/crc32';
import type { ArchiveSource } from './archive-source';

const MAX_COMMENT = 0xffff;

async function readRange(path: string, start: number, length: number): Promise<Uint8Array> {
  const handle = await open(path, 'r');
  try {
    const out = new Uint8Array(length);
    const { bytesRead } = await handle.read(out, 0, length, start);
    return out.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/**
 * The archive's files when the zip holds them under one top folder (a folder archive zipped
 * by another tool, e.g. `zip -r lab.zip lab/`): that folder is the root.
 */
function rootPrefix(entries: readonly ZipEntry[]): string {
  if (entries.some((e) => e.name === MANIFEST_FILE)) return '';
  const nested = entries.filter((e) => /^[^/]+\/manifest\.json$/.test(e.name));
  return nested.length === 1 ? nested[0]!.name.slice(0, -MANIFEST_FILE.length) : '';
}

async function* entryBytes(path: string, entry: ZipEntry): AsyncIterable<Uint8Array> {
  const fail = (problem: string) => new ArchiveFormatError(`${path}: ${entry.name}`, problem);
  const start = localDataOffset(await readRange(path, entry.localHeaderOffset, LOCAL_HEADER_BYTES), entry);
  if (typeof start === 'string') throw new ArchiveFormatError(path, start);
  let crc = 0;
  let size = 0;
  if (entry.compressedSize > 0) {
    const raw = createReadStream(path, { start, end: start + entry.compressedSize - 1 });
    const stream = entry.method === ZIP_STORED ? raw : raw.pipe(createInflateRaw());
    raw.on('error', (error) => stream.destroy(error));
    try {
      for await (const chunk of stream as AsyncIterable<Buffer>) {
        crc = crc32(chunk, crc);
        size += chunk.length;
        yield chunk;
      }
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code?.startsWith('Z_')) throw fail(`compressed data is damaged (${(error as Error).message})`);
      throw error;
    }
  }
  if (size !== entry.size) throw fail(`holds ${size} bytes, the zip directory says ${entry.size} (damaged or truncated)`);
  if (crc !== entry.crc32) throw fail('CRC-32 does not match the zip directory (damaged)');
}

export async function openZipSource(path: string, fileSize: number): Promise<ArchiveSource> {
  const tailLength = Math.min(fileSize, END_RECORD_BYTES + MAX_COMMENT);
  const located = findCentralDirectory(await readRange(path, fileSize - tailLength, tailLength), fileSize);
  if (typeof located === 'string') throw new ArchiveFormatError(path, located);
  const entries = parseCentralDirectory(await readRange(path, located.offset, located.size), located.count);
  if (typeof entries === 'string') throw new ArchiveFormatError(path, entries);
  const prefix = rootPrefix(entries);
  const byName = new Map<string, ZipEntry>();
  for (const entry of entries) {
    if (entry.name.endsWith('/') || !entry.name.startsWith(prefix)) continue; // folders, and files outside the root
    const name = entry.name.slice(prefix.length);
    if (byName.has(name)) throw new ArchiveFormatError(path, `"${entry.name}" appears twice in the zip directory`);
    byName.set(name, entry);
  }
  const files = new Map([...byName].map(([name, e]) => [name, e.size]));
  return {
    path,
    files,
    read(name) {
      const entry = byName.get(name);
      if (!entry) throw new ArchiveFormatError(path, `no "${name}" in the archive`);
      return entryBytes(path, entry);
    },
  };
}
