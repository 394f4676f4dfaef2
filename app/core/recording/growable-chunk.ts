import { CHUNK_HEADER_BYTES, sealChunk, type ChunkFields } from './chunk-format';

/**
 * The bytes of one chunk being built: header room, then the payload as records are
 * appended, grown by doubling. `take` seals it and starts a fresh buffer, because the
 * sealed one is handed to an asynchronous write and must not change afterwards.
 */
export class GrowableChunk {
  private bytes: Uint8Array;
  private dataView: DataView;
  private used = CHUNK_HEADER_BYTES;

  constructor(private readonly initialPayloadBytes: number) {
    this.bytes = new Uint8Array(CHUNK_HEADER_BYTES + initialPayloadBytes);
    this.dataView = new DataView(this.bytes.buffer);
  }

  get payloadBytes(): number {
    return this.used - CHUNK_HEADER_BYTES;
  }

  /** Makes room for `length` more bytes and returns the offset to write them at; `view` and `array` change when it grows. */
  reserve(length: number): number {
    const at = this.used;
    if (at + length > this.bytes.length) {
      const grown = new Uint8Array(Math.max(this.bytes.length * 2, at + length));
      grown.set(this.bytes.subarray(0, at));
      this.bytes = grown;
      this.dataView = new DataView(grown.buffer);
    }
    this.used += length;
    return at;
  }

  get view(): DataView {
    return this.dataView;
  }

  get array(): Uint8Array {
    return this.bytes;
  }

  take(fields: ChunkFields): Uint8Array {
    const chunk = sealChunk(this.bytes.subarray(0, this.used), fields);
    this.bytes = new Uint8Array(CHUNK_HEADER_BYTES + this.initialPayloadBytes);
    this.dataView = new DataView(this.bytes.buffer);
    this.used = CHUNK_HEADER_BYTES;
    return chunk;
  }
}
