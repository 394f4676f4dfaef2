import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Locator, Page } from '@playwright/test';
import { expect, startHost, stopHost, test, type RunningHost } from './support/browser-mode';
import { gazeloomJson } from './support/gazeloom-cli';
import { labRecords, openScreen, PASSPHRASE, registerConsentedParticipant, setUpLab } from './support/lab';
import { openHostFolder } from './support/host-folder';


/** Two short warehouse clips in the library, made by the simulator and imported as a user would. */
async function importClips(page: Page, host: RunningHost) {
  const folder = join(host.dataDir, 'incoming');
  mkdirSync(folder);
  for (const [name, seed] of [['forklift', '4'], ['conveyor', '5']] as const) {
    await gazeloomJson('events', 'simulate', '--scene', 'warehouse', '--duration', '2', '--seed', seed, '--width', '320', '--height', '240', '--out', join(folder, `${name}.glev`), '--tracks', join(folder, `${name}.tracks.tsv`));
  }
  await page.goto(`${host.url}#/stimuli`);
  for (const name of ['forklift', 'conveyor']) {
    await page.getByRole('button', { name: 'Import a recording…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Import a recording' });
    await openHostFolder(dialog, folder);
    await dialog.getByRole('button', { name: new RegExp(`${name}\\.glev`) }).click();
    await dialog.getByRole('button', { name: 'Import', exact: true }).click();
    await expect(dialog.getByRole('status')).toContainText('imported', { timeout: 20_000 });
    await dialog.getByRole('button', { name: 'Close' }).click();
  }
  // The finished imports leave the work tray; it would cover the forms below.
  // So do their flash screenings, once finished: until then a clip counts as "may flash".
  for (const name of ['forklift', 'conveyor']) {
    await page.getByRole('button', { name: new RegExp(`^Dismiss Import ${name}`) }).click();
    await page.getByRole('button', { name: new RegExp(`^Dismiss Flash screening of ${name}`) }).click({ timeout: 60_000 });
  }
}

/** The lab, a study with both clips, and one participant who consented. */
async function setUpStudy(page: Page) {
  await openScreen(page, 'Study');
  await setUpLab(page);
  await page.getByLabel('Study name').fill('Aisle crossings');
  await page.getByRole('button', { name: 'Create the study' }).click();
  // The box shows the stored state, so it turns on once the record is written.
  for (const clip of [/forklift/, /conveyor/]) {
    await page.getByRole('checkbox', { name: clip }).click();
    await expect(page.getByRole('checkbox', { name: clip })).toBeChecked();
  }

  await registerConsentedParticipant(page);
  await expect(page.getByText('Can be run on every clip of the study.')).toBeVisible();
  return (await page.locator('#participant-heading').textContent())!;
}

