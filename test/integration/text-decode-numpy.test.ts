import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { EventBatch } from '../../app/core/events/event-batch';
import { TextEventDecoder } from '../../app/core/events/text/text-event-decoder';
import { Xoshiro128 } from '../../app/core/random/xoshiro128';
import { decodeTextFile } from '../../app/host/events/parallel-text-decode';

// Our text decoder against numpy.loadtxt (Debian's python3-numpy), the common reference
// for reading such files: the same events, exactly. numpy_decode.py beside the fixtures
// says how numpy reads each format; for t in seconds it also turns the text into exact
// nanoseconds with Python's decimal module, and numpy's own float64 parse of t must equal
// our nanoseconds / 1e9 (both are the correctly rounded value of the same decimal).

const fixtures = join(__dirname, '../fixtures/text-decode');
const python = '/usr/bin/python3';

interface NumpyDecode {
  readonly t_ticks: number[];
  readonly t_seconds?: number[];
  readonly x: number[];
  readonly y: number[];
  readonly p: number[];
}

function numpyAvailable(): boolean {
  try {
    execFileSync(python, ['-c', 'import numpy'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

function numpyDecode(file: string, format: 'csv' | 'whitespace'): NumpyDecode {
  const out = join(mkdtempSync(join(tmpdir(), 'gz-numpy-')), 'decode.json');
  execFileSync(python, [join(fixtures, 'numpy_decode.py'), file, format, out], { stdio: 'inherit' });
  return JSON.parse(readFileSync(out, 'utf8')) as NumpyDecode;
}

/** The first event where ours and numpy's differ, described; null when all agree. */
function firstDifference(ours: EventBatch, reference: NumpyDecode, ticksPerUs: number): string | null {
  if (ours.t.length !== reference.t_ticks.length) return `${ours.t.length} events, numpy has ${reference.t_ticks.length}`;
  for (let i = 0; i < ours.t.length; i++) {
    const ticks = reference.t_ticks[i]!;
    const t = ours.t[i]!;
    if (t !== ticks / ticksPerUs || Math.round(t * ticksPerUs) !== ticks) return `event ${i}: t ${t} µs, numpy ${ticks} ticks`;
    if (reference.t_seconds && Math.round(t * 1000) / 1e9 !== reference.t_seconds[i]) return `event ${i}: t ${t} µs, numpy ${reference.t_seconds[i]} s`;
    if (ours.x[i] !== reference.x[i] || ours.y[i] !== reference.y[i]) return `event ${i}: (${ours.x[i]}, ${ours.y[i]}), numpy (${reference.x[i]}, ${reference.y[i]})`;
    if (ours.p[i] !== (reference.p[i] === 1 ? 1 : 0)) return `event ${i}: p ${ours.p[i]}, numpy ${reference.p[i]}`;
  }
  return null;
}

/** Ours twice: the worker decode of the whole file, and the streaming decoder fed uneven chunks. */
async function decodeBothWays(file: string): Promise<EventBatch[]> {
  const parallel = await decodeTextFile(file, {}, { workers: 2 });
  const bytes = readFileSync(file);
  const decoder = new TextEventDecoder({ file });
  const rng = new Xoshiro128(5);
  const parts: EventBatch[] = [];
  for (let at = 0; at < bytes.length; ) {
    const next = Math.min(bytes.length, at + 1 + rng.nextInt(40_000));
    parts.push(decoder.push(bytes.subarray(at, next)));
    at = next;
  }
  parts.push(decoder.end());
  const streamed = {
    t: Float64Array.from(parts.flatMap((b) => Array.from(b.t))),
    x: Uint16Array.from(parts.flatMap((b) => Array.from(b.x))),
    y: Uint16Array.from(parts.flatMap((b) => Array.from(b.y))),
    p: Uint8Array.from(parts.flatMap((b) => Array.from(b.p))),
  };
  return [parallel.batch, streamed];
}

/** 50,000 CSV events (t in µs) with the shapes real files have: equal times, CRLF, blank lines, spaces, leading zeros. */
function writeCsv(path: string): void {
  const rng = new Xoshiro128(2024);
  const lines = ['# width=640 height=480', 't,x,y,p'];
  let t = 0;
  for (let k = 0; k < 50_000; k++) {
    t += rng.nextInt(4) === 0 ? 0 : rng.nextInt(1000);
    const x = k === 0 ? 0 : k === 1 ? 639 : rng.nextInt(640);
    const y = k === 0 ? 0 : k === 1 ? 479 : rng.nextInt(480);
    let fields = [String(t), String(x), String(y), String(rng.nextInt(2))];
    if (k % 97 === 0) fields = fields.map((f) => ` ${f} `);
    if (k % 89 === 0) fields[1] = fields[1]!.trim().padStart(5, '0');
    lines.push(fields.join(',') + (k % 13 === 0 ? '\r' : ''));
    if (k % 101 === 0) lines.push('');
  }
  lines.push(`${Number.MAX_SAFE_INTEGER},1,2,0`); // the largest µs time held exactly
  writeFileSync(path, lines.join('\n')); // no newline after the last line
}

/** 50,000 headerless events, t in seconds (9 decimals or fewer), polarity -1/1, tabs and runs of spaces. */
function writeSeconds(path: string): void {
  const rng = new Xoshiro128(2025);
  const lines = ['# width=346 height=260'];
  let ns = 0;
  for (let k = 0; k < 50_000; k++) {
    ns += rng.nextInt(4) === 0 ? 0 : rng.nextInt(2_000_000);
    const decimals = k % 10 === 0 ? rng.nextInt(10) : 9;
    const step = 10 ** (9 - decimals);
    ns = Math.ceil(ns / step) * step;
    const whole = Math.floor(ns / 1e9);
    const fraction = String(ns % 1e9).padStart(9, '0').slice(0, decimals);
    const time = decimals === 0 ? String(whole) : `${whole}.${fraction}`;
    const separator = ['\t', ' ', '  '][k % 3]!;
    const fields = [time, String(rng.nextInt(346)), String(rng.nextInt(260)), rng.nextInt(2) ? '1' : '-1'];
    lines.push(fields.join(separator) + (k % 11 === 0 ? '\r' : ''));
  }
  lines.push('4503599.627370496 345 259 1'); // 2^52 ns, the largest nanosecond time held exactly
  writeFileSync(path, `${lines.join('\n')}\n`);
}

describe('text decode against numpy.loadtxt', () => {
  it.each([
    ['small.csv', 1],
    ['small.txt', 1000],
  ])('decodes the fixture %s as numpy did when it was made', async (name, ticksPerUs) => {
    const file = join(fixtures, name);
    const reference = JSON.parse(readFileSync(`${file}.numpy.json`, 'utf8')) as NumpyDecode;
    for (const ours of await decodeBothWays(file)) expect(firstDifference(ours, reference, ticksPerUs)).toBeNull();
  });

  it.skipIf(!numpyAvailable())('the fixtures still match numpy here', () => {
    for (const [name, format] of [['small.csv', 'csv'], ['small.txt', 'whitespace']] as const) {
      const file = join(fixtures, name);
      expect(numpyDecode(file, format)).toEqual(JSON.parse(readFileSync(`${file}.numpy.json`, 'utf8')));
    }
  });

  it.skipIf(!numpyAvailable())('agrees with numpy on 50,000 CSV events with t in microseconds', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'gz-text-')), 'aisle.csv');
    writeCsv(file);
    const reference = numpyDecode(file, 'csv');
    expect(reference.t_ticks.length).toBe(50_001);
    for (const ours of await decodeBothWays(file)) expect(firstDifference(ours, reference, 1)).toBeNull();
  });

  it.skipIf(!numpyAvailable())('agrees with numpy on 50,000 headerless events with t in seconds', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'gz-text-')), 'aisle.txt');
    writeSeconds(file);
    const reference = numpyDecode(file, 'whitespace');
    expect(reference.t_ticks.length).toBe(50_001);
    for (const ours of await decodeBothWays(file)) expect(firstDifference(ours, reference, 1000)).toBeNull();
  });
});
