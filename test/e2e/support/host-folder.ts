import { expect, type Locator } from '@playwright/test';

/**
 * Opens a folder in the import dialog's host file browser. It waits for the first listing
 * (which fills the field with the home folder), as a person would, so typing is not mixed
 * with the field's first value.
 */
export async function openHostFolder(dialog: Locator, folder: string): Promise<void> {
  const field = dialog.getByLabel('Folder on the host');
  await expect(field).not.toHaveValue('');
  await field.fill(folder);
  await expect(field).toHaveValue(folder);
  await dialog.getByRole('button', { name: 'Go' }).click();
}
