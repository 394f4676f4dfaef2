import { mkdirSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from '@playwright/test';
import type { MessageRecord } from '../../app/core/recording/records';
import { readSession } from '../../app/host/recording/read-session';
import { expect, test, type RunningHost } from './support/browser-mode';
import { gazeloomJson } from './support/gazeloom-cli';
import { openHostFolder } from './support/host-folder';

/** The stage in a browser window of its own, as browser mode asks (a background tab would be throttled). */
async function openStage(browser: Browser, host: RunningHost): Promise<Page> {
  const stage = await (await browser.newContext({ viewport: { width: 960, height: 540 } })).newPage();
  await stage.goto(`${host.origin}/stage/?token=${new URL(host.url).searchParams.get('token')}`);
  await expect(stage.locator('body')).toHaveAttribute('data-ready', 'true');
  return stage;
}

/** A warehouse clip long enough to be still playing when the stage is blanked. */
async function importClip(page: Page, host: RunningHost) {
  const folder = join(host.dataDir, 'incoming');
  mkdirSync(folder);
  await gazeloomJson('events', 'simulate', '--scene', 'warehouse', '--duration', '15', '--seed', '4', '--width', '160', '--height', '120', '--out', join(folder, 'aisle.glev'), '--tracks', join(folder, 'aisle.tracks.tsv'));
  await page.goto(`${host.url}#/stimuli`);
  await page.getByRole('button', { name: 'Import a recording…' }).click();
  const dialog = page.getByRole('dialog', { name: 'Import a recording' });
  // The dialog opens at the home folder once the host has listed it; then the field is ours.
  await expect(dialog.getByRole('list', { name: 'Folder contents' })).toBeVisible();
  await openHostFolder(dialog, folder);
  await dialog.getByRole('button', { name: /aisle\.glev/ }).click();
  await dialog.getByRole('button', { name: 'Import', exact: true }).click();
  await expect(dialog.getByRole('status')).toContainText('imported', { timeout: 30_000 });
  await dialog.getByRole('button', { name: 'Close' }).click();
  await page.getByRole('button', { name: /^Dismiss Import aisle/ }).click();
}

async function messagesOf(host: RunningHost): Promise<MessageRecord[]> {
  const root = join(host.dataDir, 'recordings');
  const dir = join(root, readdirSync(root).find((n) => n.startsWith('session-'))!);
  const out: MessageRecord[] = [];
  for await (const m of (await readSession(dir)).messages()) out.push(m);
  return out;
}

test('the stage key and the console button blank the stage to grey and pause the clip at once, and the recording marks both', async ({ host, page, browser }) => {
  test.slow(); // an import, a recording and a clip on two pages
  await importClip(page, host);
  const stage = await openStage(browser, host);
  await page.goto(`${host.url}#/live`);
  const header = page.getByRole('banner');
  // No recording, nothing blanked: no button in the header.
  await expect(header.getByRole('button', { name: 'Blank stage' })).toHaveCount(0);
  await page.getByLabel('Width (px)').fill('960');
  await page.getByLabel('Height (px)').fill('540');
  await page.getByRole('button', { name: 'Start recording' }).click();
  await expect(page.getByText(/session-.*samples/)).toBeVisible();
  await expect(header.getByRole('button', { name: 'Blank stage' })).toBeVisible();

  await page.getByRole('button', { name: 'Play on stage' }).click();
  await expect(page.getByTestId('playback-state')).toContainText(/: playing at/, { timeout: 20_000 });

  // The key on the stage page, which has the focus there.
  await stage.locator('body').click();
  await stage.keyboard.press('x');
  await expect(stage.locator('body')).toHaveAttribute('data-blanked', 'true');
  await expect(header.getByRole('status').filter({ hasText: 'Stage blanked' })).toContainText('by the stage key (stage key X)');
  await expect(page.getByTestId('playback-state')).toContainText(/: paused/);
  // Resuming the clip is refused while the stage is blank.
  await page.getByRole('button', { name: 'Resume' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'the stage is blanked' })).toBeVisible();

  await header.getByRole('button', { name: 'Unblank stage' }).click();
  await expect(stage.locator('body')).toHaveAttribute('data-blanked', 'false');
  await expect(page.getByTestId('playback-state')).toContainText(/: paused/);
  await page.getByRole('button', { name: 'Resume' }).click();
  await expect(page.getByTestId('playback-state')).toContainText(/: playing/);

  // The console button.
  await header.getByRole('button', { name: 'Blank stage' }).click();
  await expect(stage.locator('body')).toHaveAttribute('data-blanked', 'true');
  await expect(header.getByRole('status').filter({ hasText: 'Stage blanked' })).toContainText('by the console (console button)');
  await expect(page.getByTestId('playback-state')).toContainText(/: paused/);
  await header.getByRole('button', { name: 'Unblank stage' }).click();
  await expect(stage.locator('body')).toHaveAttribute('data-blanked', 'false');

  await page.getByRole('button', { name: 'Stop clip' }).click();
  await page.getByRole('button', { name: 'Stop recording…' }).click();
  await page.getByRole('alertdialog', { name: 'Confirm stop' }).getByRole('button', { name: 'Stop recording' }).click();
  await expect(page.getByRole('button', { name: 'Start recording' })).toBeVisible();
  await stage.close();

  const messages = await messagesOf(host);
  const marks = messages.filter((m) => m.kind.startsWith('stage_') || m.kind === 'clip_pause');
  // The stage key pauses the clip on the stage itself, at the key press, then tells the host;
  // the console button goes through the host, which blanks and then pauses.
  expect(marks.map((m) => m.kind)).toEqual(['clip_pause', 'stage_blanked', 'stage_unblanked', 'stage_blanked', 'clip_pause', 'stage_unblanked']);
  expect(marks[1]!.data).toMatchObject({ by: 'stage_key', reason: 'stage key X', clip: expect.stringMatching(/^aisle/) });
  expect(marks[0]!.hostNs).toBeLessThanOrEqual(marks[1]!.hostNs);
  expect(marks[3]!.data).toMatchObject({ by: 'console', reason: 'console button', clip: expect.stringMatching(/^aisle/) });
});
