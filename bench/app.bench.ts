/**
 * App speed in a real browser (Debian's Chromium through Playwright, real IndexedDB):
 *   - cold start to an interactive archive list: page load with an existing archive until
 *     the first list row is in the DOM (target under 1.5 s);
 *   - first chart paint: from the click on a list row until the test's chart has drawn
 *     its canvas (target under 500 ms).
 * The archive is the demo archive the app writes on first run (that first run is not
 * timed). Needs the web build (npm run build:web) and /usr/bin/chromium (or CHROMIUM_PATH);
 * says so and stops when either is missing.
 *
 *   npx tsx bench/app.bench.ts
 */
import { chromium, type Page } from '@playwright/test';
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const PORT = Number(process.env.BENCH_PORT ?? 5198);
const URL_BASE = `http://127.0.0.1:${PORT}`;
const RUNS = Number(process.env.BENCH_RUNS ?? 5);
const TARGET_START_MS = 1500;
const TARGET_CHART_MS = 500;
const USER = 'Bench Runner';

/** Marks, in page time (ms since navigation start), the first list row and each chart canvas. */
const OBSERVER_SCRIPT = `
  window.__marks = {};
  new MutationObserver(() => {
    const m = window.__marks;
    if (m.firstRow === undefined && document.querySelector('[data-testid="test-row"]')) m.firstRow = performance.now();
    if (m.clickAt !== undefined && m.chart === undefined) {
      const canvas = document.querySelector('[role="img"] canvas');
      if (canvas && canvas.width > 0) requestAnimationFrame(() => { if (m.chart === undefined) m.chart = performance.now(); });
    }
  }).observe(document, { subtree: true, childList: true, attributes: true });
`;

async function waitForServer(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try { if ((await fetch(url)).ok) return; } catch { /* not up yet */ }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`The preview server did not answer at ${url}`);
}

async function mark(page: Page, name: string): Promise<number> {
  await page.waitForFunction((n) => (window as unknown as { __marks: Record<string, number> }).__marks[n] !== undefined, name, { timeout: 30_000 });
  return page.evaluate((n) => (window as unknown as { __marks: Record<string, number> }).__marks[n], name);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

async function main(): Promise<number> {
  if (!existsSync(CHROMIUM)) { console.log(`Skipped: no Chromium at ${CHROMIUM} (apt-get install -y chromium).`); return 0; }
  if (!existsSync('dist-web/index.html')) { console.log('Skipped: no web build (run `npm run build:web` first).'); return 0; }
  const server = spawn('npx', ['vite', 'preview', '--config', 'vite.web.config.ts', '--host', '127.0.0.1', '--port', String(PORT), '--strictPort'], { stdio: 'ignore', detached: true });
  try {
    await waitForServer(URL_BASE, 30_000);
    const browser = await chromium.launch({
      executablePath: CHROMIUM, headless: true,
      args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
    const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
    await context.addInitScript(OBSERVER_SCRIPT);
    const page = await context.newPage();
    // First run: the app writes the demo archive; choose a user so later loads go straight to the list.
    await page.goto(URL_BASE);
    await page.getByTestId('new-user-name').fill(USER);
    await page.getByTestId('add-user').click();
    await page.getByTestId('test-row').first().waitFor({ timeout: 120_000 });
    const starts: number[] = [];
    const charts: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      // A real page load each time (a query string change, not a hash change).
      await page.goto(`${URL_BASE}/?load=${run}#/archive`);
      starts.push(await mark(page, 'firstRow'));
      await page.evaluate(() => {
        const marks = (window as unknown as { __marks: Record<string, number> }).__marks;
        marks.clickAt = performance.now();
        (document.querySelector('[data-testid="test-row"]') as HTMLElement).click();
      });
      const chartAt = await mark(page, 'chart');
      const clickAt = await page.evaluate(() => (window as unknown as { __marks: Record<string, number> }).__marks.clickAt);
      charts.push(chartAt - clickAt);
    }
    const rows = await page.goto(`${URL_BASE}/#/archive`).then(() => page.getByTestId('test-row').count());
    await browser.close();
    const startMs = median(starts);
    const chartMs = median(charts);
    console.log(`cold start to interactive list: median ${startMs.toFixed(0)} ms over ${RUNS} loads (${starts.map((v) => v.toFixed(0)).join(', ')})`);
    console.log(`first chart paint after opening a test: median ${chartMs.toFixed(0)} ms (${charts.map((v) => v.toFixed(0)).join(', ')})`);
    console.log(`list rows in the DOM: ${rows}`);
    console.log('BENCH-RESULT ' + JSON.stringify({
      name: 'app (chromium, web build)',
      metrics: [
        { metric: 'cold start to interactive list', value: Math.round(startMs), unit: 'ms', target: `< ${TARGET_START_MS} ms`, met: startMs < TARGET_START_MS },
        { metric: 'first chart paint', value: Math.round(chartMs), unit: 'ms', target: `< ${TARGET_CHART_MS} ms`, met: chartMs < TARGET_CHART_MS },
      ],
    }));
    mkdirSync('bench-output', { recursive: true });
    writeFileSync('bench-output/app.json', JSON.stringify({ starts, charts, startMs, chartMs }, null, 2));
    return startMs < TARGET_START_MS && chartMs < TARGET_CHART_MS ? 0 : 2;
  } finally {
    if (server.pid) { try { process.kill(-server.pid, 'SIGTERM'); } catch { /* already gone */ } }
  }
}

main().then((code) => process.exit(code), (error: unknown) => { console.error(error); process.exit(1); });
