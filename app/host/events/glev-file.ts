import { open, rename, rm, type FileHandle } from 'node:fs/promises';
import { dirname } from 'node:path';
import type { EventBatch } from '../../core/events/event-batch';
import { EventFormatError } from '../../core/events/event-format-error';
import { GlevWriter, openGlev, type ByteSource, type GlevReader, type GlevWriterOptions } from '../../core/events/glev';
import { syncDirectory } from '../fs/durable';

export interface GlevFile extends GlevReader {
  close(): Promise<void>;
}

/** Reads into fresh, zero-offset buffers, so chunk columns are aligned for typed-array views. */
function fileSource(handle: FileHandle, size: number, path: string): ByteSource {
  return {
    size,
    async read(offset, length) {
      const bytes = new Uint8Array(length);
      let filled = 0;
      while (filled < length) {
        const { bytesRead } = await handle.read(bytes, filled, length - filled, offset + filled);
        if (bytesRead === 0) throw new EventFormatError(path, `byte ${offset + filled}`, `the file ended early: it had ${size} bytes when opened (was it changed while open?)`);
        filled += bytesRead;
      }
      return bytes;
    },
  };
}

/** Opens a .glev file for random access; close() releases the file handle. */
export async function openGlevFile(path: string): Promise<GlevFile> {
  const handle = await open(path, 'r');
  try {
    const { size } = await handle.stat();
    const reader = await openGlev(fileSource(handle, size, path), path);
    return { ...reader, close: () => handle.close() };
  } catch (error) {
    await handle.close();
    throw error;
  }
}

async function writeAll(handle: FileHandle, bytes: Uint8Array, position: number): Promise<void> {
  let written = 0;
  while (written < bytes.length) {
    const result = await handle.write(bytes, written, bytes.length - written, position + written);
    written += result.bytesWritten;
  }
}

export interface GlevWriteSummary {
  readonly eventCount: number;
  readonly chunkCount: number;
  readonly bytes: number;
}

/**
 * Writes batches to a .glev file without ever leaving a half-written one at `path`: the
 * bytes go to path + '.partial', the finished header over its placeholder, then the file is
 * fsynced, renamed over `path` and the folder fsynced. On any error the partial file is
 * removed and `path` keeps whatever it held before. onProgress gets the events written so far.
 */
export async function writeGlevFile(
  path: string,
  options: GlevWriterOptions,
  batches: AsyncIterable<EventBatch> | Iterable<EventBatch>,
  onProgress?: (eventsWritten: number) => void,
): Promise<GlevWriteSummary> {
  const pending: Uint8Array[] = [];
  const writer = new GlevWriter(options, (bytes) => pending.push(bytes)); // bad options fail before any file exists
  const partial = `${path}.partial`;
  const handle = await open(partial, 'w');
  let handleOpen = true;
  try {
    let position = 0;
    const drain = async () => {
      for (const bytes of pending.splice(0)) {
        await writeAll(handle, bytes, position);
        position += bytes.length;
      }
    };
    for await (const batch of batches) {
      writer.push(batch);
      await drain();
      onProgress?.(writer.eventCount);
    }
    const header = writer.finish();
    await drain();
    await writeAll(handle, header, 0);
    await handle.sync();
    handleOpen = false;
    await handle.close();
    await rename(partial, path);
    await syncDirectory(dirname(path));
    return { eventCount: writer.eventCount, chunkCount: writer.chunkCount, bytes: position };
  } catch (error) {
    if (handleOpen) await handle.close();
    await rm(partial, { force: true });
    throw error;
  }
}
