import { defineConfig } from '@playwright/test';

/**
 * End-to-end tests. 'chromium' drives the web build (dist-web, served by vite preview on
 * 127.0.0.1:5199) in Debian's Chromium; 'electron' launches the Electron build and skips
 * every test, saying so, when the Electron runtime is not installed.
 */
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const WEB_PORT = 5199;
export const WEB_URL = `http://127.0.0.1:${WEB_PORT}`;

export default defineConfig({
  testDir: 'e2e',
  outputDir: 'e2e-output/',
  timeout: 90_000,
  expect: { timeout: 15_000 },
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  reporter: [['list']],
  use: {
    baseURL: WEB_URL,
    screenshot: 'only-on-failure',
    trace: 'off',
    viewport: { width: 1400, height: 900 },
    acceptDownloads: true,
  },
  projects: [
    {
      name: 'chromium',
      testIgnore: ['electron/**'],
      use: {
        browserName: 'chromium',
        headless: true,
        launchOptions: {
          executablePath: CHROMIUM_PATH,
          args: [
            '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking',
            '--disable-component-update', '--disable-sync', '--no-first-run',
          ],
        },
      },
    },
    {
      name: 'electron',
      testMatch: ['electron/**/*.spec.ts'],
    },
  ],
  webServer: {
    command: `npx vite preview --config vite.web.config.ts --host 127.0.0.1 --port ${WEB_PORT} --strictPort`,
    url: WEB_URL,
    reuseExistingServer: !process.env.CI,
    timeout: 60_000,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
