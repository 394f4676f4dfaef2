import { crc32 as zlibCrc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { allocateBatch, batchFrom } from '../../../../app/core/events/event-batch';
import { EventFormatError } from '../../../../app/core/events/event-format-error';
import { bytesSource, decodeGlev, encodeGlev, openGlev } from '../../../../app/core/events/glev';

// 350 events in chunks of 100: chunks of 816 bytes at 48, 864 and 1680, one of 416 at
// 2496; the index (4 x 28 bytes and a CRC) at 2912; 3028 bytes in all.
const sensor = { width: 640, height: 480 };
function sampleFile(): Uint8Array {
  const events = allocateBatch(350);
  for (let i = 0; i < 350; i++) {
    events.t[i] = 1_000 + 3 * i;
    events.x[i] = (i * 37) % 640;
    events.y[i] = (i * 11) % 480;
    events.p[i] = i % 2;
  }
  return encodeGlev(events, { sensor, resolution: 'us', chunkEvents: 100 });
}
const chunkOffsets = [48, 864, 1680, 2496];
const indexOffset = 2912;

const view = (file: Uint8Array) => new DataView(file.buffer, file.byteOffset, file.byteLength);
const sealHeader = (file: Uint8Array) => view(file).setUint32(44, zlibCrc32(file.subarray(0, 44)), true);
function sealChunk(file: Uint8Array, offset: number): void {
  const end = offset + 12 + 8 * view(file).getUint32(offset + 8, true);
  view(file).setUint32(end, zlibCrc32(file.subarray(offset, end)), true);
}
const sealIndex = (file: Uint8Array) => view(file).setUint32(indexOffset + 112, zlibCrc32(file.subarray(indexOffset, indexOffset + 112)), true);

/** The error both readers give: decodeGlev, and openGlev followed by reading every chunk. */
async function errorsFor(file: Uint8Array): Promise<[EventFormatError, EventFormatError]> {
  let sync: unknown;
  try {
    decodeGlev(file, 'aisle.glev');
  } catch (error) {
    sync = error;
  }
  let async: unknown;
  try {
    const reader = await openGlev(bytesSource(file), 'aisle.glev');
    for (let k = 0; k < reader.chunkCount; k++) await reader.readChunk(k);
  } catch (error) {
    async = error;
  }
  expect(sync).toBeInstanceOf(EventFormatError);
  expect(async).toBeInstanceOf(EventFormatError);
  return [sync as EventFormatError, async as EventFormatError];
}

async function expectProblem(file: Uint8Array, location: string, problem: RegExp): Promise<void> {
  for (const error of await errorsFor(file)) {
    expect(error.file).toBe('aisle.glev');
    expect(error.location).toBe(location);
    expect(error.problem).toMatch(problem);
    expect(error.message).toBe(`aisle.glev ${location}: ${error.problem}`);
  }
}

describe('.glev header problems', () => {
  it('names a file that is not .glev at all, with what it found', async () => {
    const csv = new TextEncoder().encode('t,x,y,p\n1000,12,7,1\n1003,13,7,0\n1006,14,8,1\n1009,15,8,0\n1010,15,9,1\n');
    await expectProblem(csv, 'header, byte 0', /^expected the \.glev signature E5 47 4C 45 56 0D 0A 0A, found 74 2C 78 2C 79 2C 70 0A$/);
    await expectProblem(new Uint8Array(0), 'header, byte 0', /found an empty file/);
    const png = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Uint8Array(60)]);
    await expectProblem(png, 'header, byte 0', /found 89 50 4E 47 0D 0A 1A 0A$/);
  });

  it('recognises an unfinished file by its blank header', async () => {
    const file = sampleFile();
    file.fill(0, 0, 48);
    await expectProblem(file, 'header, byte 0', /blank header: the file was not finished/);
  });

  it('recognises the damage of text-mode transfers', async () => {
    const file = Buffer.from(sampleFile());
    const crlfToLf = Buffer.from(file.toString('latin1').replaceAll('\r\n', '\n'), 'latin1');
    const lfToCrlf = Buffer.from(file.toString('latin1').replaceAll('\n', '\r\n'), 'latin1');
    const reencoded = Buffer.from(file.toString('latin1'), 'utf8'); // read as Latin-1, saved as UTF-8
    for (const damaged of [crlfToLf, lfToCrlf, reencoded]) {
      await expectProblem(new Uint8Array(damaged), 'header, byte 0', /text-mode transfers.*copy the file again in binary mode/);
    }
  });

  it('refuses a version it does not know, before checking anything else', async () => {
    const file = sampleFile();
    view(file).setUint16(8, 2, true);
    await expectProblem(file, 'header, byte 8', /^format version 2 is not supported \(this reader knows version 1\)/);
  });

  it('reports a damaged header by its CRC', async () => {
    const file = sampleFile();
    file[13]! ^= 0x04; // one bit of the width
    await expectProblem(file, 'header, byte 44', /^header CRC32 mismatch: stored 0x[0-9a-f]{8}, computed 0x[0-9a-f]{8} over bytes 0\.\.43/);
  });

  it.each([5, 9, 30, 47])('reports a header cut at byte %i', async (length) => {
    await expectProblem(sampleFile().subarray(0, length), `header, byte ${length}`, new RegExp(`^truncated: the file ends at byte ${length}, inside the 48-byte header`));
  });

  it.each([
    ['header length', 10, 2, 64, /^header length 64, expected 48/],
    ['width', 12, 4, 0, /^sensor width 0 is outside 1\.\.65536/],
    ['height', 16, 4, 32769, /^sensor height 32769 is outside 1\.\.32768/],
    ['time unit', 20, 4, 1000, /^1000 ticks per second, expected 1000000 \(µs\) or 1000000000 \(ns\)/],
    ['index offset', 32, 4, 2913, /^index offset 2913, expected a multiple of 8/],
  ] as const)('checks the %s field even when the CRC matches', async (_field, offset, size, value, problem) => {
    const file = sampleFile();
    if (size === 2) view(file).setUint16(offset, value, true);
    else view(file).setUint32(offset, value, true);
    sealHeader(file);
    await expectProblem(file, `header, byte ${offset}`, problem);
  });

  it('refuses an event count beyond 2^53 - 1', async () => {
    const file = sampleFile();
    view(file).setUint32(28, 0x00400000, true);
    sealHeader(file);
    await expectProblem(file, 'header, byte 24', /is beyond 2\^53 - 1/);
  });

  it("notices an event count that disagrees with the index's chunks", async () => {
    const file = sampleFile();
    view(file).setUint32(24, 351, true);
    sealHeader(file);
    await expectProblem(file, 'header, byte 24', /^event count 351, but the index's chunks hold 350 events/);
  });
});

