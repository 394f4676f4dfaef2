import { createHash } from 'node:crypto';
import { open, rename, rm } from 'node:fs/promises';
import { dirname } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createDeflateRaw } from 'node:zlib';
import { encodeCentralDirectory, encodeLocalHeader, ZIP_DEFLATED, type ZipEntry } from '../../core/archive/zip-layout';
import { crc32 } from '../../core/checksum/crc32';
import { syncDirectory, temporarySibling } from '../fs/durable';
import { chunksOf, type ArchiveSink } from './archive-sink';

/**
 * A .zip archive written by our own small writer: each entry deflated (node:zlib) as it
 * streams in, its local header written in place before it once the CRC-32 and sizes are
 * known (so no data descriptors are needed), the central directory last.
 * The file is staged beside `dest`, fsynced and renamed over it.
 */
export async function createZipSink(dest: string, at: Date): Promise<ArchiveSink> {
  const staging = temporarySibling(dest);
  const handle = await open(staging, 'wx');
  const entries: ZipEntry[] = [];
  let position = 0;
  let closed = false;
  const writeAt = async (bytes: Uint8Array, offset: number) => {
    let done = 0;
    while (done < bytes.length) done += (await handle.write(bytes, done, bytes.length - done, offset + done)).bytesWritten;
  };
  const close = async () => {
    if (!closed) await handle.close();
    closed = true;
  };
  return {
    async add(name, content) {
      const localHeaderOffset = position;
      const placeholder: ZipEntry = { name, method: ZIP_DEFLATED, crc32: 0, compressedSize: 0, size: 0, localHeaderOffset };
      // The header's length depends only on the name; it is written once the sizes are known.
      position += encodeLocalHeader(placeholder, at).length;
      const dataStart = position;
      const hash = createHash('sha256');
      let crc = 0;
      let size = 0;
      async function* tapped(): AsyncIterable<Uint8Array> {
        for await (const chunk of chunksOf(content)) {
          crc = crc32(chunk, crc);
          size += chunk.length;
          hash.update(chunk);
          yield chunk;
        }
      }
      await pipeline(Readable.from(tapped()), createDeflateRaw(), async (compressed: AsyncIterable<Buffer>) => {
        for await (const chunk of compressed) {
          await writeAt(chunk, position);
          position += chunk.length;
        }
      });
      const entry: ZipEntry = { ...placeholder, crc32: crc, size, compressedSize: position - dataStart };
      await writeAt(encodeLocalHeader(entry, at), localHeaderOffset);
      entries.push(entry);
      return { bytes: size, sha256: hash.digest('hex') };
    },
    async commit() {
      await writeAt(encodeCentralDirectory(entries, position, at), position);
      await handle.sync();
      await close();
      await rename(staging, dest);
      await syncDirectory(dirname(dest));
    },
    async abort() {
      await close();
      await rm(staging, { force: true });
    },
  };
}
