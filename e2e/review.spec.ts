import { test, expect } from '@playwright/test';
import { chooseUser, collectPageErrors, launchApp, screenshot } from './support/app';
import { editFirstPick, openTest, sideTab } from './journeys';

test.describe('test review', () => {
  test('should show the charts, criteria and stresses of a test with the SHmax caution', async ({ page }) => {
    const errors = collectPageErrors(page);
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openTest(page, 'HF-1', 'xlot');

    await expect(page.getByTestId('grade-badge').first()).toHaveAttribute('data-grade', /[A-E]/);
    const criteria = page.getByTestId('criterion-row');
    expect(await criteria.count()).toBeGreaterThan(3);
    await expect(page.getByTestId('criteria-table')).toContainText(/Pass|Fail|Cannot judge/);
    await expect(page.getByTestId('safety-note')).toContainText('qualified engineer');
    await screenshot(page, 'test-review');

    await page.getByTestId('tab-volume').click();
    await expect(page.getByTestId('chart-volume').locator('canvas').first()).toBeVisible();
    await page.getByTestId('tab-shutin').click();
    await expect(page.getByTestId('chart-gfunction').locator('canvas').first()).toBeVisible();
    await expect(page.getByTestId('chart-sqrt').locator('canvas').first()).toBeVisible();
    await expect(page.getByTestId('chart-loglog').locator('canvas').first()).toBeVisible();
    await screenshot(page, 'test-shut-in-diagnostics');
    await page.getByTestId('tab-overlay').click();
    await expect(page.getByTestId('chart-overlay').locator('canvas').first()).toBeVisible();

    // An XLOT's SHmax carries its detectability caution right beside it.
    await sideTab(page, 'stress');
    await expect(page.getByTestId('shmin-value')).toContainText('MPa');
    await expect(page.getByTestId('shmax-caution')).toBeVisible();
    await screenshot(page, 'test-stresses');

    // Units switch to oilfield and the choice is remembered.
    await page.getByTestId('units-oilfield').click();
    await expect(page.getByTestId('shmin-value')).toContainText('psi');
    await expect(page.getByTestId('toast')).toContainText('oilfield units; the choice is kept');
    await page.reload({ waitUntil: 'domcontentloaded' });
    await expect(page.getByTestId('screen-test')).toBeVisible();
    await sideTab(page, 'stress');
    await expect(page.getByTestId('shmin-value')).toContainText('psi');
    await page.getByTestId('units-si').click();
    expect(errors).toEqual([]);
  });

  test('should show the step-rate plot of a step-rate test', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openTest(page, 'HF-4', 'srt');
    await page.getByTestId('tab-steprate').click();
    await expect(page.getByTestId('chart-steprate').locator('canvas').first()).toBeVisible();
    await screenshot(page, 'test-step-rate');
  });

  test('should move a pick with a required reason, keep the reason, and undo it', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openTest(page, '', undefined, 'imported');
    const reason = 'Departure from the loading line is clearer one minute later';
    const key = await editFirstPick(page, 1, reason);

    const row = page.locator(`[data-testid="pick-row"][data-pick="${key}"]`);
    await expect(row).toContainText('by hand');
    await expect(row).toContainText(reason);
    await sideTab(page, 'review');
    await expect(page.getByTestId('review-log')).toContainText(reason);
    await expect(page.getByTestId('review-log')).toContainText('Ada Brennan');
    await screenshot(page, 'test-pick-edited');

    // Undo with the keyboard: the pick goes back, and the undo is logged too.
    await page.locator('body').click({ position: { x: 5, y: 5 } });
    await page.keyboard.press('Control+z');
    await expect(page.getByTestId('review-log')).toContainText(`Undo: ${reason}`);
    await sideTab(page, 'picks');
    await expect(page.getByTestId('redo')).toBeEnabled();
  });
});

test.describe('pick dragging', () => {
  test('should open the pick dialog at the place a marker was dragged to', async ({ page }) => {
    await launchApp(page);
    await chooseUser(page, 'Ada Brennan');
    await openTest(page, '', undefined, 'imported');
    const chart = page.getByTestId('chart-time');
    await expect(chart.locator('canvas').first()).toBeVisible();
    // Where the first pick marker is drawn, from the chart itself (data -> pixel).
    const marker = await chart.evaluate((el) => {
      const c = (el as HTMLElement & { chart: { getOption(): { series: { id: string; data: { name: string; value: number[] }[] }[] }; convertToPixel(f: object, v: number[]): number[] } }).chart;
      const s = c.getOption().series.find((x) => x.id.startsWith('pick-'))!;
      const d = s.data[0];
      return { key: d.name, minutes: d.value[0], pixel: c.convertToPixel({ seriesId: s.id }, d.value) };
    });
    const box = (await chart.boundingBox())!;
    await page.mouse.move(box.x + marker.pixel[0], box.y + marker.pixel[1]);
    await page.mouse.down();
    for (let dx = 5; dx <= 40; dx += 5) await page.mouse.move(box.x + marker.pixel[0] + dx, box.y + marker.pixel[1]);
    await page.mouse.up();
    await expect(page.getByTestId('pick-dialog')).toBeVisible();
    const typed = Number((await page.getByTestId('pick-time').inputValue()).replace(',', '.'));
    expect(typed).toBeGreaterThan(marker.minutes);
    await page.getByTestId('pick-reason').fill('Marker dragged to where the curve departs');
    await page.getByTestId('pick-save').click();
    await expect(page.getByTestId('pick-dialog')).toHaveCount(0);
    await sideTab(page, 'review');
    await expect(page.getByTestId('review-log')).toContainText('Marker dragged to where the curve departs');
  });
});
