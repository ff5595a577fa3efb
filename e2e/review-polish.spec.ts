import { test, expect } from '@playwright/test';
import { chooseUser, launchApp, openScreen, screenshot } from './support/app';
import { openTest, sideTab } from './journeys';

/**
 * Readability at the smallest supported window (1280 x 800): the stress model's depth plot
 * fills the view (so trends and bands over 4,000 m can be read), and the criteria table
 * shows each value with its unit (%, R², kPa/min, s) as the engine reports it.
 */
test.describe('review readability', () => {
  test.use({ viewport: { width: 1280, height: 800 } });

  test('should give the depth plot the height of the view and show criteria with units', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');

    await openScreen(page, 'model');
    const plot = page.getByTestId('model-depth-plot');
    await expect(plot).toBeVisible();
    await expect(plot.locator('canvas').first()).toBeVisible();
    const box = (await plot.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(520);
    await plot.scrollIntoViewIfNeeded();
    await screenshot(page, 'model-depth-plot-tall');

    await openTest(page, 'HF-2', 'xlot');
    await sideTab(page, 'quality');
    const table = page.getByTestId('criteria-table');
    await expect(table.locator('[data-criterion="shut-in-stability"] [data-testid="criterion-limit"]')).toContainText('kPa/min');
    await expect(table.locator('[data-criterion="rate-stability"] [data-testid="criterion-limit"]')).toContainText('%');
    await expect(table.locator('[data-criterion="loading-linearity"] [data-testid="criterion-limit"]')).toHaveText(/^R²\s0\.\d{4}$/);
    await expect(table.locator('[data-criterion="sampling"] [data-testid="criterion-limit"]')).toHaveText(/^[\d.]+\ss$/);
    await screenshot(page, 'test-quality-units');
  });
});
