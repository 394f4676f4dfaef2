import { expect, test } from './support/browser-mode';
import { openScreen, PASSPHRASE, setUpLab } from './support/lab';



test('back up the lab, then restore the backup into a fresh browser profile and unlock it', async ({ host, page, browser }) => {
  test.setTimeout(120_000);
  await page.goto(`${host.url}#/study`);
  await setUpLab(page);
  await page.getByLabel('Study name').fill('Aisle crossings');
  await page.getByRole('button', { name: 'Create the study' }).click();
  await expect(page.getByRole('button', { name: 'Aisle crossings', pressed: true })).toBeVisible();

  await openScreen(page, 'Backups');
  // A profile with records cannot be restored into: the screen says why.
  await expect(page.getByText('This profile already holds lab records')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Restore into this profile' })).toBeDisabled();
  await page.getByRole('button', { name: 'Back up now' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Backed up' })).toHaveText(/Backed up \d+ records and 0 recordings to .*backups\/lab-\d{8}-\d{6}\.zip\./, { timeout: 20_000 });
  const backups = page.getByRole('table', { name: 'Backups' });
  await expect(backups.getByRole('row')).toHaveCount(2);

  // A fresh browser profile: an empty lab database on the same host.
  const fresh = await browser.newContext();
  const other = await fresh.newPage();
  await other.goto(`${host.url}#/archive`);
  await expect(other.getByText('This profile is empty')).toBeVisible();
  await expect(other.getByRole('button', { name: 'Back up now' })).toHaveCount(0);
  await other.getByRole('button', { name: /^Choose lab-\d{8}-\d{6}\.zip to restore$/ }).click();
  await expect(other.getByLabel('Archive path')).toHaveValue(/lab-\d{8}-\d{6}\.zip$/);
  await other.getByRole('button', { name: 'Restore into this profile' }).click();
  // Restored: the profile now holds the lab's keyring, so the console asks for its passphrase.
  await expect(other.getByRole('heading', { name: 'The console is locked' })).toBeVisible({ timeout: 20_000 });
  await other.getByLabel('Lab passphrase').fill(PASSPHRASE);
  await other.getByRole('button', { name: 'Unlock' }).click();
  await expect(other.getByRole('radio', { name: 'Rosa Lind' })).toBeChecked({ timeout: 20_000 });
  await other.getByRole('button', { name: 'Continue' }).click();
  await expect(other.getByRole('status').filter({ hasText: 'Restored' })).toHaveText(/^Restored \d+ records and 0 recordings\./);
  await openScreen(other, 'Study');
  await expect(other.getByRole('button', { name: 'Aisle crossings' })).toBeVisible();
  await fresh.close();
});
