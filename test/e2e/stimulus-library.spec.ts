import { writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test } from './support/browser-mode';
import type { Page } from '@playwright/test';
import { openHostFolder } from './support/host-folder';

/** A 64x48 stream: one event at t = 0, a 10x10 block of ON events at 0.5 s, one event at 1 s. */
function writeBlockClip(dir: string): string {
  const lines = ['# width=64 height=48', 't,x,y,p', '0,0,0,1'];
  for (let y = 10; y < 20; y++) for (let x = 10; x < 20; x++) lines.push(`500000,${x},${y},1`);
  lines.push('1000000,63,47,0');
  const file = join(dir, 'block.csv');
  writeFileSync(file, `${lines.join('\n')}\n`);
  return file;
}

async function importFrom(page: Page, folder: string, fileName: string) {
  await page.getByRole('button', { name: 'Import a recording…' }).click();
  const dialog = page.getByRole('dialog', { name: 'Import a recording' });
  await openHostFolder(dialog, folder);
  await dialog.getByRole('button', { name: new RegExp(fileName) }).click();
  await dialog.getByRole('button', { name: 'Import', exact: true }).click();
  return dialog;
}

test('import a recording, scrub the preview and read the events back from its canvas', async ({ host, page }) => {
  const folder = join(host.dataDir, 'incoming');
  mkdirSync(folder);
  writeBlockClip(folder);
  await page.goto(`${host.url}#/stimuli`);
  const dialog = await importFrom(page, folder, 'block.csv');
  await expect(dialog.getByRole('status')).toContainText('imported 102 events', { timeout: 20_000 });
  await dialog.getByRole('button', { name: 'Close' }).click();

  await expect(page.getByRole('heading', { name: 'block', level: 2 })).toBeVisible();
  await expect(page.getByText('102 (101 ON, 1 OFF)')).toBeVisible();

  await page.getByRole('slider', { name: /Stimulus time/ }).fill('500');
  const canvas = page.getByTestId('preview-canvas');
  await expect(canvas).toHaveAttribute('data-time-us', '500000');
  const pixels = await canvas.evaluate((element: HTMLCanvasElement) => {
    const context = element.getContext('2d')!;
    const at = (x: number, y: number) => Array.from(context.getImageData(x, y, 1, 1).data.slice(0, 3));
    return { inside: at(15, 15), corner: at(10, 19), outside: at(30, 30) };
  });
  // Polarity look: ON events of the current frame in the ON colour, elsewhere the background.
  expect(pixels.inside).toEqual([255, 184, 28]);
  expect(pixels.corner).toEqual([255, 184, 28]);
  expect(pixels.outside).toEqual([128, 128, 128]);

  // A frame later the block has gone (the polarity look shows one display frame).
  await page.getByRole('slider', { name: /Stimulus time/ }).fill('600');
  await expect(canvas).toHaveAttribute('data-time-us', '600000');
  expect(await canvas.evaluate((element: HTMLCanvasElement) => Array.from(element.getContext('2d')!.getImageData(15, 15, 1, 1).data.slice(0, 3)))).toEqual([
    128, 128, 128,
  ]);
});

test('a malformed file is refused with its line, and the library stays as it was', async ({ host, page }) => {
  const folder = join(host.dataDir, 'incoming');
  mkdirSync(folder);
  writeFileSync(join(folder, 'broken.csv'), 't,x,y,p\n0,1,1,1\n10,2,two,1\n');
  await page.goto(`${host.url}#/stimuli`);
  await expect(page.getByText('The library is empty.')).toBeVisible();
  const dialog = await importFrom(page, folder, 'broken.csv');
  await expect(dialog.getByRole('alert')).toContainText('broken.csv line 3');
  await dialog.getByRole('button', { name: 'Cancel' }).click();
  await expect(page.getByText('The library is empty.')).toBeVisible();
});
