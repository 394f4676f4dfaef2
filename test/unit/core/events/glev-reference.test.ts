import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { allocateBatch, batchFrom, type EventBatch } from '../../../../app/core/events/event-batch';
import { decodeGlev, encodeGlev } from '../../../../app/core/events/glev';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

// The outside check for a format of our own: an independent reader and writer written from
// the documented layout with Python's standard library only (struct, and zlib.crc32 for
// the CRCs), in test/fixtures/glev/glev_reference.py. Its output for a sample stream is
// kept as a fixture (beacon.glev, beacon.json) for machines without Python.
const fixtures = join(__dirname, '../../../fixtures/glev');
const script = join(fixtures, 'glev_reference.py');

interface ReferenceFile {
  width: number;
  height: number;
  ticks_per_second: number;
  chunk_events?: number;
  chunks?: { first: number; last: number; offset: number; count: number }[];
  events: [tick: number, x: number, y: number, p: number][];
}

function python(...args: string[]): string | null {
  try {
    return execFileSync('/usr/bin/python3', [script, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null; // no Python on this machine: the fixture still runs
    throw error;
  }
}

const toBatch = (ref: ReferenceFile): EventBatch => batchFrom(ref.events.map(([tick, x, y, p]) => [ref.ticks_per_second === 1e9 ? tick / 1000 : tick, x, y, p]));

describe('.glev against an independent implementation of its layout', () => {
  it("decodes the reference writer's fixture and writes the same bytes from the same events", () => {
    const spec = JSON.parse(readFileSync(join(fixtures, 'beacon.json'), 'utf8')) as ReferenceFile;
    const file = new Uint8Array(readFileSync(join(fixtures, 'beacon.glev')));
    const expected = toBatch(spec);
    const decoded = decodeGlev(file, 'beacon.glev');
    expect(Array.from(decoded.t)).toEqual(Array.from(expected.t));
    expect([Array.from(decoded.x), Array.from(decoded.y), Array.from(decoded.p)]).toEqual([Array.from(expected.x), Array.from(expected.y), Array.from(expected.p)]);
    const ours = encodeGlev(expected, { sensor: { width: spec.width, height: spec.height }, resolution: 'ns', chunkEvents: spec.chunk_events! });
    expect(Buffer.from(ours).equals(Buffer.from(file))).toBe(true);
  });

  it('writes files the reference reader accepts, CRCs included, with the same events', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gz-glev-ref-'));
    const g = new Xoshiro128(31);
    for (const resolution of ['us', 'ns'] as const) {
      const n = 20_000;
      const events = allocateBatch(n);
      let tick = 7;
      for (let i = 0; i < n; i++) {
        tick += g.next() < 0.001 ? 2 ** 32 + g.nextInt(1000) : g.nextInt(50);
        events.t[i] = resolution === 'ns' ? tick / 1000 : tick;
        events.x[i] = g.nextInt(346);
        events.y[i] = g.nextInt(260);
        events.p[i] = g.nextInt(2);
      }
      const path = join(dir, `${resolution}.glev`);
      writeFileSync(path, encodeGlev(events, { sensor: { width: 346, height: 260 }, resolution, chunkEvents: 3000 }));
      const output = python('read', path);
      if (output === null) return;
      const ref = JSON.parse(output) as ReferenceFile;
      expect([ref.width, ref.height, ref.ticks_per_second]).toEqual([346, 260, resolution === 'ns' ? 1e9 : 1e6]);
      expect(ref.chunks!.length).toBeGreaterThan(Math.ceil(n / 3000)); // the large gaps forced extra chunks
      const back = toBatch(ref);
      expect(Array.from(back.t)).toEqual(Array.from(events.t));
      expect([Array.from(back.x), Array.from(back.y), Array.from(back.p)]).toEqual([Array.from(events.x), Array.from(events.y), Array.from(events.p)]);
    }
  });

  it('reads what the reference writer writes from random events', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gz-glev-ref-'));
    const g = new Xoshiro128(32);
    let tick = 0;
    const events = Array.from({ length: 5_000 }, (_, i): [number, number, number, number] => {
      tick += i % 997 === 0 ? 5_000_000_000 : g.nextInt(3);
      return [tick, g.nextInt(640), g.nextInt(480), g.nextInt(2)];
    });
    const spec: ReferenceFile = { width: 640, height: 480, ticks_per_second: 1e9, chunk_events: 777, events };
    writeFileSync(join(dir, 'spec.json'), JSON.stringify(spec));
    if (python('write', join(dir, 'spec.json'), join(dir, 'ref.glev')) === null) return;
    const file = new Uint8Array(readFileSync(join(dir, 'ref.glev')));
    const decoded = decodeGlev(file, 'ref.glev');
    const expected = toBatch(spec);
    expect(Array.from(decoded.t)).toEqual(Array.from(expected.t));
    expect([Array.from(decoded.x), Array.from(decoded.y), Array.from(decoded.p)]).toEqual([Array.from(expected.x), Array.from(expected.y), Array.from(expected.p)]);
  });
});
