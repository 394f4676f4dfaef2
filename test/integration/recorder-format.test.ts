import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSession } from '../../app/host/recording/read-session';
import { examineSession } from '../../app/host/recording/recover-session';
import { streamPath } from '../../app/host/recording/session-files';
import { writeFixtureSession } from '../fixtures/recording/session-fixture';

// The chunk files checked from outside the project: test/fixtures/recording/read_chunks.py
// reads them from the documented layout with Python's standard library (struct, and
// zlib.crc32 for the checksums). Its reading of a frozen session is kept as records.json
// for machines without Python; where /usr/bin/python3 exists it also reads fresh sessions.
const fixtures = join(__dirname, '../fixtures/recording');
const python = '/usr/bin/python3';

/** Records as JSON holds them: NaN as "NaN", as read_chunks.py writes it. */
const asJson = (value: unknown): unknown =>
  typeof value === 'number' && Number.isNaN(value) ? 'NaN' : Array.isArray(value) ? value.map(asJson) : value && typeof value === 'object' ? Object.fromEntries(Object.entries(value).map(([k, v]) => [k, asJson(v)])) : value;

async function ourReading(dir: string) {
  const reader = await readSession(dir);
  const all = async <T>(it: AsyncIterable<T>) => {
    const out: T[] = [];
    for await (const r of it) out.push(r);
    return out;
  };
  return asJson({ gaze: await all(reader.gaze()), frames: await all(reader.frames()), messages: await all(reader.messages()) });
}

const pythonReading = (dir: string) => JSON.parse(execFileSync(python, [join(fixtures, 'read_chunks.py'), dir], { encoding: 'utf8' }));

describe('the session file format', () => {
  it('is frozen: the fixture session is written byte for byte as before', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'gz-format-')), 'session');
    await writeFixtureSession(dir);
    const frozen = join(fixtures, 'session');
    expect(readdirSync(dir).sort()).toEqual(readdirSync(frozen).sort());
    for (const name of readdirSync(frozen)) expect(readFileSync(join(dir, name)), name).toEqual(readFileSync(join(frozen, name)));
  });

  it('reads as the independent Python reader read it (records.json)', async () => {
    const expected = JSON.parse(readFileSync(join(fixtures, 'records.json'), 'utf8'));
    expect(expected.damaged).toEqual({ gaze: 0, frames: 0, messages: 0 });
    expect(await ourReading(join(fixtures, 'session'))).toEqual({ gaze: expected.gaze, frames: expected.frames, messages: expected.messages });
  });

  it.runIf(existsSync(python))('agrees with the Python reader on a fresh session, damaged chunk and all', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'gz-format-')), 'session');
    await writeFixtureSession(dir, 40, 9);
    const clean = pythonReading(dir);
    expect(clean.gaze).toHaveLength(1000);
    expect(await ourReading(dir)).toEqual({ gaze: clean.gaze, frames: clean.frames, messages: clean.messages });

    const { chunks } = (await examineSession(dir, { repair: false })).streams.gaze;
    const file = streamPath(dir, 'gaze');
    const bytes = readFileSync(file);
    bytes[chunks[17]!.offset + 48 + 300] ^= 0x20;
    writeFileSync(file, bytes);
    const damaged = pythonReading(dir);
    expect(damaged.damaged.gaze).toBe(chunks[18]!.offset - chunks[17]!.offset);
    expect(damaged.gaze).toHaveLength(975);
    expect(await ourReading(dir)).toEqual({ gaze: damaged.gaze, frames: damaged.frames, messages: damaged.messages });
  });
});
