/** Where an archive being written goes: a staging folder or a staging .zip, published only when complete. */
export interface ArchiveSink {
  /** Adds one file; returns its size and SHA-256 (of the bytes as stored, uncompressed). */
  add(name: string, content: Uint8Array | AsyncIterable<Uint8Array>): Promise<{ bytes: number; sha256: string }>;
  /** Makes everything durable and moves the archive into place. */
  commit(): Promise<void>;
  /** Removes whatever was staged. */
  abort(): Promise<void>;
}

export async function* chunksOf(content: Uint8Array | AsyncIterable<Uint8Array>): AsyncIterable<Uint8Array> {
  if (content instanceof Uint8Array) yield content;
  else yield* content;
}
