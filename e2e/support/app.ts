import { expect, type Locator, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import path from 'node:path';

/**
 * Helpers for the app's end-to-end tests: open the app (fresh archive or not), choose a
 * user, open a screen, import files through the file chooser, take named screenshots.
 * Screens are addressed by their data-testid hooks.
 */

export const SCREENS_DIRECTORY = path.resolve('e2e-output/screens');

export type ScreenName = 'archive' | 'import' | 'model' | 'settings';

/**
 * Open the app at `/`. With `fresh` (the default) the browser context starts with no
 * IndexedDB or local storage, so the demo archive is written on this first run.
 * Waits until the loading card has gone (archive opened, demo seeded).
 */
export async function launchApp(page: Page, options: { fresh?: boolean; path?: string } = {}): Promise<void> {
  if (options.fresh !== false) {
    await page.context().clearCookies();
    await page.goto('/');
    await page.evaluate(async () => {
      localStorage.clear();
      const databases = (await indexedDB.databases?.()) ?? [];
      await Promise.all(databases.map((d) => d.name && new Promise<void>((resolve) => {
        const request = indexedDB.deleteDatabase(d.name!);
        request.onsuccess = request.onerror = request.onblocked = () => resolve();
      })));
    });
  }
  await page.goto(options.path ?? '/');
  await expect(page.getByTestId('loading')).toHaveCount(0, { timeout: 60_000 });
}

/** Choose a known user, or add a new one by name; ends on the archive screen. */
export async function chooseUser(page: Page, name: string): Promise<void> {
  const known = page.getByTestId(`user-${name}`);
  if (await known.count()) {
    await known.click();
  } else {
    await page.getByTestId('new-user-name').fill(name);
    await page.getByTestId('add-user').click();
  }
  await expect(page.getByTestId('current-user')).toHaveText(name);
}

/** Open a screen from the main navigation. */
export async function openScreen(page: Page, screen: ScreenName): Promise<void> {
  await page.getByTestId(`nav-${screen}`).click();
  await expect(page.getByTestId(`nav-${screen}`)).toHaveAttribute('aria-current', 'page');
}

/**
 * Import files through the web bridge's file input: clicks the button (default: the
 * import screen's "Open files…") and hands the chooser the given paths.
 */
export async function importFiles(page: Page, filePaths: string[], trigger?: Locator): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await (trigger ?? page.getByTestId('open-files')).click();
  await (await chooser).setFiles(filePaths);
}

/** Save a full-page screenshot as e2e-output/screens/<name>.png; returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENS_DIRECTORY, { recursive: true });
  const file = path.join(SCREENS_DIRECTORY, `${name.replace(/[^a-z0-9._-]+/gi, '-')}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Collect console errors and page errors while a test runs (assert on them at the end). */
export function collectPageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => { if (m.type() === 'error') errors.push(`console: ${m.text()}`); });
  return errors;
}

/** Absolute path of a committed demo file (demo/<name>), for importFiles. */
export function demoFilePath(name: string): string {
  return path.resolve('demo', name);
}

/** Open a test from the archive list by the well name shown in its row; waits for the test screen. */
export async function openTestFromList(page: Page, text: string): Promise<void> {
  await page.getByTestId('test-row').filter({ hasText: text }).first().click();
  await expect(page.getByTestId('test-row')).toHaveCount(0);
}
