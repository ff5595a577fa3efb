import { expect, type Page } from '@playwright/test';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * Steps shared by the user-journey specs: finding a test in the archive list, opening it,
 * editing a pick with a reason, and writing altered copies of demo files (new content, so
 * the archive enters them instead of reporting duplicates).
 */

export const DEMO_DIRECTORY = path.resolve('demo');
export const BROKEN_DIRECTORY = path.resolve('demo/broken');

export function demoFile(name: string): string {
  return path.join(DEMO_DIRECTORY, name);
}

/**
 * A copy of a demo file under e2e-output/files with its well renamed, so its content hash
 * differs from the seeded one while it stays a valid Harrow Flats record.
 */
export function renamedWellCopy(name: string, newWell: string): string {
  const text = readFileSync(demoFile(name), 'utf8');
  const changed = text.replace(/^(Well\s*[,;:\t]\s*)HF-\d+/m, `$1${newWell}`);
  if (changed === text) throw new Error(`${name} has no "Well" line to rename`);
  const directory = path.resolve('e2e-output/files');
  mkdirSync(directory, { recursive: true });
  const file = path.join(directory, name.replace(/^HF-\d+/, newWell));
  writeFileSync(file, changed);
  return file;
}

/** Narrows the archive list to one well and test type and opens the first row. */
export async function openTest(page: Page, well: string, type?: 'fit' | 'lot' | 'xlot' | 'srt' | 'dfit', state?: string): Promise<void> {
  await page.getByTestId('nav-archive').click();
  await page.getByTestId('well-search').fill(well);
  if (type) await page.getByTestId('filter-type').selectOption(type);
  if (state) await page.getByTestId('filter-state').selectOption(state);
  const row = page.getByTestId('test-row').first();
  await expect(row).toBeVisible();
  await row.click();
  await expect(page.getByTestId('screen-test')).toBeVisible();
  await expect(page.getByTestId('test-title')).toContainText(well);
  await expect(page.getByTestId('chart-time').locator('canvas').first()).toBeVisible();
  // The record is drawn first; the analysis (picks, criteria) follows from the worker.
  await expect(page.getByTestId('screen-test')).toHaveAttribute('data-analysed', 'true');
}

/** Opens one of the side tabs of the test screen. */
export async function sideTab(page: Page, tab: 'quality' | 'stress' | 'picks' | 'review'): Promise<void> {
  await page.getByTestId(`side-tab-${tab}`).click();
  await expect(page.getByTestId(`side-tab-${tab}`)).toHaveAttribute('aria-selected', 'true');
}

/**
 * Moves the first pick of the list by typing a new time (display minutes) and a reason;
 * returns the pick key ("cycle:kind").
 */
export async function editFirstPick(page: Page, minutesLater: number, reason: string): Promise<string> {
  await sideTab(page, 'picks');
  const row = page.getByTestId('pick-row').first();
  const key = (await row.getAttribute('data-pick'))!;
  await page.getByTestId(`edit-pick-${key}`).click();
  const dialog = page.getByTestId('pick-dialog');
  await expect(dialog).toBeVisible();
  const time = page.getByTestId('pick-time');
  const now = Number((await time.inputValue()).replace(',', '.'));
  await time.fill(String(Math.max(0, now + minutesLater)));
  // Without a reason the pick cannot be saved.
  await expect(page.getByTestId('pick-save')).toBeDisabled();
  await page.getByTestId('pick-reason').fill(reason);
  await expect(page.getByTestId('pick-preview')).toContainText('Grade with this change');
  await page.getByTestId('pick-save').click();
  await expect(dialog).toHaveCount(0);
  return key;
}
