import { test, expect, _electron as electron } from '@playwright/test';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { electronBinary, ELECTRON_MISSING_MESSAGE } from '../support/electron';
import { screenshot } from '../support/app';

const binary = electronBinary();
// Say why once, in the run's output, rather than only marking the tests skipped.
if (binary === null) console.log(`[electron] ${ELECTRON_MISSING_MESSAGE}`);

test.describe('electron shell', () => {
  test.skip(binary === null, ELECTRON_MISSING_MESSAGE);

  test('should open the window on the app scheme with the preload bridge and no Node in the page', async () => {
    const main = path.resolve('out/main/index.js');
    test.skip(!existsSync(main), 'The Electron build is missing: run `npm run build` first.');
    const app = await electron.launch({ executablePath: binary!, args: [main], env: { ...process.env, NODE_ENV: 'production' } });
    try {
      const page = await app.firstWindow();
      await expect(page).toHaveTitle(/Stress Ledger/);
      expect(page.url()).toMatch(/^app:\/\/stress-ledger\//);
      const exposure = await page.evaluate(() => ({
        platform: (window as unknown as { stressLedger?: { platform: string } }).stressLedger?.platform,
        node: typeof (globalThis as { process?: unknown }).process,
        require: typeof (globalThis as { require?: unknown }).require,
      }));
      expect(exposure).toEqual({ platform: 'electron', node: 'undefined', require: 'undefined' });
      const opened = await page.evaluate(() => window.open('https://example.invalid/') === null);
      expect(opened).toBe(true);
      await screenshot(page, 'electron-first-window');
    } finally {
      await app.close();
    }
  });
});
