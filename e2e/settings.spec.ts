import { test, expect, type Page } from '@playwright/test';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { chooseUser, collectPageErrors, launchApp, openScreen, screenshot } from './support/app';

/**
 * The Settings screen: quality limits shown and typed in engineering units (%, kPa/min,
 * min), saved with a reason and shown back after a reload; a full backup saved, the
 * archive changed, the backup restored (the change gone), and a damaged backup refused.
 */

const FILES = path.resolve('e2e-output/files');

async function restoreFrom(page: Page, file: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('restore-backup').click();
  await (await chooser).setFiles(file);
  const dialog = page.getByTestId('restore-dialog');
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText('current archive will be replaced');
  await page.getByTestId('restore-confirm').click();
  await expect(dialog).toHaveCount(0, { timeout: 60_000 });
}

test.describe('settings', () => {
  test('should restore a saved backup and refuse a damaged one', async ({ page }) => {
    const errors = collectPageErrors(page);
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openScreen(page, 'settings');

    // Save a backup: the web build hands it over as a download.
    mkdirSync(FILES, { recursive: true });
    const download = page.waitForEvent('download');
    await page.getByTestId('save-backup').click();
    const saved = await download;
    expect(saved.suggestedFilename()).toMatch(/\.slbackup$/);
    const backup = path.join(FILES, 'settings-backup.slbackup');
    await saved.saveAs(backup);

    // Change the archive after the backup: a new user.
    await page.getByTestId('settings-new-user').fill('Imre Castellan');
    await page.getByRole('button', { name: 'Add user' }).click();
    await expect(page.getByTestId('users-list')).toContainText('Imre Castellan');

    // Restoring the backup takes the change away and says how many tests the archive holds.
    await restoreFrom(page, backup);
    await expect(page.getByTestId('backup-status')).toContainText(/restored: the archive now holds \d+ tests/);
    await expect(page.getByTestId('users-list')).toContainText('Ada Brennan');
    await expect(page.getByTestId('users-list')).not.toContainText('Imre Castellan');

    // A damaged backup (a byte of its header replaced by one that is not UTF-8) is refused, nothing changed.
    const bytes = readFileSync(backup);
    bytes[20] = 0xff;
    const damaged = path.join(FILES, 'settings-backup-damaged.slbackup');
    writeFileSync(damaged, bytes);
    await page.getByTestId('settings-new-user').fill('Imre Castellan');
    await page.getByRole('button', { name: 'Add user' }).click();
    await expect(page.getByTestId('users-list')).toContainText('Imre Castellan');
    await restoreFrom(page, damaged);
    await expect(page.getByTestId('backup-error')).toContainText('was refused');
    await expect(page.getByTestId('backup-error')).toContainText('Nothing in the archive was changed');
    await screenshot(page, 'settings-backup-refused');
    await expect(page.getByTestId('users-list')).toContainText('Imre Castellan');

    // The archive list still holds the tests.
    await openScreen(page, 'archive');
    await expect(page.getByTestId('test-row').first()).toBeVisible();
    expect(errors).toEqual([]);
  });

  test('should show limits in engineering units and keep an edited limit across a reload', async ({ page }) => {
    const errors = collectPageErrors(page);
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openScreen(page, 'settings');

    // Defaults (engine/quality/limits.ts) as an engineer writes them.
    const table = page.getByTestId('limits-table');
    await expect(page.getByTestId('limit-default-rate-stability.maxCv')).toHaveText('10\u00a0%');
    await expect(page.getByTestId('limit-default-cycle-repeat.maxRepeatDifference')).toHaveText('5\u00a0%');
    await expect(page.getByTestId('limit-default-shut-in-stability.maxEndDeclineRate')).toHaveText('5\u00a0kPa/min');
    await expect(page.getByTestId('limit-default-shut-in-stability.minDuration')).toHaveText('10\u00a0min');
    await expect(page.getByTestId('limit-default-loading-linearity.minR2')).toHaveText('0.9950');
    await expect(table).not.toContainText('Pa/s');

    // Out of range: an inline message, and nothing can be saved.
    const cv = page.getByTestId('limit-rate-stability.maxCv');
    await cv.fill('150');
    await expect(page.getByTestId('limit-error-rate-stability.maxCv')).toContainText('between 0 and 100');
    await expect(page.getByTestId('limits-save')).toBeDisabled();
    await screenshot(page, 'settings-limit-error');
    await cv.fill('12');
    await expect(page.getByTestId('limit-error-rate-stability.maxCv')).toHaveCount(0);
    await page.getByTestId('limit-shut-in-stability.maxEndDeclineRate').fill('3');

    // Saved with a reason.
    await page.getByTestId('limits-save').click();
    await page.getByTestId('reason-input').fill('Harrow Flats shut-ins settle slowly in the shale section');
    await page.getByTestId('reason-confirm').click();
    await expect(page.getByTestId('reason-dialog')).toHaveCount(0);

    // After a reload the project values show back in the same units.
    await launchApp(page, { fresh: false });
    if (await page.getByTestId('current-user').count() === 0) await chooseUser(page, 'Ada Brennan');
    await openScreen(page, 'settings');
    await expect(page.getByTestId('limit-rate-stability.maxCv')).toHaveValue('12');
    await expect(page.getByTestId('limit-shut-in-stability.maxEndDeclineRate')).toHaveValue('3');

    // In oilfield units the decline rate is in psi/min: 3 kPa/min = 3000 / 6894.757 psi/min = 0.435 (NIST SP 811 psi).
    await page.getByTestId('settings-units-oilfield').check();
    await expect(page.getByTestId('limit-default-shut-in-stability.maxEndDeclineRate')).toHaveText('0.725\u00a0psi/min');
    await expect(page.getByTestId('limit-shut-in-stability.maxEndDeclineRate')).toHaveValue('0.435');
    await page.getByTestId('settings-units-si').check();
    await expect(page.getByTestId('limit-default-shut-in-stability.maxEndDeclineRate')).toHaveText('5\u00a0kPa/min');

    // The unit toast gone, the screen is shown as it stands.
    await expect(page.getByTestId('toast')).toHaveCount(0, { timeout: 10_000 });
    await screenshot(page, 'settings');
    expect(errors).toEqual([]);
  });
});
