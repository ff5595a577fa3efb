import { test, expect } from '@playwright/test';
import path from 'node:path';
import { chooseUser, collectPageErrors, importFiles, launchApp, openScreen, screenshot } from './support/app';
import { BROKEN_DIRECTORY, demoFile, renamedWellCopy } from './journeys';

test.describe('import', () => {
  test('should enter new files, report duplicates, and say where broken files fail', async ({ page }) => {
    const errors = collectPageErrors(page);
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openScreen(page, 'import');

    const fresh = renamedWellCopy('HF-2_LOT_1900m.csv', 'HF-9');
    const seededAlready = demoFile('HF-1_LOT_0620m.csv');
    const broken = ['non-numeric-cell.csv', 'time-backwards.csv', 'unknown-unit.csv'].map((f) => path.join(BROKEN_DIRECTORY, f));
    await importFiles(page, [fresh, seededAlready, ...broken]);

    const items = page.getByTestId('import-file');
    await expect(items).toHaveCount(5);
    // Reading happens in the worker; every file ends ready or unreadable, never stuck.
    await expect(page.locator('[data-testid="import-file"][data-status="reading"]')).toHaveCount(0, { timeout: 60_000 });
    await expect(page.locator('[data-testid="import-file"][data-status="unreadable"]')).toHaveCount(3);

    // The confirmation shows the detected columns and units of a good file.
    await items.filter({ hasText: 'HF-9' }).click();
    await expect(page.getByTestId('column-table')).toContainText('Pressure');
    await expect(page.getByTestId('meta-well')).toHaveValue('HF-9');

    // A broken file says where it is broken.
    await items.filter({ hasText: 'non-numeric-cell.csv' }).click();
    await expect(page.getByTestId('file-error')).toContainText(/line \d+/);
    await screenshot(page, 'import-confirmation');

    await page.getByTestId('import-run').click();
    const summary = page.getByTestId('import-summary');
    await expect(summary).toBeVisible({ timeout: 60_000 });
    await expect(page.getByTestId('summary-entered')).toHaveText('1');
    await expect(page.getByTestId('summary-duplicates')).toHaveText('1');
    await expect(page.getByTestId('summary-failed')).toHaveText('3');
    const failures = page.getByTestId('summary-failures');
    for (const f of ['non-numeric-cell.csv', 'time-backwards.csv', 'unknown-unit.csv']) await expect(failures).toContainText(f);
    await expect(failures).toContainText(/line \d+/);
    await screenshot(page, 'import-summary');

    // The new test is in the archive list; nothing of the failed files was written.
    await openScreen(page, 'archive');
    await page.getByTestId('well-search').fill('HF-9');
    await expect(page.getByTestId('test-row')).toHaveCount(1);
    expect(errors).toEqual([]);
  });

  test('should remember a corrected column mapping for the same layout', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openScreen(page, 'import');
    const first = renamedWellCopy('HF-4_LOT_2800m.csv', 'HF-8');
    await importFiles(page, [first]);
    await expect(page.locator('[data-testid="import-file"][data-status="ready"]')).toHaveCount(1, { timeout: 60_000 });
    // Mark the volume column as not used, then import: the mapping is remembered.
    const roles = page.locator('[data-testid^="column-role-"]');
    const count = await roles.count();
    let volumeIndex = -1;
    for (let i = 0; i < count; i++) if ((await roles.nth(i).inputValue()) === 'volume') volumeIndex = i;
    test.skip(volumeIndex < 0, 'this demo file has no volume column to re-map');
    await roles.nth(volumeIndex).selectOption('other');
    await expect(page.getByTestId('remember-mapping')).toBeChecked();
    await page.getByTestId('import-run').click();
    await expect(page.getByTestId('summary-entered')).toHaveText('1', { timeout: 60_000 });

    const second = renamedWellCopy('HF-4_LOT_2800m.csv', 'HF-7');
    await importFiles(page, [second]);
    await page.getByTestId('import-file').filter({ hasText: 'HF-7' }).click();
    await expect(page.getByTestId('file-confirmation')).toContainText('Using the column mapping saved for this contractor layout by Ada Brennan');
    await expect(roles.nth(volumeIndex)).toHaveValue('other');
  });
});