describe('.glev truncation', () => {
  it.each([
    [50, 'chunk 0, byte 48', /^truncated: the file ends at byte 50, inside the chunk's 12-byte head \(chunk 0 of 4\)/],
    [500, 'chunk 0, byte 48', /^truncated: the chunk of 100 events needs bytes 48\.\.863, but the file ends at byte 500 \(chunk 0 of 4\)/],
    [864, 'chunk 1, byte 864', /inside the chunk's 12-byte head \(chunk 1 of 4\)/],
    [2000, 'chunk 2, byte 1680', /needs bytes 1680\.\.2495, but the file ends at byte 2000/],
    [2911, 'chunk 3, byte 2496', /the chunk of 50 events needs bytes 2496\.\.2911, but the file ends at byte 2911/],
    [2912, 'index, byte 2912', /^truncated: the index needs bytes 2912\.\.3027, but the file ends at byte 2912/],
    [3027, 'index, byte 2912', /the file ends at byte 3027/],
  ])('names the chunk a file cut at byte %i ends in', async (length, location, problem) => {
    await expectProblem(sampleFile().subarray(0, length), location, problem);
  });

  it('reports a damaged count field met while looking for the cut', async () => {
    const file = sampleFile().subarray(0, 2000);
    view(file).setUint32(864 + 8, 70_000, true);
    await expectProblem(file, 'chunk 1, byte 872', /^event count 70000 is outside 1\.\.65536; the chunk head is damaged/);
  });

  it('reports an index offset that points outside the file', async () => {
    const file = sampleFile();
    view(file).setUint32(32, 8000, true);
    sealHeader(file);
    await expectProblem(file, 'header, byte 32', /^index offset 8000 lies outside the file of 3028 bytes; the 4 chunks end at byte 2912/);
  });

  it('refuses bytes after the index', async () => {
    const file = new Uint8Array(3038);
    file.set(sampleFile());
    await expectProblem(file, 'byte 3028', /^10 unexpected bytes after the index; a \.glev file of 4 chunks ends at byte 3028/);
  });
});

describe('.glev damaged chunks', () => {
  it.each([
    ['the first dt', 12],
    ['an x', 12 + 400 + 5],
    ['a y and polarity', 12 + 600 + 199],
    ['the stored CRC itself', 812],
  ])('names chunk 2 and its offset when a bit of %s flips', async (_what, at) => {
    const file = sampleFile();
    file[chunkOffsets[2]! + at]! ^= 0x10;
    await expectProblem(file, 'chunk 2, byte 1680', /^CRC32 mismatch: stored 0x[0-9a-f]{8} at byte 2492, computed 0x[0-9a-f]{8} over bytes 1680\.\.2491; the chunk is damaged/);
  });

  it("names the field when the chunk's head disagrees with the index", async () => {
    const first = sampleFile();
    first[chunkOffsets[1]!]! ^= 0x01;
    await expectProblem(first, 'chunk 1, byte 864', /^first timestamp 1301 ticks differs from the index's 1300/);
    const count = sampleFile();
    count[chunkOffsets[1]! + 8]! ^= 0x01;
    await expectProblem(count, 'chunk 1, byte 872', /^event count 101 differs from the index's 100/);
  });

  it('lists every damaged chunk in verify(), and still reads the others', async () => {
    const file = sampleFile();
    file[chunkOffsets[0]! + 100]! ^= 0x80;
    file[chunkOffsets[3]! + 300]! ^= 0x01;
    const reader = await openGlev(bytesSource(file), 'aisle.glev');
    const { corruptChunks, problems } = await reader.verify();
    expect(corruptChunks).toEqual([0, 3]);
    expect(problems.map((p) => p.location)).toEqual(['chunk 0, byte 48', 'chunk 3, byte 2496']);
    expect((await reader.readChunk(1)).t[0]).toBe(1_300);
    expect(await (await openGlev(bytesSource(sampleFile()), 'aisle.glev')).verify()).toEqual({ corruptChunks: [], problems: [] });
  });

  // With the CRC resealed, these are files a faulty writer made: the decoder still refuses them.
  const dt = (k: number, i: number) => chunkOffsets[k]! + 12 + 4 * i;
  it.each([
    ['x beyond the sensor', (f: Uint8Array) => view(f).setUint16(chunkOffsets[1]! + 12 + 400 + 2 * 7, 640, true), 'chunk 1, byte 1290', /^x = 640 is outside the sensor width 640 \(0\.\.639\)/],
    ['y beyond the sensor', (f: Uint8Array) => view(f).setUint16(chunkOffsets[1]! + 12 + 600 + 2 * 9, 480 << 1, true), 'chunk 1, byte 1494', /^y = 480 is outside the sensor height 480 \(0\.\.479\)/],
    ['time going backwards', (f: Uint8Array) => view(f).setUint32(dt(1, 5), 11, true), 'chunk 1, byte 896', /^dt 11 is smaller than the previous event's 12; events must be in time order/],
    ['a first dt other than 0', (f: Uint8Array) => view(f).setUint32(dt(1, 0), 1, true), 'chunk 1, byte 876', /^the first event's dt is 1, expected 0/],
    ['a last time the index does not have', (f: Uint8Array) => view(f).setUint32(dt(1, 99), 298, true), 'chunk 1, byte 1272', /^the last event is at tick 1598, but the index says 1597/],
  ])('refuses %s even with a matching CRC', async (_what, damage, location, problem) => {
    const file = sampleFile();
    damage(file);
    sealChunk(file, chunkOffsets[1]!);
    await expectProblem(file, location, problem);
  });

  it('checks the bounds of the last event of an odd-sized chunk too', async () => {
    // 7 events: odd chunks are decoded one event per step, even ones two at a time.
    const odd = () => encodeGlev(batchFrom(Array.from({ length: 7 }, (_, i) => [i, i, i, 1] as const)), { sensor, resolution: 'us' });
    const x = odd();
    view(x).setUint16(48 + 12 + 28 + 12, 700, true);
    sealChunk(x, 48);
    await expectProblem(x, 'chunk 0, byte 100', /^x = 700 is outside the sensor width 640/);
    const y = odd();
    view(y).setUint16(48 + 12 + 42 + 12, (500 << 1) | 1, true);
    sealChunk(y, 48);
    await expectProblem(y, 'chunk 0, byte 114', /^y = 500 is outside the sensor height 480/);
  });
});

describe('.glev damaged index', () => {
  const entry = (k: number, field: number) => indexOffset + 28 * k + field;

  it('reports a damaged index by its CRC', async () => {
    const file = sampleFile();
    file[entry(2, 3)]! ^= 0x02;
    await expectProblem(file, 'index, byte 2912', /^index CRC32 mismatch: stored 0x[0-9a-f]{8} at byte 3024, computed 0x[0-9a-f]{8}; the index is damaged/);
  });

  it.each([
    ['a count of 0', (f: Uint8Array) => view(f).setUint32(entry(0, 24), 0, true), 'index entry 0, byte 2936', /^event count 0 is outside 1\.\.65536/],
    ['a gap between chunks', (f: Uint8Array) => view(f).setUint32(entry(0, 24), 99, true), 'index entry 1, byte 2956', /^chunk offset 864, expected 856 \(chunks follow one another without gaps\)/],
    ['chunks out of time order', (f: Uint8Array) => view(f).setUint32(entry(1, 0), 1_000, true), 'index entry 1, byte 2940', /^chunk 1 starts at tick 1000, before chunk 0 ends \(tick 1297\)/],
    ['a chunk spanning more than dt holds', (f: Uint8Array) => view(f).setUint32(entry(3, 12), 1, true), 'index entry 3, byte 3004', /^last timestamp 4294969343 must lie between the first \(1900\) and 4294967295 ticks after it/],
    ['a first time beyond 2^53 - 1', (f: Uint8Array) => view(f).setUint32(entry(0, 4), 0x00200000, true), 'index entry 0, byte 2912', /^first timestamp .* is beyond 9007199254740991 ticks/],
  ])('checks each entry even when the index CRC matches: %s', async (_what, damage, location, problem) => {
    const file = sampleFile();
    damage(file);
    sealIndex(file);
    await expectProblem(file, location, problem);
  });
});
