import { test, expect, type Page } from '@playwright/test';
import { chooseUser, launchApp, screenshot } from './support/app';
import { editFirstPick, openTest, sideTab } from './journeys';

async function switchUser(page: Page, name: string): Promise<void> {
  await page.getByTestId('change-user').click();
  await expect(page.getByTestId('screen-start')).toBeVisible();
  await chooseUser(page, name);
}

test.describe('review and sign-off', () => {
  test('should refuse a sign-off by the engineer who set the picks and accept one by a second engineer', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openTest(page, '', undefined, 'imported');
    const url = page.url();
    const well = (await page.getByTestId('test-title').textContent())!.split(' · ')[0].trim();
    await editFirstPick(page, 0.5, 'Leak-off read where the curve first bends');

    await sideTab(page, 'review');
    await page.getByTestId('request-review').click();
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'in-review');

    // Four eyes: Ada set the picks, so Ada cannot sign off.
    await page.getByTestId('sign-off').click();
    await expect(page.getByTestId('review-message')).toContainText('four eyes');
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'in-review');
    await screenshot(page, 'review-four-eyes-refused');

    // A second engineer signs it off.
    await switchUser(page, 'Idris Calloway');
    await page.goto(url);
    await expect(page.getByTestId('screen-test')).toBeVisible();
    await sideTab(page, 'review');
    await page.getByTestId('sign-off').click();
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'accepted');
    await expect(page.getByTestId('review-log')).toContainText('Signed off');
    await expect(page.getByTestId('review-log')).toContainText('Idris Calloway');
    await screenshot(page, 'review-signed-off');

    // The archive list names the reviewer.
    await page.getByTestId('nav-archive').click();
    await page.getByTestId('well-search').fill(well);
    await page.getByTestId('filter-state').selectOption('accepted');
    await expect(page.getByTestId('test-row').filter({ hasText: 'Idris Calloway' }).first()).toBeVisible();
  });

  test('should require a reason to reject, keep it in the log, and reopen with a reason', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Idris Calloway');
    await openTest(page, '', undefined, 'imported');
    await sideTab(page, 'review');
    await page.getByTestId('reject').click();
    const confirm = page.getByTestId('reason-confirm');
    await expect(confirm).toBeDisabled();
    await page.getByTestId('reason-input').fill('ab');
    await expect(confirm).toBeDisabled();
    const reason = 'Gauge reached its full range during the test';
    await page.getByTestId('reason-input').fill(reason);
    await expect(confirm).toBeEnabled();
    await screenshot(page, 'review-reject-reason');
    await confirm.click();
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'rejected');
    await expect(page.getByTestId('review-log')).toContainText(reason);

    await page.getByTestId('reopen').click();
    await expect(page.getByTestId('reason-confirm')).toBeDisabled();
    await page.getByTestId('reason-input').fill('New gauge data received from the contractor');
    await page.getByTestId('reason-confirm').click();
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'in-review');
    await expect(page.getByTestId('review-log')).toContainText('Reopened the review');
  });
});
