import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { beforeEach, describe, expect, it } from 'vitest';
import { commands } from '../../app/cli/commands';
import { runCli } from '../../app/cli/run-cli';
import { flashScreening } from '../../app/contract/schemas/stimuli';
import { LIBRARY_SCREENING, screenClipFlashes } from '../../app/core/safety';
import { JobRunner } from '../../app/host/jobs';
import { createHostLog } from '../../app/host/log';
import { demoClipRecipes, makeDemoClip } from '../../app/host/stimuli/demo-clips';
import { FlashScreeningService } from '../../app/host/stimuli/flash-screening';
import { StimulusService } from '../../app/host/stimuli/stimulus-service';
import { StimulusStore } from '../../app/host/stimuli/stimulus-store';
import { FlashResult } from '../../renderer/console/stimuli/FlashResult';
import type { StimulusMeta } from '../../app/contract';
import { squareFlashClip, TEST_SENSOR } from '../unit/core/safety/synthetic-flash-clip';

/** The library screen's flash section for a clip, as static markup. */
const shown = (stimulus: StimulusMeta) => renderToStaticMarkup(createElement(FlashResult, { stimulus, cursorS: 0, onPick: () => undefined }));

let dir: string;
let store: StimulusStore;
let jobs: JobRunner;
let screening: FlashScreeningService;

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'gz-flash-'));
  const log = createHostLog({ file: null, echo: false });
  store = new StimulusStore(dir, log);
  jobs = new JobRunner(() => undefined, log, 0);
  screening = new FlashScreeningService(store, jobs, () => undefined);
});

const settled = async () => {
  while (jobs.list().some((j) => j.state === 'running')) await new Promise((r) => setTimeout(r, 10));
};

/** A CSV of the synthetic square clip (t,x,y,p with the sensor size in the header). */
function squareCsv(name: string, flashesPerS: number, side: number): string {
  const clip = squareFlashClip({ flashesPerS, side, durationS: 2 });
  const rows = Array.from(clip.t, (t, i) => `${Math.round(t * 1000)},${clip.x[i]},${clip.y[i]},${clip.p[i]}`);
  const path = join(dir, name);
  writeFileSync(path, `# width=${TEST_SENSOR.width} height=${TEST_SENSOR.height}\nt_ns,x,y,p\n${rows.join('\n')}\n`);
  return path;
}

async function cli(...argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const code = await runCli(argv, commands, { stdout: { write: (s: string) => (stdout += s) }, stderr: { write: (s: string) => (stderr += s), isTTY: false } } as never, 'test');
  return { code, stdout, stderr };
}

const display = ['--screen-mm', '530x298', '--resolution', '1920x1080', '--distance-mm', '600'];

