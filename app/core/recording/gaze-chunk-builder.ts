import type { ChunkBuilder } from './chunk-builder';
import { HostTimeRange } from './chunk-builder';
import { checkGazeRecord, GAZE_RECORD_BYTES, writeGazeRecord } from './gaze-codec';
import { GrowableChunk } from './growable-chunk';
import type { GazeRecord } from './records';

export class GazeChunkBuilder implements ChunkBuilder<GazeRecord> {
  readonly stream = 'gaze';
  private readonly chunk = new GrowableChunk(256 * GAZE_RECORD_BYTES);
  private readonly range = new HostTimeRange();
  private records = 0;

  get count(): number {
    return this.records;
  }

  get payloadBytes(): number {
    return this.chunk.payloadBytes;
  }

  append(record: GazeRecord): void {
    checkGazeRecord(record);
    const at = this.chunk.reserve(GAZE_RECORD_BYTES); // first: it may move the buffer the view belongs to
    writeGazeRecord(this.chunk.view, at, record);
    this.range.add(record.hostNs);
    this.records++;
  }

  take(seq: number): Uint8Array {
    const sealed = this.chunk.take({ stream: 'gaze', seq, count: this.records, minHostNs: this.range.min, maxHostNs: this.range.max });
    this.range.reset();
    this.records = 0;
    return sealed;
  }
}
