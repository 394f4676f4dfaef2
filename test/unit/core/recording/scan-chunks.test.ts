import { describe, expect, it } from 'vitest';
import { crc32 } from '../../../../app/core/checksum/crc32';
import { bytesSource } from '../../../../app/core/events/glev';
import { CHUNK_HEADER_BYTES, sealChunk, type RecordStream } from '../../../../app/core/recording/chunk-format';
import { GazeChunkBuilder } from '../../../../app/core/recording/gaze-chunk-builder';
import { RecordingFormatError } from '../../../../app/core/recording/recording-format-error';
import { scanChunks, type ScannedItem } from '../../../../app/core/recording/scan-chunks';

/** A gaze stream of `n` chunks holding 1..n records each, with its chunk boundaries. */
function stream(n: number): { bytes: Uint8Array; starts: number[] } {
  const b = new GazeChunkBuilder();
  const chunks: Uint8Array[] = [];
  for (let c = 0; c < n; c++) {
    for (let i = 0; i <= c; i++) b.append({ seq: c * 100 + i, trackerTimeS: c + i / 1000, arrivalNs: c * 1e9, hostNs: c * 1e9 + i, left: null, right: null });
    chunks.push(b.take(c));
  }
  const starts: number[] = [];
  const bytes = new Uint8Array(chunks.reduce((s, c) => s + c.length, 0));
  let at = 0;
  for (const c of chunks) {
    starts.push(at);
    bytes.set(c, at);
    at += c.length;
  }
  return { bytes, starts: [...starts, at] };
}

async function scan(bytes: Uint8Array, kind: RecordStream = 'gaze'): Promise<ScannedItem[]> {
  const items: ScannedItem[] = [];
  for await (const item of scanChunks(bytesSource(bytes), 'gaze.chunks', kind)) items.push(item);
  return items;
}

const summary = (items: ScannedItem[]) => items.map((i) => (i.kind === 'chunk' ? `chunk ${i.header.seq}` : i.kind === 'corrupt' ? `corrupt ${i.offset}+${i.bytes} (${i.chunks})` : `torn ${i.offset}+${i.bytes}`));

describe('scanChunks', () => {
  it('walks intact chunks in order, nothing else', async () => {
    const { bytes } = stream(5);
    expect(summary(await scan(bytes))).toEqual(['chunk 0', 'chunk 1', 'chunk 2', 'chunk 3', 'chunk 4']);
    expect(await scan(new Uint8Array(0))).toEqual([]);
  });

  it('finds a torn tail at every length the last chunk can be cut to, and exactly its bytes', async () => {
    const { bytes, starts } = stream(4);
    const last = starts[3]!;
    for (let end = last + 1; end < bytes.length; end++) {
      const items = await scan(bytes.subarray(0, end));
      expect(summary(items), `cut at ${end}`).toEqual(['chunk 0', 'chunk 1', 'chunk 2', `torn ${last}+${end - last}`]);
    }
  });

  it('takes a complete last chunk that fails its checksum for the torn tail (nothing intact after it)', async () => {
    const { bytes, starts } = stream(3);
    const bent = bytes.slice();
    bent[starts[2]! + CHUNK_HEADER_BYTES + 5] ^= 0xff;
    expect(summary(await scan(bent))).toEqual(['chunk 0', 'chunk 1', `torn ${starts[2]}+${bytes.length - starts[2]!}`]);
  });

  it('counts a damaged payload in the middle as one corrupt chunk and keeps reading after it', async () => {
    const { bytes, starts } = stream(5);
    const bent = bytes.slice();
    bent[starts[2]! + CHUNK_HEADER_BYTES + 1] ^= 0x01;
    expect(summary(await scan(bent))).toEqual(['chunk 0', 'chunk 1', `corrupt ${starts[2]}+${starts[3]! - starts[2]!} (1)`, 'chunk 3', 'chunk 4']);
  });

  it('finds its way past a damaged header by the next valid one, counting the chunks lost from the sequence numbers', async () => {
    const { bytes, starts } = stream(6);
    const bent = bytes.slice();
    bent[starts[1]! + 16] ^= 0x40; // chunk 1's payload length
    bent[starts[2]! + 2] = 0; // chunk 2's magic
    const items = await scan(bent);
    expect(summary(items)).toEqual(['chunk 0', `corrupt ${starts[1]}+${starts[3]! - starts[1]!} (2)`, 'chunk 3', 'chunk 4', 'chunk 5']);
  });

  it('reports bytes before the first chunk as damage and reads on', async () => {
    const { bytes } = stream(2);
    const garbage = new TextEncoder().encode('GLRC not a header at all');
    const withJunk = new Uint8Array(garbage.length + bytes.length);
    withJunk.set(garbage);
    withJunk.set(bytes, garbage.length);
    expect(summary(await scan(withJunk))).toEqual([`corrupt 0+${garbage.length} (1)`, 'chunk 0', 'chunk 1']);
  });

  it('refuses, without calling it damage, a valid chunk of another stream or of a newer format', async () => {
    const { bytes } = stream(1);
    await expect(scan(bytes, 'frames')).rejects.toThrow(/holds a gaze chunk, expected frames: was the file renamed\?/);
    const newer = sealChunk(new Uint8Array(CHUNK_HEADER_BYTES), { stream: 'gaze', seq: 0, count: 0, minHostNs: 0, maxHostNs: 0 });
    newer[4] = 2;
    // Re-seal the header checksum by hand, as a newer writer would have.
    new DataView(newer.buffer).setUint32(44, crc32(newer.subarray(0, 44)), true);
    await expect(scan(newer)).rejects.toThrow(RecordingFormatError);
    await expect(scan(newer)).rejects.toThrow(/chunk format version 2/);
  });
});
