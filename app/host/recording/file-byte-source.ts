import { open } from 'node:fs/promises';
import type { ByteSource } from '../../core/events/glev';

const WINDOW_BYTES = 1 << 20;

export interface FileByteSource extends ByteSource {
  close(): Promise<void>;
}

/**
 * A file as a ByteSource, read ahead a megabyte at a time for the front-to-back walks of
 * the chunk scanner. `size` is the size when opened, so a file still being appended to
 * reads as the prefix that existed then. Each window is a fresh buffer, never refilled,
 * so bytes returned earlier stay valid. A missing file reads as empty.
 */
export async function openFileByteSource(path: string): Promise<FileByteSource> {
  let handle;
  try {
    handle = await open(path, 'r');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return { size: 0, read: async () => new Uint8Array(0), close: async () => undefined };
    throw error;
  }
  const file = handle;
  const { size } = await file.stat();
  let windowStart = 0;
  let window: Uint8Array = new Uint8Array(0);

  const readExactly = async (offset: number, length: number): Promise<Uint8Array> => {
    const bytes = new Uint8Array(length);
    for (let filled = 0; filled < length; ) {
      const { bytesRead } = await file.read(bytes, filled, length - filled, offset + filled);
      if (bytesRead === 0) throw new Error(`${path}: ended at byte ${offset + filled}, before the ${size} bytes it had when opened`);
      filled += bytesRead;
    }
    return bytes;
  };

  return {
    size,
    async read(offset, length) {
      if (offset < 0 || offset + length > size) throw new RangeError(`read of ${length} bytes at ${offset} is outside ${path} (${size} bytes)`);
      if (offset >= windowStart && offset + length <= windowStart + window.length) return window.subarray(offset - windowStart, offset - windowStart + length);
      if (length >= WINDOW_BYTES) return readExactly(offset, length);
      window = await readExactly(offset, Math.min(WINDOW_BYTES, size - offset));
      windowStart = offset;
      return window.subarray(0, length);
    },
    close: () => file.close(),
  };
}
