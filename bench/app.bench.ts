/**
 * App speed in a real browser (Debian's Chromium through Playwright, real IndexedDB) on a
 * large archive: 10,000 tests of 5,000 samples (50 million samples) plus one test of
 * 1,000,000 samples.
 *
 *   - cold start to an interactive archive list: a fresh browser and page load on the
 *     seeded profile, from navigation start until the list shows rows and has taken a
 *     click on a review-state filter (the rows changed for it); target under 1.5 s;
 *   - filter time: on the loaded list, typing a well search or choosing a review state,
 *     from the input event until the frame showing the updated rows has rendered; target under 100 ms;
 *   - first chart paint of the long record (a DFIT, which opens on the shut-in diagnostics):
 *     from the click on its list row until the pressure-time chart holds its series and that
 *     frame has rendered; target under 500 ms.
 *
 * Medians over BENCH_RUNS runs (default 5); each run starts a fresh browser on the profile.
 *
 * Seeding: the web build holds a seeding page (src-renderer/bench/index.html, linked from
 * nowhere in the app) that writes rows straight into the app's Dexie database with bulkPut,
 * in chunks, once per bench run into a fresh profile (--user-data-dir) under the system's
 * temporary folder. Samples are stored as the schema stores them (four Float64Array per
 * test, about 1.6 GB for 50 M samples); the profile is deleted at the end unless
 * BENCH_KEEP_PROFILE=1 (BENCH_PROFILE=dir reuses a kept one and skips the seeding).
 *
 * Needs the web build (npm run build:web) and /usr/bin/chromium (or CHROMIUM_PATH); says so
 * and stops when either is missing. Serves dist-web with vite preview on BENCH_PORT (5288).
 *
 *   npx tsx bench/app.bench.ts
 *   BENCH_TESTS=1000 BENCH_RUNS=3 npx tsx bench/app.bench.ts   # smaller, quicker
 */
import { chromium, type BrowserContext, type Page } from '@playwright/test';
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const PORT = Number(process.env.BENCH_PORT ?? 5288);
const URL_BASE = `http://127.0.0.1:${PORT}`;
const RUNS = Number(process.env.BENCH_RUNS ?? 5);
const TESTS = Number(process.env.BENCH_TESTS ?? 10_000);
const SAMPLES = Number(process.env.BENCH_SAMPLES ?? 5_000);
const LARGE_SAMPLES = Number(process.env.BENCH_LARGE_SAMPLES ?? 1_000_000);
/** Type of the long record: a DFIT by default (its review opens on the shut-in diagnostics). */
const LARGE_TYPE = process.env.BENCH_LARGE_TYPE ?? 'dfit';
const CHUNK = 200;
const TARGET_START_MS = 1500;
const TARGET_FILTER_MS = 100;
const TARGET_CHART_MS = 500;
const USER = 'Bench Runner';
const ARGS = [
  '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking',
  '--disable-component-update', '--disable-sync', '--no-first-run',
];

type Marks = Record<string, number>;

/**
 * In-page marks (ms since navigation start). At the first list row it clicks the "Accepted"
 * state chip as a user would, and marks `interactive` once the first frame after the list's
 * row count changed for it has rendered (a task posted from its animation callback). After `__marks.clickAt` it watches the time chart until its
 * ECharts instance holds series data (setOption draws synchronously), and marks `chart` in
 * a task posted from that frame's animation callback, which runs once the frame is rendered.
 */
