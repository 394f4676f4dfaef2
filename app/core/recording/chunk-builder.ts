import type { RecordStream } from './chunk-format';

/**
 * Collects the records of one stream until the recorder seals them into a chunk. append
 * validates and encodes at once, so a bad record fails in the caller's hands, not in a
 * background write; take returns the sealed chunk (header and payload) and starts over.
 */
export interface ChunkBuilder<R> {
  readonly stream: RecordStream;
  readonly count: number;
  readonly payloadBytes: number;
  append(record: R): void;
  take(seq: number): Uint8Array;
}

/** The smallest and largest host time seen, for the chunk header. */
export class HostTimeRange {
  min = Infinity;
  max = -Infinity;

  add(hostNs: number): void {
    if (hostNs < this.min) this.min = hostNs;
    if (hostNs > this.max) this.max = hostNs;
  }

  reset(): void {
    this.min = Infinity;
    this.max = -Infinity;
  }
}
