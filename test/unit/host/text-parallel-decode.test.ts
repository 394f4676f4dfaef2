import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';
import { concatBatches } from '../../../app/core/events/event-batch';
import { EventFormatError } from '../../../app/core/events/event-format-error';
import { TextEventDecoder } from '../../../app/core/events/text/text-event-decoder';
import { decodeTextFile, type TextFileRun } from '../../../app/host/events/parallel-text-decode';

// The worker decode of a whole file (app/host/events/parallel-text-decode.ts) must say
// exactly what one streaming decoder says of the same bytes: same events and facts, or
// the same error on the same line, wherever the ranges were cut (common practice, no source).

const folder = mkdtempSync(join(tmpdir(), 'gz-text-par-'));
let files = 0;

function write(text: string): string {
  const path = join(folder, `clip-${files++}.csv`);
  writeFileSync(path, text);
  return path;
}

function streamed(path: string): string {
  const decoder = new TextEventDecoder({ file: 'clip.csv' });
  try {
    const batch = concatBatches([decoder.push(readFileSync(path)), decoder.end()]);
    const { format, resolution, declaredSensor, extent, eventCount, lineCount } = decoder;
    return JSON.stringify({ t: Array.from(batch.t), x: Array.from(batch.x), y: Array.from(batch.y), p: Array.from(batch.p), format, resolution, declaredSensor, extent, eventCount, lineCount });
  } catch (error) {
    if (error instanceof EventFormatError) return error.message;
    throw error;
  }
}

async function parallel(path: string, run: TextFileRun = { workers: 2 }): Promise<string> {
  try {
    const { batch, format, resolution, declaredSensor, extent, eventCount, lineCount } = await decodeTextFile(path, { file: 'clip.csv' }, run);
    return JSON.stringify({ t: Array.from(batch.t), x: Array.from(batch.x), y: Array.from(batch.y), p: Array.from(batch.p), format, resolution, declaredSensor, extent, eventCount, lineCount });
  } catch (error) {
    if (error instanceof EventFormatError) return error.message;
    throw error;
  }
}

/** Forklift-crossing demo events as CSV lines, t in µs. */
const eventLines = (count: number, first = 0) => Array.from({ length: count }, (_, k) => `${1_000_000 + 3 * (first + k)},${(first + k) % 640},${(7 * (first + k)) % 480},${(first + k) % 3 === 0 ? 0 : 1}`);

