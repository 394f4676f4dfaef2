import type { ChunkBuilder } from './chunk-builder';
import { HostTimeRange } from './chunk-builder';
import { CHUNK_HEADER_BYTES, sealChunk } from './chunk-format';
import { checkMessageRecord, encodeMessageLine } from './message-codec';
import type { MessageRecord } from './records';

const encoder = new TextEncoder();

export class MessageChunkBuilder implements ChunkBuilder<MessageRecord> {
  readonly stream = 'messages';
  private lines: string[] = [];
  private bytes = 0;
  private readonly range = new HostTimeRange();

  get count(): number {
    return this.lines.length;
  }

  get payloadBytes(): number {
    return this.bytes;
  }

  append(record: MessageRecord): void {
    checkMessageRecord(record);
    const line = encodeMessageLine(record);
    this.lines.push(line);
    this.bytes += encoder.encode(line).length;
    this.range.add(record.hostNs);
  }

  take(seq: number): Uint8Array {
    const payload = encoder.encode(this.lines.join(''));
    const chunk = new Uint8Array(CHUNK_HEADER_BYTES + payload.length);
    chunk.set(payload, CHUNK_HEADER_BYTES);
    const sealed = sealChunk(chunk, { stream: 'messages', seq, count: this.lines.length, minHostNs: this.range.min, maxHostNs: this.range.max });
    this.lines = [];
    this.bytes = 0;
    this.range.reset();
    return sealed;
  }
}
