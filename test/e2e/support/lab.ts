import { expect, type Page } from '@playwright/test';

/** The lab passphrase the end-to-end tests set up (invented, like every value in them). */
export const PASSPHRASE = 'forklift beacon conveyor';

export const openScreen = (page: Page, name: string) => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name }).click();

/** First run: passphrase twice, the recovery key shown once, the first operator. Returns the recovery key. */
export async function setUpLab(page: Page, passphrase = PASSPHRASE): Promise<string> {
  await expect(page.getByRole('heading', { name: 'Set up this lab' })).toBeVisible();
  await page.getByLabel('New passphrase', { exact: true }).fill(passphrase);
  await page.getByLabel('New passphrase again').fill(passphrase);
  await page.getByRole('button', { name: 'Create the lab key' }).click();
  const recoveryKey = (await page.getByLabel('Recovery key', { exact: true }).textContent({ timeout: 20_000 }))!;
  await expect(page.getByRole('button', { name: 'Continue' })).toBeDisabled();
  await page.getByLabel('I have written the recovery key down').check();
  await page.getByRole('button', { name: 'Continue' }).click();
  await page.getByLabel('Your name (stored encrypted)').fill('Rosa Lind');
  await page.getByRole('button', { name: 'Open the lab' }).click();
  return recoveryKey;
}

/** A participant cleared for every clip who consented to take part, registered from the Participants screen. */
export async function registerConsentedParticipant(page: Page): Promise<void> {
  await openScreen(page, 'Participants');
  await page.getByRole('button', { name: 'Register a participant…' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Ola Berg');
  await page.getByLabel('Age in years').fill('34');
  await page.getByLabel('Photosensitivity screening').check();
  await page.getByLabel('Normal or corrected-to-normal vision').check();
  await page.getByLabel('No neurological condition reported').check();
  await page.getByLabel('The checklist was gone through').check();
  await page.getByRole('button', { name: 'Register', exact: true }).click();
  await page.getByRole('button', { name: 'Record consent…' }).click();
  await page.getByLabel('Form version').fill('v2');
  await page.getByLabel('Take part in the study').check();
  await page.getByRole('button', { name: 'Save the consent' }).click();
}

/** Every record of one object store of the page's real IndexedDB, read with the bare IndexedDB API. */
export const labRecords = (page: Page, store: string) =>
  page.evaluate(
    (name) =>
      new Promise<Record<string, unknown>[]>((resolve, reject) => {
        const open = indexedDB.open('gazeloom-lab');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const all = open.result.transaction(name).objectStore(name).getAll();
          all.onsuccess = () => {
            open.result.close();
            resolve(all.result as Record<string, unknown>[]);
          };
        };
      }),
    store,
  );
