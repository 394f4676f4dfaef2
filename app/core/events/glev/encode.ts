import type { EventBatch } from '../event-batch';
import { GlevWriter, type GlevWriterOptions } from './writer';

/** A whole .glev file in memory, for small streams and tests; large ones stream through GlevWriter. */
export function encodeGlev(batch: EventBatch, options: GlevWriterOptions): Uint8Array {
  const parts: Uint8Array[] = [];
  const writer = new GlevWriter(options, (bytes) => parts.push(bytes));
  writer.push(batch);
  parts[0] = writer.finish(); // the real header, over the placeholder
  const file = new Uint8Array(writer.bytesWritten);
  let offset = 0;
  for (const part of parts) {
    file.set(part, offset);
    offset += part.length;
  }
  return file;
}