const OBSERVER_SCRIPT = `
  window.__marks = {};
  const m = window.__marks;
  // Runs work once the next frame has been rendered: a task posted from its animation callback.
  const afterFrame = (work) => requestAnimationFrame(() => { const c = new MessageChannel(); c.port1.onmessage = work; c.port2.postMessage(0); });
  const rowCount = () => document.querySelector('[data-testid="test-list"]')?.getAttribute('aria-rowcount');
  new MutationObserver(() => {
    if (m.firstRow === undefined && document.querySelector('[data-testid="test-row"]')) {
      m.firstRow = performance.now();
      if (window.__probe !== false) setTimeout(() => {
        const before = rowCount();
        m.probeAt = performance.now();
        document.querySelector('[data-testid="count-accepted"]').click();
        const wait = () => { if (rowCount() !== before) afterFrame(() => { m.interactive = performance.now(); }); else requestAnimationFrame(wait); };
        wait();
      }, 0);
    }
  }).observe(document, { subtree: true, childList: true });
  window.__watchChart = () => {
    const poll = () => {
      const host = document.querySelector('[data-testid="chart-time"]');
      const chart = host && host.chart;
      const option = chart && chart.getOption && chart.getOption();
      const drawn = option && Array.isArray(option.series) && option.series.some((s) => Array.isArray(s.data) && s.data.length > 0);
      if (drawn) {
        // setOption has drawn the canvas; the task posted now runs once this frame is rendered.
        const channel = new MessageChannel();
        channel.port1.onmessage = () => { if (m.chart === undefined) m.chart = performance.now(); };
        channel.port2.postMessage(0);
      } else requestAnimationFrame(poll);
    };
    requestAnimationFrame(poll);
  };
  window.__timeFilter = (id, v) => new Promise((resolve, reject) => {
    const list = document.querySelector('[data-testid="test-list"]');
    const before = list.getAttribute('aria-rowcount');
    const el = document.querySelector('[data-testid="' + id + '"]');
    const isSelect = el instanceof HTMLSelectElement;
    const proto = isSelect ? HTMLSelectElement.prototype : HTMLInputElement.prototype;
    const t0 = performance.now();
    Object.getOwnPropertyDescriptor(proto, 'value').set.call(el, v);
    el.dispatchEvent(new Event(isSelect ? 'change' : 'input', { bubbles: true }));
    const until = t0 + 10000;
    const wait = () => {
      if (list.getAttribute('aria-rowcount') !== before) afterFrame(() => resolve(performance.now() - t0));
      else if (performance.now() > until) reject(new Error('The list did not change for ' + id + ' = "' + v + '"'));
      else requestAnimationFrame(wait);
    };
    wait();
  });
`;

async function waitForServer(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try { if ((await fetch(url)).ok) return; } catch { /* not up yet */ }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`The preview server did not answer at ${url}`);
}

