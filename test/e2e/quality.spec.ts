import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from '@playwright/test';
import { expect, test } from './support/browser-mode';
import { gazeloomJson } from './support/gazeloom-cli';
import { labRecords, openScreen, registerConsentedParticipant, setUpLab } from './support/lab';

interface CliSession {
  session: string;
  validations: { mean_accuracy_deg: number; max_accuracy_deg: number; precision_rms_s2s_deg: number; precision_sd_deg: number; data_loss_pct: number; accepted: boolean }[];
  drift: { offset_deg: number; dx_deg: number; dy_deg: number }[];
  drift_rate_deg_per_min: number;
  data_loss_pct: number;
  flags: string[];
}

const deg = (v: number) => `${v.toFixed(3)}°`;

/** Restores a lab archive through the Backups screen into the page's empty profile and opens it with the demo passphrase. */
async function restoreDemo(page: Page, hostUrl: string, archive: string): Promise<void> {
  await page.goto(`${hostUrl}#/archive`);
  await expect(page.getByText('This profile is empty')).toBeVisible();
  await page.getByLabel('Archive path').fill(archive);
  await page.getByRole('button', { name: 'Restore into this profile' }).click();
  await expect(page.getByRole('heading', { name: 'The console is locked' })).toBeVisible({ timeout: 30_000 });
  await page.getByLabel('Lab passphrase').fill('gazeloom-demo');
  await page.getByRole('button', { name: 'Unlock' }).click();
  await expect(page.getByRole('radio', { name: 'Demo operator' })).toBeChecked({ timeout: 20_000 });
  await page.getByRole('button', { name: 'Continue' }).click();
  await openScreen(page, 'Study');
  await page.getByRole('button', { name: 'Demo: warehouse aisle saliency' }).click();
}

