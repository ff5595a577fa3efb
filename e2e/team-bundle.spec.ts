import { test, expect, type Browser, type Page } from '@playwright/test';
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import { chooseUser, collectPageErrors, launchApp, screenshot, SCREENS_DIRECTORY } from './support/app';
import { editFirstPick, openTest, sideTab } from './journeys';

/**
 * Two machines without a shared folder: each is its own browser context (own IndexedDB,
 * so its own archive with its own device id), and they exchange team bundles through the
 * Team screen's "bundle-export" and "bundle-import" controls. One engineer moves a pick,
 * the other imports the bundle and signs off (four eyes across machines), the first
 * imports the answer and sees the acceptance. Both also move the same pick of another
 * test without seeing each other's change: the merge shows a conflict, which a person
 * decides with a reason. A damaged bundle is refused whole with a message, and importing
 * the same bundle twice adds nothing. Both archives start from the same deterministic
 * demo seed of the Harrow Flats field (archive/demo.ts), so their test ids agree.
 */

const OUTPUT = path.resolve('e2e-output/bundles');

async function machine(browser: Browser, user: string): Promise<{ page: Page; errors: string[] }> {
  const context = await browser.newContext({ acceptDownloads: true });
  const page = await context.newPage();
  const errors = collectPageErrors(page);
  await launchApp(page);
  await chooseUser(page, user);
  return { page, errors };
}

async function openTeam(page: Page): Promise<void> {
  await page.getByTestId('nav-team').click();
  await expect(page.getByTestId('nav-team')).toHaveAttribute('aria-current', 'page');
  await expect(page.getByTestId('screen-team')).toBeVisible();
}

async function exportBundleFile(page: Page, name: string): Promise<string> {
  await openTeam(page);
  const download = page.waitForEvent('download');
  await page.getByTestId('bundle-export').click();
  const file = path.join(OUTPUT, name);
  const saved = await download;
  // The suggested name is "<field>-<date>.slbundle".
  expect(saved.suggestedFilename()).toMatch(/^harrow-flats-\d{4}-\d{2}-\d{2}\.slbundle$/);
  await saved.saveAs(file);
  return file;
}

async function importBundleFile(page: Page, file: string): Promise<void> {
  await openTeam(page);
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('bundle-import').click();
  await (await chooser).setFiles(file);
  await expect(page.getByTestId('bundle-import-result')).toBeVisible();
}

/** Opens a test by id through the location hash (both archives share the demo's ids). */
async function openTestById(page: Page, testId: string): Promise<void> {
  await page.evaluate((hash) => { window.location.hash = hash; }, `#/test/${encodeURIComponent(testId)}`);
  await expect(page.getByTestId('screen-test')).toHaveAttribute('data-test-id', testId);
  await expect(page.getByTestId('chart-time').locator('canvas').first()).toBeVisible();
}

/** Id of the first test still in the "imported" state whose well is not `exceptWell`. */
async function anotherImportedTest(page: Page, exceptWell: string): Promise<string> {
  await page.getByTestId('nav-archive').click();
  await page.getByTestId('filter-state').selectOption('imported');
  const rows = page.getByTestId('test-row').filter({ hasNotText: exceptWell });
  await expect(rows.first()).toBeVisible();
  const id = await rows.first().getAttribute('data-test-id');
  await page.getByTestId('filter-state').selectOption('');
  return id!;
}