/** Calibrate, validate, the two clips, a drift check: built and reordered in the editor from the keyboard. */
async function makeProtocol(page: Page) {
  await openScreen(page, 'Protocols');
  await page.getByRole('button', { name: 'New protocol' }).click();
  await page.getByLabel('Protocol name').fill('Two clips');
  await page.getByLabel('Counterbalancing').selectOption('none');
  const steps = page.getByRole('list', { name: 'Steps' });
  await page.getByLabel('New step kind').selectOption('drift_check');
  await page.getByRole('button', { name: 'Add step' }).click();
  await page.getByLabel('New step kind').selectOption('clip');
  await page.getByRole('button', { name: 'Add step' }).click();
  await page.getByRole('button', { name: 'Add step' }).click();
  await page.getByLabel('Step 5 clip').selectOption({ label: 'forklift' });
  await page.getByLabel('Step 6 clip').selectOption({ label: 'conveyor' });
  // [calibrate, validate, message, drift check, clip, clip]: remove the message, move the drift check to the end.
  await steps.getByRole('listitem', { name: 'Step 3: Message screen' }).focus();
  await page.keyboard.press('Delete');
  await expect(page.getByRole('button', { name: 'Undo' })).toBeVisible();
  await steps.getByRole('listitem', { name: 'Step 3: Drift check' }).focus();
  await page.keyboard.press('Alt+ArrowDown');
  await page.keyboard.press('Alt+ArrowDown');
  await expect(steps.getByRole('listitem')).toHaveText([/^Calibrate/, /^Validate/, /^Clip/, /^Clip/, /^Drift check/]);
  await expect(page.getByLabel('Step 3 clip').locator('option:checked')).toHaveText('forklift');
  await expect(page.getByLabel('Step 4 clip').locator('option:checked')).toHaveText('conveyor');
  await page.getByRole('button', { name: 'Save protocol' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved "Two clips" version 1.' })).toBeVisible();
}

async function openStage(browser: Browser, host: RunningHost): Promise<Page> {
  const stage = await (await browser.newContext({ viewport: { width: 960, height: 540 } })).newPage();
  await stage.goto(`${host.origin}/stage/?token=${new URL(host.url).searchParams.get('token')}`);
  await expect(stage.locator('body')).toHaveAttribute('data-ready', 'true');
  return stage;
}


/** The session screen up to the first step: pre-flight checks passed, Enter pressed. Keys only. */
async function startSession(page: Page, code: string) {
  await openScreen(page, 'Session');
  const setup = page.getByRole('form', { name: 'New session' });
  await expect(setup.getByLabel('Participant')).toContainText(code);
  await setup.getByLabel('Width (px)').focus();
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.type('960');
  await setup.getByLabel('Height (px)').focus();
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.type('540');
  await setup.getByRole('button', { name: 'Go to the pre-flight checks' }).focus();
  await page.keyboard.press('Enter');

  const checks = page.getByRole('list', { name: 'Pre-flight checks' });
  await expect(checks).toContainText('✓ Display geometry set');
  await expect(checks).toContainText('✓ Stage page connected and visible');
  await expect(checks).toContainText('✓ Free disk space for the recording');
  await expect(checks).toContainText('Connect the gaze source to check it.');
  await page.getByRole('button', { name: 'Connect the gaze source and start recording' }).focus();
  await page.keyboard.press('Enter');
  await expect(checks).toContainText(/✓ Gaze source connected at its nominal rate: \d+ Hz measured, 500 Hz nominal/, { timeout: 15_000 });
  await expect(page.getByText('All checks passed: press Enter to begin.')).toBeVisible();
  await page.locator('body').focus();
  await page.keyboard.press('Enter');
}

/** Carries on past a recalibration prompt, if the simulated participant's check raised one. */
async function continueIfPrompted(page: Page, next: Locator) {
  const prompt = page.getByRole('alertdialog', { name: 'Recalibration suggested' });
  await expect(next.or(prompt).first()).toBeVisible({ timeout: 20_000 });
  if (await prompt.isVisible()) await page.keyboard.press('Enter');
}

test('an operator runs a whole session from the keyboard: pre-flight, calibrate, validate, two clips, a drift check, a note, a bad mark and the summary', async ({ host, page, browser }) => {
  test.setTimeout(180_000);
  await importClips(page, host);
  const code = await setUpStudy(page);
  await makeProtocol(page);
  const stage = await openStage(browser, host);

  // From here on, only keys.
  await startSession(page, code);

  const session = page.getByRole('region', { name: `Session ${code}` });
  const activity = page.getByTestId('session-activity');
  await expect(activity).toContainText('Step 1 of 5. Calibrating: targets on the stage');
  // A note while calibrating: T, type, Enter.
  await page.keyboard.press('t');
  await expect(page.getByRole('dialog', { name: 'Note' })).toBeVisible();
  await page.keyboard.type('participant adjusted the chair');
  await page.keyboard.press('Enter');
  await expect(session.getByText('1 note saved in this session.')).toBeVisible();

  await expect(activity).toContainText('Step 2 of 5. Validating', { timeout: 20_000 });
  await expect(page.getByTestId('last-result')).toContainText('Validation: mean', { timeout: 20_000 });
  // If the simulated participant's validation was not accepted, carry on without recalibrating (Enter).
  await continueIfPrompted(page, activity.filter({ hasText: 'Step 3 of 5. Playing forklift' }));
  await expect(activity).toContainText('Step 4 of 5. Playing conveyor', { timeout: 20_000 });
  // Mark the running clip bad (B, reason, Enter): it ends as bad.
  await page.keyboard.press('b');
  const badDialog = page.getByRole('dialog', { name: /^Mark step \d bad$/ });
  await expect(badDialog).toBeVisible();
  await page.keyboard.type('participant looked away');
  await page.keyboard.press('Enter');
  await expect(page.getByRole('table', { name: 'Session steps' })).toContainText('participant looked away');

  const summary = page.getByRole('region', { name: 'Session summary' });
  await continueIfPrompted(page, summary);
  await expect(summary).toContainText('completed');
  const figures = summary.getByLabel('Session figures');
  await expect(figures).toContainText(/Trials done\s*[45] of 5 steps/);
  await expect(summary.getByRole('table', { name: 'Validation results' }).getByRole('row')).toHaveCount(3); // header, validation, drift check
  await expect(summary.getByTestId('session-backup')).toContainText('Backed up to', { timeout: 30_000 });
  await stage.close();

  // Everything went to the lab database as it happened.
  const [sessions, trials, validations, calibrations, notes] = await Promise.all(['sessions', 'trials', 'validations', 'calibrations', 'notes'].map((s) => labRecords(page, s)));
  expect(sessions).toHaveLength(1);
  expect(sessions[0]).toMatchObject({ state: 'completed', protocolVersion: 1 });
  expect(trials.map((t) => `${t.kind}:${t.state}`).sort()).toEqual(expect.arrayContaining(['calibrate:done', 'clip:bad', 'clip:done', 'drift_check:done']));
  expect(trials.every((t) => typeof t.startedHostNs === 'number' && typeof t.endedHostNs === 'number')).toBe(true);
  expect(validations.map((v) => v.kind).sort()).toEqual(['drift_check', 'validation']);
  expect(calibrations).toHaveLength(1);
  expect(notes).toHaveLength(1);
  expect(JSON.stringify(notes)).not.toContain('chair');
  expect(typeof notes[0]!.hostNs).toBe('number');
});

test('after the host is killed mid-session, the console offers to resume from the next unfinished trial and the session completes', async ({ host, page, browser }) => {
  test.setTimeout(180_000);
  await importClips(page, host);
  const code = await setUpStudy(page);
  await makeProtocol(page);
  let stage = await openStage(browser, host);
  await startSession(page, code);
  const activity = page.getByTestId('session-activity');
  await continueIfPrompted(page, activity.filter({ hasText: 'Step 3 of 5. Playing forklift' }));
  await stopHost(host, { signal: 'SIGKILL', keepData: true });
  await stage.close();

  // The same data folder and port (so the same browser storage), as after a power cut and a restart.
  const again = await startHost(['--port', new URL(host.url).port], host.dataDir);
  try {
    await page.goto(`${again.url}#/session`);
    await page.getByLabel('Lab passphrase').fill(PASSPHRASE);
    await page.getByRole('button', { name: 'Unlock' }).click();
    await page.getByRole('button', { name: 'Continue' }).click({ timeout: 20_000 });
    stage = await openStage(browser, again);
    const offers = page.getByRole('region', { name: 'Unfinished sessions' });
    await expect(offers).toContainText(`${code} on Two clips`);
    await expect(offers).toContainText('its recording was recovered', { timeout: 20_000 });
    await offers.getByRole('button', { name: 'Resume from trial 3' }).focus();
    await page.keyboard.press('Enter');

    const steps = page.getByRole('table', { name: 'Session steps' });
    await expect(steps.getByRole('row')).toHaveText([/#/, /Calibrate\s*done/, /Validate\s*done/, /forklift\s*pending/, /conveyor\s*pending/, /Drift check\s*pending/]);
    await expect(activity).toContainText('Step 3 of 5. Ready: press Enter');
    await page.keyboard.press('Enter');
    await expect(activity).toContainText('Step 3 of 5. Playing forklift', { timeout: 20_000 });
    const summary = page.getByRole('region', { name: 'Session summary' });
    await continueIfPrompted(page, summary);
    await expect(summary).toContainText('completed');
    await expect(summary.getByLabel('Session figures')).toContainText(/Trials done\s*5 of 5 steps \(2 of 2 clips\)/);
    await expect(summary.getByTestId('session-backup')).toContainText('Backed up to', { timeout: 30_000 });
    await stage.close();

    const sessions = await labRecords(page, 'sessions');
    expect(sessions).toHaveLength(1);
    expect(sessions[0]).toMatchObject({ state: 'completed' });
    const trials = await labRecords(page, 'trials');
    expect(trials.map((t) => `${t.index}:${t.state}`).sort()).toEqual(['0:done', '1:done', '2:done', '3:done', '4:done']);
    const inspection = await gazeloomJson('recording', 'inspect', join(again.dataDir, 'recordings', String(sessions[0]!.id)));
    expect(inspection.clean_close).toBe(true);
  } finally {
    await stopHost(again);
  }
});