test('the demo study on the quality screens: heavy drift flagged first, figures as on the command line, a correction applied and removed, exclusions', async ({ host, page }) => {
  test.setTimeout(180_000);
  const work = mkdtempSync(join(tmpdir(), 'gazeloom-quality-e2e-'));
  try {
    const archive = join(work, 'demo');
    const demo = (await gazeloomJson('demo', '--out', archive, '--participants', '3')) as { participants: { code: string; session_id: string; drift_deg_per_min: number }[] };
    const drifting = demo.participants.find((p) => p.drift_deg_per_min >= 1)!;
    const cli = ((await gazeloomJson('quality', '--archive', archive)) as { sessions: CliSession[] }).sessions;
    const expected = cli.find((s) => s.session === drifting.session_id)!;
    expect(expected.flags).toContain('drift_exceeded');

    await restoreDemo(page, host.url, archive);
    await openScreen(page, 'Quality');
    const table = page.getByRole('table', { name: 'Sessions by quality' });
    const rows = table.getByRole('row');
    await expect(rows).toHaveCount(1 + demo.participants.length);
    // Flagged first, whatever the column sorted by.
    await expect(rows.nth(1)).toContainText(drifting.code);
    await expect(rows.nth(1)).toContainText('drift exceeded');
    await table.getByRole('button', { name: 'Sort by Participant' }).click();
    await expect(rows.nth(1)).toContainText(drifting.code);
    await table.getByRole('button', { name: 'Sort by Participant' }).click();
    await expect(table.getByRole('columnheader', { name: /Participant/ })).toHaveAttribute('aria-sort', 'descending');
    await expect(rows.nth(1)).toContainText(drifting.code);
    // Every session's data loss reads as on the command line once the recordings are read.
    for (const s of cli) {
      const code = demo.participants.find((p) => p.session_id === s.session)!.code;
      await expect(table.getByRole('row').filter({ hasText: code })).toContainText(`${s.data_loss_pct.toFixed(1)} %`);
    }

    await table.getByRole('button', { name: `Review session of ${drifting.code}` }).click();
    await expect(page.getByRole('heading', { name: new RegExp(`Session ${drifting.code}`) })).toBeVisible();
    const validations = page.getByRole('table', { name: 'Validations of the session' });
    const v = expected.validations[0]!;
    for (const text of [deg(v.mean_accuracy_deg), deg(v.max_accuracy_deg), deg(v.precision_rms_s2s_deg), deg(v.precision_sd_deg), `${v.data_loss_pct.toFixed(1)} %`]) await expect(validations).toContainText(text);
    const drift = page.getByRole('table', { name: 'Drift checks of the session' });
    await expect(drift.getByRole('row')).toHaveCount(1 + expected.drift.length);
    for (const d of expected.drift) await expect(drift).toContainText(deg(d.offset_deg));
    await expect(page.getByTestId('drift-rate')).toHaveText(`${expected.drift_rate_deg_per_min.toFixed(3)}°/min`);
    await expect(page.getByTestId('session-flags')).toHaveText('drift exceeded, drift rate high');
    await expect(page.getByRole('img', { name: /Validation points on the screen/ })).toBeVisible();
    await expect(page.getByRole('table', { name: 'Accuracy and precision per point' }).getByRole('row')).toHaveCount(1 + 9);
    for (const plot of ['Drift over time', 'Data loss over time', 'Late frames over time', 'Gaze over time']) await expect(page.getByRole('img', { name: new RegExp(`^${plot}`) })).toBeVisible();

    // A correction fitted on the drift checks, judged on the validation it never saw.
    await expect(page.getByTestId('correction-state')).toHaveText(/^Correction off/);
    await page.getByRole('radiogroup', { name: /^Use of the validation at/ }).getByLabel('hold out').check();
    // The held-out error without the correction is the validation's own mean accuracy.
    await expect(page.getByTestId('correction-preview')).toContainText(`Held-out error: ${deg(v.mean_accuracy_deg)} without`);
    await page.getByLabel('Model').selectOption('offset');
    await page.getByRole('button', { name: 'Apply the correction' }).click();
    await expect(page.getByTestId('correction-state')).toContainText('Correction on: Constant offset');
    await expect(page.getByRole('heading', { name: new RegExp(`Session ${drifting.code}`) })).toContainText('correction on');
    await expect(table.getByRole('row').filter({ hasText: drifting.code })).toContainText('correction on');
    let corrections = await labRecords(page, 'corrections');
    expect(corrections).toHaveLength(1);
    expect(corrections[0]).toMatchObject({ sessionId: drifting.session_id, model: 'offset', enabled: true, removedAt: null, fromValidationIds: expect.any(Array), heldOutValidationIds: [expect.stringContaining(drifting.session_id)] });
    expect((corrections[0]!.fromValidationIds as string[]).length).toBe(expected.drift.length);
    const validationsBefore = JSON.stringify(await labRecords(page, 'validations'));
    await page.getByRole('button', { name: 'Remove the correction…' }).click();
    await page.getByRole('button', { name: 'Remove the correction', exact: true }).click();
    await expect(page.getByTestId('correction-state')).toHaveText(/^Correction off/);
    await expect(table.getByRole('row').filter({ hasText: drifting.code })).not.toContainText('correction on');
    await expect(page.getByRole('list', { name: 'Removed corrections' })).toContainText('Constant offset');
    corrections = await labRecords(page, 'corrections');
    expect(corrections).toHaveLength(1);
    expect(corrections[0]).toMatchObject({ enabled: false, removedAt: expect.any(String) });
    expect(JSON.stringify(await labRecords(page, 'validations'))).toBe(validationsBefore);

    // Exclusions: a time range, then the whole session (shown in the study table), then revoked.
    const form = page.getByRole('form', { name: 'New exclusion' });
    await form.getByRole('button', { name: 'Add the exclusion' }).click();
    await expect(form.getByRole('alert')).toHaveText('Give a reason.');
    await form.getByLabel('A time range').check();
    await form.getByLabel('From (s)').fill('20');
    await form.getByLabel('To (s)').fill('30');
    await form.getByLabel('Reason for the exclusion').fill('participant looked away from the screen');
    await form.getByRole('button', { name: 'Add the exclusion' }).click();
    const decisions = page.getByRole('list', { name: 'Exclusion decisions' });
    await expect(decisions).toContainText('From 20 s to 30 s: participant looked away from the screen');
    await form.getByLabel('The whole session').check();
    await form.getByLabel('Reason for the exclusion').fill('drift beyond repair');
    await form.getByRole('button', { name: 'Add the exclusion' }).click();
    await expect(table.getByRole('row').filter({ hasText: drifting.code })).toContainText('excluded');
    await page.getByRole('button', { name: 'Revoke: Whole session' }).click();
    await page.getByRole('button', { name: 'Revoke the exclusion' }).click();
    await expect(table.getByRole('row').filter({ hasText: drifting.code })).not.toContainText('excluded');
    const exclusions = await labRecords(page, 'exclusions');
    expect(exclusions.map((e) => [(e.scope as { kind: string }).kind, e.revokedAt === null]).sort()).toEqual([
      ['session', false],
      ['time_range', true],
    ]);
    const actions = (await labRecords(page, 'audit')).map((a) => a.action);
    for (const action of ['apply_correction', 'remove_correction', 'exclude', 'revoke_exclusion']) expect(actions).toContain(action);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
});

test('during a session the operator repeats chosen points of the last validation, and the merged result is a new validation record', async ({ host, page, browser }) => {
  test.setTimeout(180_000);
  await page.goto(`${host.url}#/study`);
  await setUpLab(page);
  await page.getByLabel('Study name').fill('Aisle crossings');
  await page.getByRole('button', { name: 'Create the study' }).click();
  await registerConsentedParticipant(page);
  await expect(page.getByText('Form v2, signed')).toBeVisible();
  // The new protocol's steps: calibrate, validate, a closing message.
  await openScreen(page, 'Protocols');
  await page.getByRole('button', { name: 'New protocol' }).click();
  await page.getByLabel('Protocol name').fill('Validation only');
  await page.getByRole('button', { name: 'Save protocol' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved "Validation only" version 1.' })).toBeVisible();

  const stage = await (await browser.newContext({ viewport: { width: 960, height: 540 } })).newPage();
  await stage.goto(`${host.origin}/stage/?token=${new URL(host.url).searchParams.get('token')}`);
  await expect(stage.locator('body')).toHaveAttribute('data-ready', 'true');
  await openScreen(page, 'Session');
  const setup = page.getByRole('form', { name: 'New session' });
  await setup.getByLabel('Width (px)').fill('960');
  await setup.getByLabel('Height (px)').fill('540');
  await setup.getByRole('button', { name: 'Go to the pre-flight checks' }).click();
  await page.getByRole('button', { name: 'Connect the gaze source and start recording' }).click();
  await expect(page.getByText('All checks passed: press Enter to begin.')).toBeVisible({ timeout: 20_000 });
  await page.getByRole('button', { name: /^Begin the session/ }).click();
  const activity = page.getByTestId('session-activity');
  const prompt = page.getByRole('alertdialog', { name: 'Recalibration suggested' });
  const message = activity.filter({ hasText: 'Step 3 of 3' });
  await expect(message.or(prompt).first()).toBeVisible({ timeout: 30_000 });
  if (await prompt.isVisible()) await prompt.getByRole('button', { name: /^Continue without/ }).click();
  await expect(message).toBeVisible();

  // The closing message waits for Enter: meanwhile, points 2 and 5 are shown again.
  await page.getByText(/^Last validation, point by point/).click();
  const points = page.getByRole('table', { name: 'Points of the last validation' });
  await expect(points.getByRole('row')).toHaveCount(1 + 5); // the new protocol's 5-point layout
  await points.getByLabel('Repeat point 2').check();
  await points.getByLabel('Repeat point 5').check();
  await page.getByRole('button', { name: 'Repeat the chosen points (2)' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Points 2, 5 repeated' })).toBeVisible({ timeout: 30_000 });

  const validations = (await labRecords(page, 'validations')) as { id: string; hostNs: number; trialId: string; points: { x: number; y: number; samples: number }[] }[];
  expect(validations).toHaveLength(2);
  const [first, merged] = validations.sort((a, b) => a.hostNs - b.hostNs) as [(typeof validations)[0], (typeof validations)[0]];
  expect(merged.id).toContain('validation-points');
  expect(merged.trialId).toBe(first.trialId);
  expect(merged.points.map((p) => [p.x, p.y])).toEqual(first.points.map((p) => [p.x, p.y]));
  // Points 1, 3 and 4 are the first run's; 2 and 5 were measured again (other samples).
  merged.points.forEach((p, i) => (i === 1 || i === 4 ? expect(p).not.toEqual(first.points[i]) : expect(p).toEqual(first.points[i])));
  const actions = (await labRecords(page, 'audit')).map((a) => a.action);
  expect(actions).toContain('repeat_points');
  await stage.close();
});