test.describe('team bundle exchange', () => {
  test('should carry a pick change and its sign-off between two machines, show and decide a conflict, and refuse a damaged bundle', async ({ browser }) => {
    mkdirSync(OUTPUT, { recursive: true });
    mkdirSync(SCREENS_DIRECTORY, { recursive: true });
    const { page: ada, errors: adaErrors } = await machine(browser, 'Ada Brennan');
    const { page: idris, errors: idrisErrors } = await machine(browser, 'Idris Calloway');

    // The browser build shares through bundles only: no team folder controls, a line saying so.
    await openTeam(ada);
    await expect(ada.getByTestId('team-folder-web')).toContainText('team bundles');
    await expect(ada.getByTestId('team-folder-choose')).toHaveCount(0);
    await expect(ada.getByTestId('sync-waiting-count')).toHaveText('0');
    await expect(ada.getByTestId('sync-last-sync')).toHaveText('never');

    // Machine 1: Ada moves a pick of HF-5 with a reason and asks for a review.
    await openTest(ada, 'HF-5', undefined, 'imported');
    const hf5 = (await ada.getByTestId('screen-test').getAttribute('data-test-id'))!;
    const title = (await ada.getByTestId('test-title').textContent())!.trim();
    const reason = 'Closure read at the second tangent, first was pump noise';
    await editFirstPick(ada, 0.5, reason);
    await sideTab(ada, 'review');
    await ada.getByTestId('request-review').click();
    await expect(ada.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'in-review');

    // Both engineers set the same pick of another test, neither having seen the other's change.
    const other = await anotherImportedTest(ada, 'HF-5');
    await openTestById(ada, other);
    const adaReason = 'Closure at the end of the linear G-function stretch';
    await editFirstPick(ada, 0.3, adaReason);
    await openTestById(idris, other);
    await editFirstPick(idris, 0.8, 'Closure where the square-root plot bends over');

    // Ada's own changes wait for the next bundle; exporting carries them.
    await openTeam(ada);
    await expect(ada.getByTestId('sync-waiting-count')).not.toHaveText('0');
    const fromAda = await exportBundleFile(ada, 'from-ada.slbundle');
    expect(readFileSync(fromAda, 'latin1').startsWith('STRESS-LEDGER-TEAM-BUNDLE/1 ')).toBe(true);
    await expect(ada.getByTestId('sync-waiting-count')).toHaveText('0');
    await expect(ada.getByTestId('sync-last-sync')).not.toHaveText('never');

    // A damaged copy (one byte flipped) is refused whole, with a clear message; nothing enters.
    const damaged = readFileSync(fromAda);
    damaged[damaged.length - 30] ^= 0x01;
    const damagedFile = path.join(OUTPUT, 'damaged.slbundle');
    writeFileSync(damagedFile, damaged);
    await importBundleFile(idris, damagedFile);
    await expect(idris.getByTestId('bundle-import-result')).toHaveAttribute('data-result', 'refused');
    await expect(idris.getByTestId('bundle-import-result')).toContainText('Bundle refused: nothing was imported.');
    await expect(idris.getByTestId('bundle-refused-message')).toContainText(/checksum does not match/);
    await expect(idris.getByTestId('sync-people').getByTestId('sync-person').filter({ hasText: 'Ada Brennan' })).toHaveCount(0);
    await expect(idris.getByTestId('conflict-none')).toBeVisible();

    // Machine 2: Idris imports Ada's bundle: her changes arrive, and the shared pick is a conflict.
    await importBundleFile(idris, fromAda);
    await expect(idris.getByTestId('bundle-import-result')).toHaveAttribute('data-result', 'applied');
    await expect(idris.getByTestId('bundle-outcome-added')).toContainText('new to this archive');
    await expect(idris.getByTestId('bundle-outcome-conflicts')).toContainText('1 conflict to decide');
    await expect(idris.getByTestId('sync-people').getByTestId('sync-person').filter({ hasText: 'Ada Brennan' })).toContainText(adaReason);
    const list = idris.getByTestId('conflict-list');
    await expect(list.locator('[data-testid^="conflict-item-"]')).toHaveCount(1);
    const item = list.locator('[data-testid^="conflict-item-"]').first();
    await expect(item).toHaveAttribute('data-conflict-kind', 'concurrent-pick-moves');
    await expect(item.getByTestId('conflict-side')).toHaveCount(2);
    await expect(item.getByTestId('conflict-side').filter({ hasText: 'Ada Brennan' })).toContainText(adaReason);
    await expect(item.getByTestId('conflict-side').filter({ hasText: 'Idris Calloway' })).toContainText('square-root');

    // Importing the same bundle again adds nothing.
    await importBundleFile(idris, fromAda);
    await expect(idris.getByTestId('bundle-outcome-added')).toContainText('Nothing new');
    await expect(idris.getByTestId('bundle-outcome-conflicts')).toContainText('No conflicts');
    await expect(list.locator('[data-testid^="conflict-item-"]')).toHaveCount(1);

    // The archive list and the test screen mark the test with the open conflict.
    await idris.getByTestId('nav-archive').click();
    await expect(idris.locator(`[data-testid="test-row"][data-test-id="${other}"]`).getByTestId('test-conflict-badge')).toBeVisible();
    await openTestById(idris, other);
    await expect(idris.getByTestId('test-conflict-badge')).toBeVisible();

    // Idris sees Ada's HF-5 change in its log and signs it off (four eyes: he did not move it).
    await openTestById(idris, hf5);
    await expect(idris.getByTestId('test-title')).toHaveText(title);
    await expect(idris.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'in-review');
    await sideTab(idris, 'review');
    await expect(idris.getByTestId('review-log')).toContainText(reason);
    await expect(idris.getByTestId('review-log')).toContainText('Ada Brennan');
    await expect(idris.getByTestId('test-conflict-badge')).toHaveCount(0);
    await idris.getByTestId('sign-off').click();
    await expect(idris.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'accepted');

    // Idris decides the conflict: Ada's pick stands, with a reason (required).
    await openTeam(idris);
    await expect(idris.getByTestId('sync-conflict-count')).toHaveText('1');
    await screenshot(idris, 'team-conflict-list');
    await idris.locator('[data-testid^="conflict-decide-"]').first().click();
    const dialog = idris.getByTestId('conflict-dialog');
    await expect(dialog).toBeVisible();
    await expect(dialog.getByTestId('conflict-void')).toHaveCount(0); // a pick conflict keeps one pick
    await expect(idris.getByTestId('conflict-resolve')).toBeDisabled();
    await dialog.locator('[data-testid^="conflict-keep-"]').filter({ hasText: 'Ada Brennan' }).click();
    await expect(idris.getByTestId('conflict-resolve')).toBeDisabled();
    const decision = 'The G-function stretch is the cleaner closure signature on this record';
    await idris.getByTestId('conflict-reason').fill(decision);
    // The dialog is fixed to the window: a window-sized picture shows it over the list.
    await idris.screenshot({ path: path.join(SCREENS_DIRECTORY, 'team-conflict.png') });
    await idris.getByTestId('conflict-resolve').click();
    await expect(dialog).toHaveCount(0);
    await expect(idris.getByTestId('conflict-none')).toBeVisible();
    await openTestById(idris, other);
    await expect(idris.getByTestId('test-conflict-badge')).toHaveCount(0);
    await sideTab(idris, 'review');
    await expect(idris.getByTestId('review-log')).toContainText(`Decided a team conflict: kept Ada Brennan's pick change`);
    await expect(idris.getByTestId('review-log')).toContainText(decision);

    const fromIdris = await exportBundleFile(idris, 'from-idris.slbundle');
    await screenshot(idris, 'team');

    // Back on machine 1: the acceptance arrives, signed by the second engineer; the decision too.
    await importBundleFile(ada, fromIdris);
    await expect(ada.getByTestId('bundle-outcome-added')).toContainText('new to this archive');
    await expect(ada.getByTestId('conflict-none')).toBeVisible();
    await expect(ada.getByTestId('sync-people').getByTestId('sync-person').filter({ hasText: 'Idris Calloway' })).toContainText('decided a conflict');
    await openTestById(ada, hf5);
    await expect(ada.getByTestId('test-title')).toHaveText(title);
    await expect(ada.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'accepted');
    await sideTab(ada, 'review');
    await expect(ada.getByTestId('review-panel')).toContainText('Signed off by Idris Calloway');
    await expect(ada.getByTestId('review-log')).toContainText('Idris Calloway');
    await openTestById(ada, other);
    await expect(ada.getByTestId('test-conflict-badge')).toHaveCount(0);

    expect(adaErrors).toEqual([]);
    expect(idrisErrors).toEqual([]);
    await ada.context().close();
    await idris.context().close();
  });
});