describe('decodeTextFile with workers', () => {
  const lines = ['# width=640 height=480', 't,x,y,p', ...eventLines(20_000)];

  it.each([1, 2, 3, 7])('decodes like the streaming decoder with %d workers', async (workers) => {
    const path = write(lines.join('\n'));
    const expected = streamed(path);
    expect(expected).toContain('"eventCount":20000');
    expect(await parallel(path, { workers })).toBe(expected);
  });

  it('decodes small files on this thread by default, and the same', async () => {
    const path = write(lines.slice(0, 500).join('\r\n'));
    expect(await parallel(path, {})).toBe(streamed(path));
    expect(await parallel(path, { workers: 0 })).toBe(streamed(path));
  });

  it('names the global line of a fault in any range', async () => {
    for (const at of [3, 5000, 9999, 10_000, 10_001, 15_000, 20_001]) {
      const faulty = [...lines];
      faulty.splice(at, 0, '1000500,12');
      const path = write(faulty.join('\n'));
      const expected = streamed(path);
      expect(expected).toBe(`clip.csv line ${at + 1}: expected 4 fields (t,x,y,p), found 2`);
      expect(await parallel(path), `fault on line ${at + 1}`).toBe(expected);
    }
  });

  it('checks the time order and the OFF code across range boundaries', async () => {
    // Every line around the middle, where the two ranges meet, in turn.
    for (let at = 9_985; at < 10_020; at += 1) {
      const unsorted = [...lines];
      unsorted.splice(at, 0, '1000000,1,1,1');
      const path = write(unsorted.join('\n'));
      expect(await parallel(path), `decrease on line ${at + 1}`).toBe(streamed(path));
      expect(streamed(path)).toMatch(new RegExp(`^clip.csv line ${at + 1}: timestamp 1000000 is earlier than`));
    }
    for (const at of [9_990, 10_002, 10_010]) {
      const mixed = [...lines];
      mixed[at] = mixed[at]!.replace(/,[01]$/, ',-1');
      const path = write(mixed.join('\n'));
      expect(await parallel(path), `-1 on line ${at + 1}`).toBe(streamed(path));
      expect(streamed(path)).toMatch(/OFF is written as -1 here but as 0 on line 3;/);
    }
  });

  it('goes on past a range share that the line length sample underestimated', async () => {
    // The first 64 KiB (the sample) has long lines, the rest short ones.
    const long = Array.from({ length: 1500 }, (_, k) => `${String(1000 + k).padStart(30, '0')},${String(k % 640).padStart(12, '0')},1,1`);
    const short = Array.from({ length: 60_000 }, (_, k) => `${5000 + k},${k % 9},2,0`);
    const path = write(['t,x,y,p', ...long, ...short].join('\n'));
    expect(await parallel(path)).toBe(streamed(path));
  });

  it('reads headerless seconds with CRLF and no final newline', async () => {
    const text = Array.from({ length: 30_000 }, (_, k) => `${(k / 1000).toFixed(9)} ${k % 346} ${k % 260} ${k % 2 ? 1 : -1}`).join('\r\n');
    const path = write(text);
    expect(await parallel(path)).toBe(streamed(path));
  });

  it('reports progress up to the file size', async () => {
    const path = write(lines.join('\n'));
    const seen: number[] = [];
    await decodeTextFile(path, {}, { workers: 2, onProgress: ({ bytesDone, bytesTotal }) => seen.push(bytesDone / bytesTotal) });
    expect(seen.length).toBeGreaterThan(0);
    expect(seen).toEqual([...seen].sort((a, b) => a - b));
    expect(seen.at(-1)).toBe(1);
  });

  it('says "no events" for an empty file or one with only a header', async () => {
    expect(await parallel(write(''))).toBe('clip.csv: no events');
    expect(await parallel(write('# width=640 height=480\nt,x,y,p\n\n'))).toBe('clip.csv: no events');
  });

  it('names the file by its base name unless told otherwise', async () => {
    const path = write('t,x,y,p\n1,2\n');
    await expect(decodeTextFile(path)).rejects.toThrow(new RegExp(`^clip-\\d+\\.csv line 2:`));
  });

  it('rejects an invalid worker count', async () => {
    await expect(decodeTextFile(write('1 2 3 1\n'), {}, { workers: -1 })).rejects.toThrow(RangeError);
  });

  it('works from the esbuild bundle, where there is no worker file to load', async () => {
    // Bundled as scripts/build.mjs bundles app/ (platform node, ESM, packages external).
    const entry = join(folder, 'entry.ts');
    const decoder = resolve(__dirname, '../../../app/host/events/parallel-text-decode.ts');
    writeFileSync(entry, `import { decodeTextFile } from ${JSON.stringify(decoder)};
const r = await decodeTextFile(process.argv[2], { file: 'clip.csv' }, { workers: 2 });
process.stdout.write(JSON.stringify({ n: r.eventCount, lines: r.lineCount, last: r.batch.t[r.eventCount - 1], sum: r.batch.x.reduce((a, b) => a + b, 0) }));`);
    const bundle = join(folder, 'bundle.mjs');
    await build({ entryPoints: [entry], outfile: bundle, bundle: true, platform: 'node', format: 'esm', target: 'node20', packages: 'external', logLevel: 'silent' });
    const path = write(lines.join('\n'));
    const out = JSON.parse(execFileSync(process.execPath, [bundle, path], { encoding: 'utf8' })) as Record<string, number>;
    const expected = JSON.parse(streamed(path)) as { eventCount: number; lineCount: number; t: number[]; x: number[] };
    expect(out).toEqual({ n: expected.eventCount, lines: expected.lineCount, last: expected.t.at(-1), sum: expected.x.reduce((a, b) => a + b, 0) });
  });
});
