import { test, expect, type Page } from '@playwright/test';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { readFileSync } from 'node:fs';
import { chooseUser, collectPageErrors, launchApp, openScreen, screenshot } from './support/app';

// The demo archive holds the invented Harrow Flats field (tests by Cobalt Ridge Test
// Services), imported by Maren Holt; Idris Calloway reviews.
const IMPORTER = 'Maren Holt';
const REVIEWER = 'Idris Calloway';

/** The review panel sits in a side tab of the test screen when the screen has tabs. */
async function openReviewPanel(page: Page): Promise<void> {
  const tab = page.getByTestId('side-tab-review');
  await expect(page.getByTestId('test-title')).toBeVisible();
  if (await tab.count()) await tab.click();
}

test.describe('stress model', () => {
  test('should fit accepted tests, show the depth plot and export a table that reads back', async ({ page }) => {
    const errors = collectPageErrors(page);
    await launchApp(page);
    await chooseUser(page, IMPORTER);

    // The importer sends an imported test for review.
    await page.getByTestId('count-imported').click();
    const row = page.getByTestId('test-row').first();
    await expect(row).toBeVisible();
    const testId = await row.getAttribute('data-test-id');
    expect(testId).toBeTruthy();
    await row.click();
    await expect(page.getByTestId('screen-test')).toBeVisible();
    await openReviewPanel(page);
    await page.getByTestId('request-review').click();
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'in-review');

    // A second engineer signs it off (four eyes).
    await page.getByTestId('change-user').click();
    await chooseUser(page, REVIEWER);
    await page.goto(`/#/test/${encodeURIComponent(testId!)}`);
    await openReviewPanel(page);
    await expect(page.getByTestId('sign-off')).toBeVisible();
    await page.getByTestId('sign-off').click();
    await expect(page.getByTestId('state-badge').first()).toHaveAttribute('data-state', 'accepted');

    // The depth plot of the field's model.
    await openScreen(page, 'model');
    await expect(page.getByTestId('model-depth-plot')).toBeVisible();
    await expect(page.getByTestId('model-trend')).toContainText(/Shmin =|No Shmin trend/);
    await expect(page.getByTestId('safety-note')).toBeVisible();
    const rows = page.getByTestId('model-test-row');
    const acceptedCount = await rows.count();
    expect(acceptedCount).toBeGreaterThan(0);
    // Rejected and unreviewed tests are hidden until asked for.
    await page.getByTestId('model-show-unaccepted').check();
    expect(await rows.count()).toBeGreaterThanOrEqual(acceptedCount);
    await page.getByTestId('model-show-unaccepted').uncheck();
    await page.getByTestId('model-axis-emw').click();
    await screenshot(page, 'model-depth-plot-emw');
    await page.getByTestId('model-axis-pressure').click();
    await page.getByTestId('model-show-references').check();
    await screenshot(page, 'model-depth-plot-pressure');
    await page.getByTestId('model-show-references').uncheck();

    // Export the table (a download in the web build) and read it back.
    const download = page.waitForEvent('download');
    await page.getByTestId('export-csv').click();
    const file = await (await download).path();
    const text = readFileSync(file, 'utf8');
    expect(text).toMatch(/qualified engineer/);
    expect(text).toMatch(/well-control policy/);
    expect(text).toMatch(/local regulations and licensed practice/);
    const body = text.slice(text.indexOf('\r\n\r\n') + 4);
    const parsed = Papa.parse<Record<string, number | string | null>>(body, { header: true, dynamicTyping: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBeGreaterThan(3);
    const depths = parsed.data.map((d) => d['TVD [m]'] as number);
    for (let i = 1; i < depths.length; i++) expect(depths[i]).toBeGreaterThan(depths[i - 1]);
    for (const d of parsed.data) {
      expect(typeof d['Sv [MPa]']).toBe('number');
      expect(typeof d['Pp [MPa]']).toBe('number');
      expect(d['Sv [MPa]'] as number).toBeGreaterThan(d['Pp [MPa]'] as number);
    }
    // The table shown on screen matches the file: first row's Sv to 2 decimals.
    await page.locator('[data-testid="model-table"]').evaluate((el) => (el.closest('details') as HTMLDetailsElement).open = true);
    const headers = await page.getByTestId('model-table').locator('thead th').allInnerTexts();
    const svColumn = headers.findIndex((h) => h.startsWith('Sv'));
    const firstSv = await page.getByTestId('model-table').locator('tbody tr').first().locator('td').nth(svColumn).innerText();
    expect(Number(firstSv)).toBeCloseTo(parsed.data[0]['Sv [MPa]'] as number, 2);

    // The XLSX export: numeric cells on the table sheet, the caution and sign-offs on the provenance sheet.
    const xlsxDownload = page.waitForEvent('download');
    await page.getByTestId('export-xlsx').click();
    const workbook = new ExcelJS.Workbook();
    const bytes = readFileSync(await (await xlsxDownload).path());
    await workbook.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    const sheet = workbook.getWorksheet('Stress table')!;
    expect(String(sheet.getCell(1, 1).value)).toMatch(/qualified engineer/);
    const xlsxHeaders = (sheet.getRow(3).values as unknown[]).slice(1).map(String);
    const svCell = sheet.getRow(4).getCell(xlsxHeaders.indexOf('Sv [MPa]') + 1).value;
    expect(typeof svCell).toBe('number');
    expect(svCell as number).toBeCloseTo(parsed.data[0]['Sv [MPa]'] as number, 3);
    const provenance: string[] = [];
    workbook.getWorksheet('Provenance')!.eachRow((r) => provenance.push((r.values as unknown[]).join('|')));
    expect(provenance.join('\n')).toContain(REVIEWER);

    // Clicking the test's file opens it.
    await rows.first().getByRole('button').click();
    await expect(page.getByTestId('screen-test')).toBeVisible();
    expect(errors).toEqual([]);
  });
});
