import type { Page } from '@playwright/test';
import { expect, test } from './support/browser-mode';
import { labRecords, openScreen, PASSPHRASE, setUpLab } from './support/lab';

/** One object store as JSON text, to search for values that must never be there in clear. */
const rawStore = async (page: Page, store: string) => JSON.stringify(await labRecords(page, store));

const NEW_PASSPHRASE = 'parcel aisle person walking';



async function unlock(page: Page, passphrase: string) {
  await page.getByLabel('Lab passphrase').fill(passphrase);
  await page.getByRole('button', { name: 'Unlock' }).click();
  await expect(page.getByRole('heading', { name: 'Who is at the console?' })).toBeVisible({ timeout: 20_000 });
  await expect(page.getByRole('radio', { name: 'Rosa Lind' })).toBeChecked();
  await page.getByRole('button', { name: 'Continue' }).click();
  await expect(page.getByRole('heading', { name: 'The console is locked' })).toHaveCount(0);
}


test('set up the lab, register a participant with consent, find it after a reload, lock and unlock', async ({ host, page }) => {
  test.setTimeout(90_000);
  await page.goto(`${host.url}#/participants`);
  const recoveryKey = await setUpLab(page);
  expect(recoveryKey.trim().length).toBeGreaterThan(20);
  await expect(page.getByText('Choose or create a study first')).toBeVisible();

  await openScreen(page, 'Study');
  await page.getByLabel('Study name').fill('Aisle crossings');
  await page.getByRole('button', { name: 'Create the study' }).click();
  await expect(page.getByRole('button', { name: 'Aisle crossings', pressed: true })).toBeVisible();
  await expect(page.getByTestId('storage-persistence')).not.toHaveText('asking the browser…');

  await openScreen(page, 'Participants');
  await page.getByRole('button', { name: 'Register a participant…' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Ola Berg');
  await page.getByLabel('Contact (email or phone)').fill('ola@aisle.example');
  await page.getByLabel('Birth date').fill('1991-04-12');
  await page.getByLabel('Age in years').fill('34');
  await page.getByLabel('Vision correction').selectOption('glasses');
  await page.getByLabel('Photosensitivity screening').check();
  await page.getByLabel('Normal or corrected-to-normal vision').check();
  await page.getByLabel('No neurological condition reported').check();
  await page.getByLabel('The checklist was gone through').check();
  await page.getByRole('button', { name: 'Register', exact: true }).click();

  const heading = page.locator('#participant-heading');
  await expect(heading).toHaveText(/^[2-9A-HJKMNP-TV-Z]{7}$/);
  const code = (await heading.textContent())!;
  const details = page.getByLabel('Personal details');
  await expect(details).toContainText('Ola Berg');
  await expect(details).toContainText('ola@aisle.example');
  await expect(page.getByLabel('Eligibility problems')).toContainText('No consent is recorded.');

  await page.getByRole('button', { name: 'Record consent…' }).click();
  await page.getByLabel('Form version').fill('v2');
  await page.getByLabel('Take part in the study').check();
  await page.getByLabel('Include in an anonymized public release').check();
  await page.getByLabel('Signature reference').fill('paper form 17');
  await page.getByRole('button', { name: 'Save the consent' }).click();
  await expect(page.getByText('Form v2, signed')).toBeVisible();
  await expect(page.getByText('Signature reference: paper form 17')).toBeVisible();
  await expect(page.getByText('Can be run on every clip of the study.')).toBeVisible();

  // At rest the personal fields are ciphertext; the code and demographics are not.
  const participants = await rawStore(page, 'participants');
  expect(participants).toContain(code);
  expect(participants).toContain('"age":34');
  expect(participants).not.toContain('Ola');
  expect(participants).not.toContain('aisle.example');
  expect(await rawStore(page, 'consents')).not.toContain('paper form');
  expect(await rawStore(page, 'operators')).not.toContain('Rosa');
  const actions = JSON.parse(await rawStore(page, 'audit')).map((a: { action: string; table: string }) => `${a.action} ${a.table}`);
  expect(actions.sort()).toEqual(['create_study studies', 'record_consent consents', 'register participants', 'set_up operators', 'set_up settings']);

  // A reload keeps everything, behind the lock; a wrong passphrase reads nothing.
  await page.reload();
  await expect(page.getByRole('heading', { name: 'The console is locked' })).toBeVisible();
  await page.getByLabel('Lab passphrase').fill('forklift beacon conveyer');
  await page.getByRole('button', { name: 'Unlock' }).click();
  await expect(page.getByRole('alert')).toHaveText('Wrong passphrase', { timeout: 20_000 });
  await expect(page.getByText('Ola Berg')).toHaveCount(0);
  await expect(page.getByText('paper form 17')).toHaveCount(0);
  await unlock(page, PASSPHRASE);
  await page.getByRole('button', { name: code }).click();
  await expect(page.getByLabel('Personal details')).toContainText('Ola Berg');
  await expect(page.getByText('Form v2, signed')).toContainText('recorded by Rosa Lind');

  // Withdrawal, with its scope, is recorded on the consent.
  await page.getByRole('button', { name: 'Record a withdrawal…' }).click();
  await page.getByRole('radio', { name: /Future releases/ }).check();
  await page.getByRole('button', { name: 'Record the withdrawal' }).click();
  await expect(page.getByText(/^Withdrawn .* by Rosa Lind: Future releases/)).toBeVisible();
  await expect(page.getByRole('table', { name: 'Participants' })).toContainText('withdrawn (future releases)');
  await expect(page.getByLabel('Eligibility problems')).toContainText('Consent was withdrawn');

  // Locking from the header hides the personal data at once.
  await page.getByRole('button', { name: 'Lock', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'The console is locked' })).toBeVisible();
  await expect(page.getByText('Ola Berg')).toHaveCount(0);

  // Changing the passphrase: the old one stops working, the new one opens the same data.
  await unlock(page, PASSPHRASE);
  await openScreen(page, 'Study');
  await page.getByLabel('Current passphrase').fill(PASSPHRASE);
  await page.getByLabel('New passphrase', { exact: true }).fill(NEW_PASSPHRASE);
  await page.getByLabel('New passphrase again').fill(NEW_PASSPHRASE);
  await page.getByRole('button', { name: 'Change the passphrase' }).click();
  await expect(page.getByText('The passphrase was changed')).toBeVisible({ timeout: 30_000 });
  await page.getByRole('button', { name: 'Lock now' }).click();
  await page.getByLabel('Lab passphrase').fill(PASSPHRASE);
  await page.getByRole('button', { name: 'Unlock' }).click();
  await expect(page.getByRole('alert')).toHaveText('Wrong passphrase', { timeout: 20_000 });
  await unlock(page, NEW_PASSPHRASE);
  await openScreen(page, 'Participants');
  await page.getByRole('button', { name: code }).click();
  await expect(page.getByLabel('Personal details')).toContainText('Ola Berg');
  expect(await rawStore(page, 'participants')).not.toContain('Ola');
});

test('the console locks itself after ten minutes without input', async ({ host, page }) => {
  await page.clock.install();
  await page.goto(`${host.url}#/study`);
  const recoveryKey = await setUpLab(page);
  await expect(page.getByRole('heading', { name: 'Lab settings' })).toBeVisible();
  await expect(page.getByLabel('Lock after')).toHaveValue('10');
  await page.clock.fastForward('09:00');
  await expect(page.getByRole('heading', { name: 'Lab settings' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'The console is locked' })).toHaveCount(0);
  await page.clock.fastForward('01:30');
  await expect(page.getByRole('heading', { name: 'The console is locked' })).toBeVisible();

  // The recovery key written down at set-up opens the lab too; a mistyped one is told apart.
  await page.getByRole('button', { name: 'Forgot the passphrase? Use the recovery key' }).click();
  await page.getByLabel('Recovery key').fill(recoveryKey.replace(/[^-]$/, (c) => (c === '2' ? '3' : '2')));
  await page.getByRole('button', { name: 'Unlock' }).click();
  await expect(page.getByRole('alert')).toContainText('typing error in group');
  await page.getByLabel('Recovery key').fill(recoveryKey);
  await page.getByRole('button', { name: 'Unlock' }).click();
  await expect(page.getByRole('heading', { name: 'Who is at the console?' })).toBeVisible({ timeout: 20_000 });
});