async function mark(page: Page, name: string, timeout = 60_000): Promise<number> {
  await page.waitForFunction((n) => (window as unknown as { __marks: Marks }).__marks[n] !== undefined, name, { timeout });
  return page.evaluate((n) => (window as unknown as { __marks: Marks }).__marks[n], name);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

function launch(profile: string): Promise<BrowserContext> {
  return chromium.launchPersistentContext(profile, { executablePath: CHROMIUM, headless: true, args: ARGS, viewport: { width: 1400, height: 900 } });
}

function diskUse(path: string): string {
  const r = spawnSync('du', ['-sh', path], { encoding: 'utf8' });
  return r.status === 0 ? r.stdout.split('\t')[0] : 'unknown';
}

/** Writes the archive into the profile through the seeding page; returns the time taken, ms. */
async function seed(profile: string): Promise<number> {
  const started = Date.now();
  const context = await launch(profile);
  const page = await context.newPage();
  await page.goto(`${URL_BASE}/bench/index.html`);
  await page.waitForFunction(() => document.body.dataset.ready === 'true');
  for (let start = 0; start < TESTS; start += CHUNK) {
    const count = Math.min(CHUNK, TESTS - start);
    await page.evaluate(([s, c, n]) => (window as unknown as { benchSeed: { seedTests: (s: number, c: number, n: number) => Promise<number> } }).benchSeed.seedTests(s, c, n), [start, count, SAMPLES]);
    if ((start + count) % 2000 === 0 || start + count === TESTS) console.log(`  seeded ${start + count} tests (${((Date.now() - started) / 1000).toFixed(0)} s)`);
  }
  await page.evaluate(([n, t]) => (window as unknown as { benchSeed: { seedLargeTest: (n: number, t: string) => Promise<number> } }).benchSeed.seedLargeTest(n, t), [LARGE_SAMPLES, LARGE_TYPE] as const);
  await page.evaluate((u) => (window as unknown as { benchSeed: { seedUser: (u: string) => Promise<void> } }).benchSeed.seedUser(u), USER);
  const counts = await page.evaluate(() => (window as unknown as { benchSeed: { countTests: () => Promise<{ tests: number; samples: number }> } }).benchSeed.countTests());
  console.log(`  archive holds ${counts.tests} tests, ${counts.samples} sample rows`);
  await context.close();
  return Date.now() - started;
}

/** One filter change on the loaded list, timed in the page from the event until the rows updated. */
async function timeFilter(page: Page, testId: string, value: string): Promise<number> {
  return page.evaluate(([id, v]) => (window as unknown as { __timeFilter: (id: string, v: string) => Promise<number> }).__timeFilter(id, v), [testId, value] as const);
}

async function main(): Promise<number> {
  if (!existsSync(CHROMIUM)) { console.log(`Skipped: no Chromium at ${CHROMIUM} (apt-get install -y chromium).`); return 0; }
  if (!existsSync('dist-web/index.html') || !existsSync('dist-web/bench/index.html')) { console.log('Skipped: no web build with the bench page (run `npm run build:web` first).'); return 0; }
  const server = spawn('npx', ['vite', 'preview', '--config', 'vite.web.config.ts', '--host', '127.0.0.1', '--port', String(PORT), '--strictPort'], { stdio: 'ignore', detached: true });
  const kept = process.env.BENCH_PROFILE;
  const profile = kept ?? mkdtempSync(join(tmpdir(), 'stress-ledger-bench-'));
  try {
    await waitForServer(URL_BASE, 30_000);
    let seedMs = 0;
    if (!kept) {
      console.log(`Seeding ${TESTS} tests x ${SAMPLES} samples (${(TESTS * SAMPLES / 1e6).toFixed(1)} M) and one of ${LARGE_SAMPLES} samples into ${profile}`);
      seedMs = await seed(profile);
    }
    const disk = diskUse(profile);
    if (!kept) console.log(`Seeding took ${(seedMs / 1000).toFixed(1)} s; the profile uses ${disk} on disk`);

    const starts: number[] = [];
    const firstRows: number[] = [];
    const searches: number[] = [];
    const states: number[] = [];
    const charts: number[] = [];
    let largeId = '';
    let largeWell = '';
    for (let run = -1; run < RUNS; run++) {
      // Run -1 warms the profile (the first load after seeding), untimed.
      const context = await launch(profile);
      await context.addInitScript(OBSERVER_SCRIPT);
      const page = context.pages()[0] ?? await context.newPage();
      await page.goto(`${URL_BASE}/?load=${run}#/archive`);
      const interactive = await mark(page, 'interactive');
      if (run >= 0) { starts.push(interactive); firstRows.push(await mark(page, 'firstRow')); }

      // Filters, on the list as it stands (the state chip of the cold-start probe undone first).
      await page.getByTestId('count-all').click();
      await page.waitForFunction((n) => document.querySelector('[data-testid="test-list"]')?.getAttribute('aria-rowcount') === String(n), TESTS + 2);
      const search = ['hf-12', 'hf-3', 'hf-25'][Math.max(0, run) % 3];
      const s1 = await timeFilter(page, 'well-search', search);
      await timeFilter(page, 'well-search', '');
      const s2 = await timeFilter(page, 'filter-state', 'accepted');
      await timeFilter(page, 'filter-state', '');
      if (run >= 0) { searches.push(s1); states.push(s2); }

      // The long record: find its row by well name, click it, time until the chart has drawn.
      if (!largeId) {
        await page.goto(`${URL_BASE}/bench/index.html`);
        [largeId, largeWell] = await page.evaluate(() => { const b = (window as unknown as { benchSeed: { largeTestId: string; largeTestWell: string } }).benchSeed; return [b.largeTestId, b.largeTestWell]; });
        await page.goto(`${URL_BASE}/?load=${run}b#/archive`);
        await mark(page, 'interactive');
      }
      await page.getByTestId('count-all').click();
      await page.getByTestId('well-search').fill(largeWell);
      await page.locator(`[data-test-id="${largeId}"]`).waitFor();
      await page.evaluate((id) => {
        const w = window as unknown as { __marks: Marks; __watchChart: () => void };
        w.__marks.clickAt = performance.now();
        w.__watchChart();
        (document.querySelector(`[data-test-id="${id}"]`) as HTMLElement).click();
      }, largeId);
      const chartAt = await mark(page, 'chart');
      const clickAt = await page.evaluate(() => (window as unknown as { __marks: Marks }).__marks.clickAt);
      if (run >= 0) charts.push(chartAt - clickAt);
      console.log(run < 0 ? `  warm-up load: interactive ${interactive.toFixed(0)} ms, chart ${(chartAt - clickAt).toFixed(0)} ms`
        : `  run ${run + 1}: interactive ${interactive.toFixed(0)} ms, search ${s1.toFixed(0)} ms, state ${s2.toFixed(0)} ms, chart ${(chartAt - clickAt).toFixed(0)} ms`);
      await context.close();
    }

    const startMs = median(starts);
    const searchMs = median(searches);
    const stateMs = median(states);
    const chartMs = median(charts);
    const line = (label: string, value: number, target: number, all: number[]) =>
      console.log(`${label.padEnd(44)} median ${value.toFixed(0).padStart(5)} ms  target < ${target} ms  ${value < target ? 'pass' : 'FAIL'}  (${all.map((v) => v.toFixed(0)).join(', ')})`);
    console.log(`Archive: ${TESTS} tests x ${SAMPLES} samples + 1 x ${LARGE_SAMPLES}; ${RUNS} runs, each a fresh browser on the profile`);
    line('cold start to interactive list', startMs, TARGET_START_MS, starts);
    console.log(`${'  (first row in the DOM)'.padEnd(44)} median ${median(firstRows).toFixed(0).padStart(5)} ms`);
    line('filter: well search typed', searchMs, TARGET_FILTER_MS, searches);
    line('filter: review state chosen', stateMs, TARGET_FILTER_MS, states);
    line(`first chart paint (${(LARGE_SAMPLES / 1e6).toFixed(1)} M samples)`, chartMs, TARGET_CHART_MS, charts);
    console.log('BENCH-RESULT ' + JSON.stringify({
      name: `app (chromium, web build, ${TESTS} tests)`,
      metrics: [
        { metric: 'cold start to interactive list', value: Math.round(startMs), unit: 'ms', target: `< ${TARGET_START_MS} ms`, met: startMs < TARGET_START_MS },
        { metric: 'filter: well search', value: Math.round(searchMs), unit: 'ms', target: `< ${TARGET_FILTER_MS} ms`, met: searchMs < TARGET_FILTER_MS },
        { metric: 'filter: review state', value: Math.round(stateMs), unit: 'ms', target: `< ${TARGET_FILTER_MS} ms`, met: stateMs < TARGET_FILTER_MS },
        { metric: `first chart paint, ${LARGE_SAMPLES} samples`, value: Math.round(chartMs), unit: 'ms', target: `< ${TARGET_CHART_MS} ms`, met: chartMs < TARGET_CHART_MS },
        ...(kept ? [] : [{ metric: 'seeding (not a target)', value: Math.round(seedMs / 1000), unit: 's' }]),
      ],
    }));
    mkdirSync('bench-output', { recursive: true });
    writeFileSync('bench-output/app.json', JSON.stringify({
      tests: TESTS, samplesPerTest: SAMPLES, largeSamples: LARGE_SAMPLES, runs: RUNS, seedMs, disk,
      starts, firstRows, searches, states, charts, startMs, searchMs, stateMs, chartMs,
    }, null, 2));
    return startMs < TARGET_START_MS && searchMs < TARGET_FILTER_MS && stateMs < TARGET_FILTER_MS && chartMs < TARGET_CHART_MS ? 0 : 2;
  } finally {
    if (server.pid) { try { process.kill(-server.pid, 'SIGTERM'); } catch { /* already gone */ } }
    if (!kept && process.env.BENCH_KEEP_PROFILE !== '1') rmSync(profile, { recursive: true, force: true });
    else console.log(`Profile kept at ${profile}`);
  }
}

main().then((code) => process.exit(code), (error: unknown) => { console.error(error); process.exit(1); });
