import { open, type FileHandle } from 'node:fs/promises';
import type { RecordStream } from '../../core/recording/chunk-format';

/**
 * One stream file, opened for appending only (O_APPEND: every write lands at the end,
 * whatever else happens, so nothing already written can be overwritten). Sealed chunks
 * wait in a queue; `write` hands all of them to the OS in one call, `sync` makes what was
 * written durable. A failed write puts its chunks back at the front of the queue to be
 * retried; if part of it reached the file, readers see that part as one damaged stretch
 * followed by the retried chunks.
 */
export class StreamWriter {
  private queue: Uint8Array[] = [];
  private queuedBytes = 0;
  private writtenBytes: number;
  private syncedBytes: number;

  private constructor(
    readonly stream: RecordStream,
    private readonly handle: FileHandle,
    startBytes: number,
  ) {
    this.writtenBytes = startBytes;
    this.syncedBytes = startBytes;
  }

  /** `create` refuses an existing file; otherwise the file is appended to (and created if missing). */
  static async open(path: string, stream: RecordStream, mode: 'create' | 'append'): Promise<StreamWriter> {
    const handle = await open(path, mode === 'create' ? 'ax' : 'a');
    const { size } = await handle.stat();
    return new StreamWriter(stream, handle, size);
  }

  /** Queues a sealed chunk and returns the offset it will have in the file. */
  enqueue(chunk: Uint8Array): number {
    const offset = this.writtenBytes + this.queuedBytes;
    this.queue.push(chunk);
    this.queuedBytes += chunk.length;
    return offset;
  }

  get bytes(): number {
    return this.writtenBytes;
  }

  get durableBytes(): number {
    return this.syncedBytes;
  }

  get pending(): boolean {
    return this.queue.length > 0 || this.syncedBytes < this.writtenBytes;
  }

  async write(): Promise<void> {
    if (this.queue.length === 0) return;
    const chunks = this.queue;
    const total = this.queuedBytes;
    this.queue = [];
    this.queuedBytes = 0;
    try {
      const done = (await this.handle.writev(chunks)).bytesWritten;
      if (done < total) {
        // A short write (rare for regular files) continues with the rest.
        const rest = concat(chunks).subarray(done);
        for (let at = 0; at < rest.length; ) at += (await this.handle.write(rest, at)).bytesWritten;
      }
    } catch (error) {
      this.queue = [...chunks, ...this.queue];
      this.queuedBytes += total;
      throw error;
    }
    this.writtenBytes += total;
  }

  async sync(): Promise<void> {
    const target = this.writtenBytes;
    if (this.syncedBytes >= target) return;
    await this.handle.sync();
    this.syncedBytes = target;
  }

  close(): Promise<void> {
    return this.handle.close();
  }
}

function concat(chunks: readonly Uint8Array[]): Uint8Array {
  const all = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
  let at = 0;
  for (const c of chunks) {
    all.set(c, at);
    at += c.length;
  }
  return all;
}
