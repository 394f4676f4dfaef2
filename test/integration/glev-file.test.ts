import { existsSync, mkdtempSync, readdirSync, readFileSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { allocateBatch, type EventBatch } from '../../app/core/events/event-batch';
import { EventFormatError } from '../../app/core/events/event-format-error';
import { decodeGlev, encodeGlev } from '../../app/core/events/glev';
import { openGlevFile, writeGlevFile } from '../../app/host/events/glev-file';

const sensor = { width: 640, height: 480 };
const options = { sensor, resolution: 'us' as const, chunkEvents: 1000 };

/** Forklift-like traffic: 10 batches of 1,234 events, each batch starting where the last ended. */
function batch(k: number): EventBatch {
  const n = 1234;
  const out = allocateBatch(n);
  for (let i = 0; i < n; i++) {
    const e = k * n + i;
    out.t[i] = 2_000 + Math.floor(e * 1.7);
    out.x[i] = (e * 7) % 640;
    out.y[i] = (e * 3) % 480;
    out.p[i] = e % 2;
  }
  return out;
}
const batches = Array.from({ length: 10 }, (_, k) => batch(k));
const freshDir = () => mkdtempSync(join(tmpdir(), 'gz-glev-file-'));

describe('.glev files on disk', () => {
  it('writes through a partial file that only becomes the target when complete', async () => {
    const dir = freshDir();
    const path = join(dir, 'forklift.glev');
    const seen: string[][] = [];
    async function* slowly() {
      for (const b of batches) {
        seen.push(readdirSync(dir).sort());
        yield b;
      }
    }
    const progress: number[] = [];
    const summary = await writeGlevFile(path, options, slowly(), (n) => progress.push(n));
    expect(seen).toEqual(batches.map(() => ['forklift.glev.partial']));
    expect(readdirSync(dir)).toEqual(['forklift.glev']);
    expect(progress).toEqual(batches.map((_, k) => (k + 1) * 1234));
    expect(summary).toEqual({ eventCount: 12_340, chunkCount: 13, bytes: readFileSync(path).length });
    // The same bytes as the in-memory encoder writes.
    const whole = encodeGlev(
      { t: Float64Array.from(batches.flatMap((b) => [...b.t])), x: Uint16Array.from(batches.flatMap((b) => [...b.x])), y: Uint16Array.from(batches.flatMap((b) => [...b.y])), p: Uint8Array.from(batches.flatMap((b) => [...b.p])) },
      options,
    );
    expect(readFileSync(path).equals(Buffer.from(whole))).toBe(true);
  });

  it('reads back through a file handle: chunks, ranges, seeks and the whole stream', async () => {
    const path = join(freshDir(), 'aisle.glev');
    await writeGlevFile(path, options, batches);
    const file = await openGlevFile(path);
    try {
      expect([file.eventCount, file.chunkCount, file.tStartUs]).toEqual([12_340, 13, 2_000]);
      const all = await file.readRange(-Infinity, Infinity);
      expect(Array.from(all.t)).toEqual(Array.from(decodeGlev(new Uint8Array(readFileSync(path)), path).t));
      expect(Array.from((await file.readChunk(12)).x)).toEqual(Array.from(all.x.subarray(12_000)));
      const at = await file.seek(all.t[5_555]!);
      expect(at.event).toBe(5_555); // times strictly increase in this stream
      expect((await file.readRange(all.t[100]!, all.t[200]!)).t.length).toBe(100);
      expect(await file.verify()).toEqual({ corruptChunks: [], problems: [] });
    } finally {
      await file.close();
    }
  });

  it('leaves no partial file and keeps the old target when writing fails', async () => {
    const dir = freshDir();
    const path = join(dir, 'conveyor.glev');
    writeFileSync(path, 'the previous version');
    const backwards = batch(1);
    backwards.t[500] = 0;
    await expect(writeGlevFile(path, options, [batch(0), backwards])).rejects.toThrow(/^event 1734: t = 0 µs is earlier than/);
    expect(readdirSync(dir)).toEqual(['conveyor.glev']);
    expect(readFileSync(path, 'utf8')).toBe('the previous version');
    async function* failing() {
      yield batch(0);
      throw new Error('the source went away');
    }
    await expect(writeGlevFile(path, options, failing())).rejects.toThrow('the source went away');
    expect(readdirSync(dir)).toEqual(['conveyor.glev']);
    await expect(writeGlevFile(path, { ...options, chunkEvents: 0 }, batches)).rejects.toThrow(RangeError);
    expect(readdirSync(dir)).toEqual(['conveyor.glev']);
  });

  it('finds the damaged chunk in a corrupted file, and the cut in a truncated one', async () => {
    const dir = freshDir();
    const path = join(dir, 'beacon.glev');
    await writeGlevFile(path, options, batches);
    const bytes = readFileSync(path);
    const chunk5 = 48 + 5 * (16 + 8 * 1000);
    bytes[chunk5 + 3000]! ^= 0x08;
    writeFileSync(path, bytes);
    const file = await openGlevFile(path);
    try {
      const { corruptChunks, problems } = await file.verify();
      expect(corruptChunks).toEqual([5]);
      expect(problems[0]!.message).toMatch(new RegExp(`^${path.replaceAll('.', '\\.')} chunk 5, byte ${chunk5}: CRC32 mismatch`));
      await expect(file.readRange(-Infinity, Infinity)).rejects.toThrow(EventFormatError);
      expect((await file.readChunk(4)).t.length).toBe(1000);
    } finally {
      await file.close();
    }
    truncateSync(path, chunk5 + 100);
    await expect(openGlevFile(path)).rejects.toThrow(`${path} chunk 5, byte ${chunk5}: truncated: the chunk of 1000 events needs bytes ${chunk5}..${chunk5 + 8015}`);
  });

  it('reports a file that shrinks while open', async () => {
    const path = join(freshDir(), 'person.glev');
    await writeGlevFile(path, options, batches);
    const file = await openGlevFile(path);
    try {
      const size = readFileSync(path).length;
      const chunk7 = file.chunks[7]!.byteOffset;
      truncateSync(path, chunk7 + 100);
      await expect(file.readChunk(7)).rejects.toThrow(new EventFormatError(path, `byte ${chunk7 + 100}`, `the file ended early: it had ${size} bytes when opened (was it changed while open?)`));
      truncateSync(path, 20_000);
      await expect(file.readChunk(7)).rejects.toThrow(`${path} byte ${chunk7}: the file ended early`);
    } finally {
      await file.close();
    }
    expect(existsSync(path)).toBe(true);
  });
});
