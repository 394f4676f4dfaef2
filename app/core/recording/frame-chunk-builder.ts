import type { ChunkBuilder } from './chunk-builder';
import { HostTimeRange } from './chunk-builder';
import { checkFrameRecord, encodeClipTable, FRAME_RECORD_BYTES, NO_CLIP, writeFrameRecord } from './frame-codec';
import { GrowableChunk } from './growable-chunk';
import type { FrameRecord } from './records';

export class FrameChunkBuilder implements ChunkBuilder<FrameRecord> {
  readonly stream = 'frames';
  private readonly chunk = new GrowableChunk(64 * FRAME_RECORD_BYTES);
  private readonly range = new HostTimeRange();
  private clips = new Map<string, number>();
  private records = 0;

  get count(): number {
    return this.records;
  }

  get payloadBytes(): number {
    return this.chunk.payloadBytes;
  }

  append(record: FrameRecord): void {
    checkFrameRecord(record);
    let clipIndex = NO_CLIP;
    if (record.clip !== null) {
      clipIndex = this.clips.get(record.clip) ?? this.clips.size;
      // Index 0xFFFF means "no clip"; the recorder seals chunks long before (4096 records at most).
      if (clipIndex >= NO_CLIP) throw new RangeError(`a frames chunk holds at most ${NO_CLIP} distinct clips; take the chunk first`);
      this.clips.set(record.clip, clipIndex);
    }
    const at = this.chunk.reserve(FRAME_RECORD_BYTES); // first: it may move the buffer the view belongs to
    writeFrameRecord(this.chunk.view, at, record, clipIndex);
    this.range.add(record.hostNs);
    this.records++;
  }

  take(seq: number): Uint8Array {
    for (const part of encodeClipTable([...this.clips.keys()])) {
      const at = this.chunk.reserve(part.length);
      this.chunk.array.set(part, at);
    }
    const sealed = this.chunk.take({ stream: 'frames', seq, count: this.records, minHostNs: this.range.min, maxHostNs: this.range.max });
    this.range.reset();
    this.clips = new Map();
    this.records = 0;
    return sealed;
  }
}
