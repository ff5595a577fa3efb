import { test, expect } from '@playwright/test';
import { chooseUser, launchApp, openScreen, screenshot } from './support/app';
import { openTest } from './journeys';

/** One named screenshot of each screen, at the smallest supported window (1280 x 800). */
test.describe('screens', () => {
  test.use({ viewport: { width: 1280, height: 800 } });

  test('should render every screen at 1280 x 800', async ({ page }) => {
    await launchApp(page);
    await expect(page.getByTestId('screen-start')).toBeVisible();
    await screenshot(page, 'start');
    await chooseUser(page, 'Ada Brennan');

    await expect(page.getByTestId('screen-archive')).toBeVisible();
    await expect(page.getByTestId('test-row').first()).toBeVisible();
    // Counts per state add up to the whole list.
    const all = Number((await page.getByTestId('count-all').locator('b').textContent())!.replace(/,/g, ''));
    let sum = 0;
    for (const s of ['imported', 'in-review', 'accepted', 'rejected']) sum += Number((await page.getByTestId(`count-${s}`).locator('b').textContent())!.replace(/,/g, ''));
    expect(sum).toBe(all);
    await screenshot(page, 'archive');

    // Keyboard: the list takes focus, arrows move, Enter opens.
    await page.getByTestId('test-list-body').focus();
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    await expect(page.getByTestId('screen-test')).toBeVisible();

    await openScreen(page, 'import');
    await screenshot(page, 'import');
    await openTest(page, 'HF-3', 'dfit');
    await screenshot(page, 'test-dfit');
    // The printable review report: every panel, the sign-off trail and the safety caution.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByTestId('review-log')).toBeVisible();
    await expect(page.getByTestId('criteria-table')).toBeVisible();
    await expect(page.getByTestId('safety-note')).toBeVisible();
    await screenshot(page, 'test-report-print');
    await page.emulateMedia({ media: 'screen' });
    await openScreen(page, 'settings');
    await expect(page.getByTestId('limits-table')).toContainText('Straight loading line');
    await screenshot(page, 'settings');
    await openScreen(page, 'model');
    await expect(page.getByTestId('safety-note')).toBeVisible();
    await screenshot(page, 'model');
  });
});
