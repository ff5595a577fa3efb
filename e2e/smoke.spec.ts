import { test, expect } from '@playwright/test';
import { collectPageErrors, launchApp, screenshot } from './support/app';

test.describe('smoke', () => {
  test('should load the app with its title and no page errors', async ({ page }) => {
    const errors = collectPageErrors(page);
    await launchApp(page);
    await expect(page).toHaveTitle('Stress Ledger');
    await expect(page.getByRole('heading', { name: 'Stress Ledger' }).first()).toBeVisible();
    await screenshot(page, 'smoke-first-screen');
    expect(errors).toEqual([]);
  });
});