describe('flash screening in the library', () => {
  it('screens the demo warning beacon in every look and stores flash.json beside stats.json', async () => {
    const beacon = demoClipRecipes.find((r) => r.id === 'demo-warning-beacon')!;
    await makeDemoClip(store, beacon, () => undefined);
    expect((await store.get(beacon.id))!.flash).toBeUndefined();
    expect(await screening.job().run(() => undefined)).toBe('screened 1 clips');
    const meta = (await store.get(beacon.id))!;
    const stored = flashScreening.parse(JSON.parse(readFileSync(store.files(beacon.id).flash, 'utf8')));
    expect(meta.flash).toEqual(stored);
    expect(stored.looks.map((l) => l.look)).toEqual(['polarity', 'decay', 'grey']);
    expect(stored.analysedWith).toMatchObject({ ...LIBRARY_SCREENING, analyserVersion: 1 });
    // The beacon turns 1.5 times a second (app/core/sim/warehouse-objects.ts) and flashes once per
    // turn, under WCAG 2.2's three a second, and it is small on the screen: it passes.
    expect(stored.pass).toBe(true);
    expect(meta.mayFlash).toBe(false);
    // One frame every 1/60 s from the first event to the last.
    const frames = Math.floor((meta.tEndUs - meta.tStartUs) / (1e6 / 60)) + 1;
    expect(stored.looks.map((l) => l.frames)).toEqual([frames, frames, frames]);
    expect(await screening.job().run(() => undefined)).toBe('every clip already screened');
    const screen = shown(meta);
    for (const look of ['polarity', 'decay', 'grey']) expect(screen).toContain(`aria-label="${look} look: passes over the whole clip"`);
    expect(screen).toContain('Passes: no flashing above the general or red flash thresholds in any look.');
  });

  it('screens each import as a job, and a failing clip becomes "may flash"', async () => {
    const service = new StimulusService(store, jobs, () => undefined, (id) => screening.start(id));
    service.startImport({ path: squareCsv('strobe.csv', 10, 24), name: 'strobe' });
    await settled();
    const [meta] = await store.list();
    expect(meta!.flash!.pass).toBe(false);
    expect(meta!.mayFlash).toBe(true);
    const polarity = meta!.flash!.looks.find((l) => l.look === 'polarity')!;
    expect(polarity.failures.map((f) => [f.kind, f.flashes_per_s])).toEqual([['general', 10]]);
    const screen = shown(meta!);
    const [failure] = polarity.failures;
    expect(screen).toContain(`aria-label="polarity look: fails at ${failure!.start_s.toFixed(2)}–${failure!.end_s.toFixed(2)} s"`);
    expect(screen).toContain('aria-label="Flash failures"');
    expect(screen).toContain('aria-label="Screen regions that fail: 3"');
    expect(jobs.list().map((j) => [j.kind, j.state])).toEqual([
      ['import', 'done'],
      ['flash-check', 'done'],
    ]);
  });
});

describe('gazeloom events flash-check', () => {
  it('prints the same result as the library screen for the same look and viewing', async () => {
    const path = squareCsv('strobe.csv', 4, 24);
    const { code, stdout, stderr } = await cli('events', 'flash-check', path, '--look', 'polarity', ...display, '--json');
    expect([code, stderr]).toEqual([0, '']);
    const doc = JSON.parse(stdout);
    const expected = screenClipFlashes(squareFlashClip({ flashesPerS: 4, side: 24, durationS: 2 }), TEST_SENSOR, { ...LIBRARY_SCREENING, look: 'polarity' });
    expect(doc).toMatchObject({ pass: false, failures: expected.failures, analysed_with: { look: 'polarity', speed: 1, placement: 'fit', rate_hz: 60, frames: 121 } });
    expect(doc.failures[0]).toMatchObject({ kind: 'general', flashes_per_s: 4 });
  });

  it('passes a small flashing area and reads --speed and --placement', async () => {
    const path = squareCsv('small.csv', 10, 6);
    const small = JSON.parse((await cli('events', 'flash-check', path, ...display, '--json')).stdout);
    expect(small).toMatchObject({ pass: true, failures: [] });
    const big = squareCsv('big.csv', 10, 24);
    const slowOneToOne = JSON.parse((await cli('events', 'flash-check', big, ...display, '--speed', '0.5', '--placement', '1:1', '--json')).stdout);
    expect(slowOneToOne).toMatchObject({ pass: true, analysed_with: { speed: 0.5, placement: '1:1', frames: 241 } });
    const text = (await cli('events', 'flash-check', big, ...display)).stdout;
    expect(text).toMatch(/FAIL: flash screening .* polarity look/);
    expect(text).toMatch(/general flashing 10 a second/);
  });

  it('names a missing display or a bad look', async () => {
    const path = squareCsv('any.csv', 2, 6);
    expect(await cli('events', 'flash-check', path)).toMatchObject({ code: 2, stderr: expect.stringContaining('--screen-mm WxH --resolution WxH --distance-mm D') });
    expect(await cli('events', 'flash-check', path, ...display, '--look', 'bright')).toMatchObject({ code: 2, stderr: expect.stringContaining('--look must be one of polarity, decay, grey, got "bright"') });
  });
});
