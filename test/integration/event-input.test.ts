import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { concatBatches, type EventBatch } from '../../app/core/events/event-batch';
import { openEventInput } from '../../app/host/events/event-input';
import { writeEventFile } from '../../app/host/events/event-output';

const dir = mkdtempSync(join(tmpdir(), 'gz-input-'));

async function collect(path: string, options: Parameters<typeof openEventInput>[1]) {
  const progress: number[] = [];
  const input = await openEventInput(path, options, (f) => progress.push(f));
  const batches: EventBatch[] = [];
  for await (const batch of input.batches()) batches.push(batch);
  await input.close();
  return { input, events: concatBatches(batches), batches: batches.length, progress };
}

// 400k events in a text file of about 6 MB: streamed in 4 MiB chunks when forced.
const rows = Array.from({ length: 400_000 }, (_, i) => `${i * 5},${i % 97},${i % 53},${i & 1}`);
const text = join(dir, 'aisle.csv');
writeFileSync(text, `t,x,y,p\n${rows.join('\n')}\n`);

describe('reading event files whole or streamed', () => {
  it('gives the same events either way, and learns the sensor size by a first pass when streaming', async () => {
    const whole = await collect(text, {});
    const streamed = await collect(text, { wholeFileLimitBytes: 0 });
    expect(streamed.batches).toBeGreaterThan(1);
    expect(Array.from(streamed.events.t)).toEqual(Array.from(whole.events.t));
    expect(Array.from(streamed.events.x)).toEqual(Array.from(whole.events.x));
    expect(streamed.input.sensor).toEqual({ width: 97, height: 53 });
    expect(whole.input.sensor).toEqual({ width: 97, height: 53 });
    expect(streamed.input.warnings[0]).toContain('does not state its sensor size; using 97x53');
    // Progress only moves forward and ends at 1, across the first pass and the second.
    expect(streamed.progress.at(-1)).toBe(1);
    expect(streamed.progress.every((f, i) => i === 0 || f >= streamed.progress[i - 1]!)).toBe(true);
  });

  it('streams with a given sensor in one pass, and .glev files chunk by chunk', async () => {
    const given = await collect(text, { wholeFileLimitBytes: 0, sensor: { width: 100, height: 60 } });
    expect(given.input.warnings).toEqual([]);
    expect(given.events.t.length).toBe(400_000);
    const glev = join(dir, 'aisle.glev');
    await writeEventFile(glev, { sensor: { width: 100, height: 60 }, resolution: 'us' }, [given.events]);
    const back = await collect(glev, {});
    expect(back.input.kind).toBe('glev');
    expect(back.batches).toBe(Math.ceil(400_000 / 65_536));
    expect(Array.from(back.events.y)).toEqual(Array.from(given.events.y));
  });
});
