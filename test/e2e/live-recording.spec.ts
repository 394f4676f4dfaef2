import { mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from '@playwright/test';
import { expect, startHost, stopHost, test, type RunningHost } from './support/browser-mode';
import { freeUdpPort, gazeloomJson, gazeloomProcess } from './support/gazeloom-cli';
import { openHostFolder } from './support/host-folder';

/** The stage in a browser window of its own, as browser mode asks (a background tab would be throttled). */
async function openStage(browser: Browser, host: RunningHost): Promise<Page> {
  const stage = await (await browser.newContext({ viewport: { width: 960, height: 540 } })).newPage();
  await stage.goto(`${host.origin}/stage/?token=${new URL(host.url).searchParams.get('token')}`);
  await expect(stage.locator('body')).toHaveAttribute('data-ready', 'true');
  return stage;
}

async function startRecording(page: Page, source: 'simulated' | { feed: string }) {
  await page.goto(`${page.url().split('#')[0]}#/live`);
  await page.getByLabel('Width (px)').fill('960');
  await page.getByLabel('Height (px)').fill('540');
  if (source !== 'simulated') {
    await page.getByRole('radio', { name: /Gaze feed/ }).check();
    await page.getByLabel('Gaze feed address').fill(source.feed);
  }
  await page.getByRole('button', { name: 'Start recording' }).click();
  await expect(page.getByText(/session-.*samples/)).toBeVisible();
}

async function stopRecording(page: Page) {
  await page.getByRole('button', { name: 'Stop recording…' }).click();
  await page.getByRole('alertdialog', { name: 'Confirm stop' }).getByRole('button', { name: 'Stop recording' }).click();
  await expect(page.getByRole('button', { name: 'Start recording' })).toBeVisible();
}

const sessionDir = (host: RunningHost) => {
  const root = join(host.dataDir, 'recordings');
  return join(root, readdirSync(root).find((n) => n.startsWith('session-'))!);
};

test('a clip plays on the stage while the simulated tracker is recorded, and frame log and gaze line up in host time', async ({ host, page, browser }) => {
  // A short simulated clip with its ground-truth tracks, imported through the library.
  const folder = join(host.dataDir, 'incoming');
  mkdirSync(folder);
  await gazeloomJson('events', 'simulate', '--scene', 'warehouse', '--duration', '1.5', '--seed', '4', '--width', '320', '--height', '240', '--out', join(folder, 'aisle.glev'), '--tracks', join(folder, 'aisle.tracks.tsv'));
  await page.goto(`${host.url}#/stimuli`);
  await page.getByRole('button', { name: 'Import a recording…' }).click();
  const dialog = page.getByRole('dialog', { name: 'Import a recording' });
  await openHostFolder(dialog, folder);
  await dialog.getByRole('button', { name: /aisle\.glev/ }).click();
  await dialog.getByRole('button', { name: 'Import', exact: true }).click();
  await expect(dialog.getByRole('status')).toContainText('imported', { timeout: 20_000 });
  await dialog.getByRole('button', { name: 'Close' }).click();

  const stage = await openStage(browser, host);
  await startRecording(page, 'simulated');
  await page.getByRole('button', { name: 'Play on stage' }).click();
  await expect(page.getByTestId('playback-state')).toContainText(/: playing at/);
  // The console shows the gaze live while the clip plays.
  await expect(page.getByText(/Sample rate\s*\d+ Hz/)).toBeVisible();
  await expect(page.getByTestId('playback-state')).toContainText('No clip playing', { timeout: 20_000 });
  await stopRecording(page);
  await stage.close();

  const dir = sessionDir(host);
  const inspection = await gazeloomJson('recording', 'inspect', dir);
  expect(inspection.clean_close).toBe(true);
  expect(inspection.corrupt_chunks).toBe(0);
  expect(inspection.samples as number).toBeGreaterThan(500);
  await gazeloomJson('recording', 'export', dir, '--out', join(dir, 'gaze.tsv'), '--stimulus');
  const rows = readFileSync(join(dir, 'gaze.tsv'), 'utf8').trim().split('\n');
  const header = rows[0]!.split('\t');
  const clip = header.indexOf('clip');
  const stimulusTime = header.indexOf('stimulus_time_us');
  const onClip = rows.slice(1).map((r) => r.split('\t')).filter((cells) => cells[clip] !== 'n/a');
  // The stage's frames put the clip on the gaze samples' host times: about 1.5 s of the 500 Hz samples.
  expect(onClip.length).toBeGreaterThan(0.8 * 1.5 * 500);
  expect(onClip.length).toBeLessThan(1.2 * 1.5 * 500);
  const times = onClip.map((cells) => Number(cells[stimulusTime]));
  expect(times.every((t, i) => i === 0 || t >= times[i - 1]!)).toBe(true); // stimulus time only moves forward
});

test('the console raises the no-gaze alarm when the tracker process stops sending', async ({ host, page }) => {
  const port = await freeUdpPort();
  await page.goto(host.url);
  await startRecording(page, { feed: `udp://127.0.0.1:${port}` });
  const tracker = gazeloomProcess('tracker', 'simulate', '--to', `udp://127.0.0.1:${port}`, '--rate', '250', '--seconds', '3', '--seed', '9');
  await expect(page.getByText(/Sample rate\s*2\d\d Hz/)).toBeVisible({ timeout: 10_000 });
  await expect(page.getByRole('alert')).toHaveCount(0);
  await new Promise((resolve) => tracker.once('exit', resolve));
  await expect(page.getByRole('alert')).toContainText('No gaze sample for', { timeout: 5_000 });
  await stopRecording(page);
});

test('a target shown from the console is drawn on the stage', async ({ host, page, browser }) => {
  const stage = await openStage(browser, host);
  await page.goto(`${host.url}#/live`);
  await page.getByRole('button', { name: 'Target at the centre' }).click();
  const centre = async () =>
    stage.evaluate(() => {
      const canvas = document.getElementById('stage') as HTMLCanvasElement;
      const copy = document.createElement('canvas');
      copy.width = canvas.width;
      copy.height = canvas.height;
      const ctx = copy.getContext('2d')!;
      ctx.drawImage(canvas, 0, 0);
      const x = Math.floor(canvas.width / 2);
      const y = Math.floor(canvas.height / 2);
      return { dot: Array.from(ctx.getImageData(x, y, 1, 1).data.slice(0, 3)), ring: Array.from(ctx.getImageData(x + 7, y, 1, 1).data.slice(0, 3)) };
    });
  // White disc with a black centre dot, shrinking onto its resting size.
  await expect.poll(centre).toEqual({ dot: [0, 0, 0], ring: [255, 255, 255] });
  await page.getByRole('button', { name: 'Hide target' }).click();
  await expect.poll(async () => (await centre()).ring).toEqual([128, 128, 128]);
});

test('after the host is killed mid-recording, the next start recovers the session and the operator can resume it', async ({ host, page, browser }) => {
  await page.goto(host.url);
  await startRecording(page, 'simulated');
  await expect(page.getByText(/session-\S+: [1-9][\d,]* samples/)).toBeVisible();
  await page.waitForTimeout(1500); // let a second or so of gaze reach the disk
  await stopHost(host, { signal: 'SIGKILL', keepData: true });

  const again = await startHost([], host.dataDir);
  try {
    const console2 = await (await browser.newContext()).newPage();
    await console2.goto(`${again.url}#/live`);
    const panel = console2.getByRole('region', { name: 'Unfinished recordings' });
    await expect(panel).toContainText(/session-\S+: [1-9][\d,]* samples/);
    const recovered = Number((await panel.textContent())!.match(/: ([\d,]+) samples/)![1]!.replace(/,/g, ''));
    expect(recovered).toBeGreaterThan(200); // 500 Hz for over a second, less at most the last flush interval
    await panel.getByRole('button', { name: 'Resume recording' }).click();
    await expect(console2.getByText(/session-\S+: [\d,]+ samples/)).toBeVisible();
    await console2.waitForTimeout(500);
    await stopRecording(console2);
    const inspection = await gazeloomJson('recording', 'inspect', sessionDir(again));
    expect(inspection.clean_close).toBe(true);
    expect(inspection.samples as number).toBeGreaterThan(recovered);
  } finally {
    await stopHost(again);
  }
});
