import { open, type FileHandle } from 'node:fs/promises';
import { crc32 } from '../../core/checksum/crc32';
import { EventFormatError } from '../../core/events/event-format-error';
import { chunkByteLength, readU64 } from '../../core/events/glev/layout';
import type { CompactEventChunk } from '../../core/playback/event-chunk-queue';
import { openGlevFile, type GlevFile } from '../events/glev-file';
import type { ChunkSource } from './chunk-source';

/**
 * Reads a stimulus's .glev chunks for playback without decoding them: each chunk's dt, x
 * and yp columns go to the stage as they are on disk (8 bytes per event), after the
 * chunk's CRC32 is checked. The stage decodes them as they fall due.
 */
export class CompactChunkReader implements ChunkSource {
  private constructor(
    private readonly file: GlevFile,
    private readonly handle: FileHandle,
    private readonly path: string,
  ) {}

  static async open(path: string): Promise<CompactChunkReader> {
    const file = await openGlevFile(path);
    try {
      return new CompactChunkReader(file, await open(path, 'r'), path);
    } catch (error) {
      await file.close();
      throw error;
    }
  }

  get name(): string {
    return this.path;
  }
  get sensor() {
    return this.file.sensor;
  }
  get resolution() {
    return this.file.resolution;
  }
  get eventCount(): number {
    return this.file.eventCount;
  }
  get tStartUs(): number {
    return this.file.tStartUs;
  }
  get tEndUs(): number {
    return this.file.tEndUs;
  }
  get chunkCount(): number {
    return this.file.chunkCount;
  }
  chunkStartUs(k: number): number {
    return this.file.chunks[k]!.tFirstUs;
  }

  private get ticksPerUs(): 1 | 1000 {
    return this.file.resolution === 'ns' ? 1000 : 1;
  }

  async read(k: number): Promise<CompactEventChunk> {
    const chunk = this.file.chunks[k];
    if (!chunk) throw new RangeError(`chunk ${k} does not exist (the file has ${this.file.chunkCount})`);
    const length = chunkByteLength(chunk.count);
    const bytes = new Uint8Array(length); // a fresh buffer: the columns are aligned views of it
    await this.handle.read(bytes, 0, length, chunk.byteOffset);
    const view = new DataView(bytes.buffer);
    const stored = view.getUint32(length - 4, true);
    if (crc32(bytes.subarray(0, length - 4)) !== stored) {
      throw new EventFormatError(this.path, `chunk ${k}, byte ${chunk.byteOffset}`, 'the chunk fails its CRC32 check: the file was damaged after import');
    }
    const n = chunk.count;
    return {
      baseUs: readU64(view, 0) / this.ticksPerUs,
      ticksPerUs: this.ticksPerUs,
      dt: new Uint32Array(bytes.buffer, 12, n),
      x: new Uint16Array(bytes.buffer, 12 + 4 * n, n),
      yp: new Uint16Array(bytes.buffer, 12 + 6 * n, n),
    };
  }

  async close(): Promise<void> {
    await Promise.all([this.file.close(), this.handle.close()]);
  }
}
