/**
 * Archive list speed: seeds an archive of BENCH_TESTS tests (default 10,000) with
 * BENCH_SAMPLES samples each (default 5,000: 50 million samples, four channels, as typed
 * arrays in the samples table), then times listTests and countByState. Target: every
 * list query under 100 ms.
 *
 * Runs in Node on fake-indexeddb (an in-memory IndexedDB), writing rows straight into the
 * Dexie tables in batches: the seeding is not what is measured, and a real analysis of
 * 10,000 records would take far longer than the list query it sets up. The in-browser
 * numbers (real IndexedDB) are measured by bench/app.bench.ts.
 *
 *   npx tsx bench/archive.bench.ts            # full size
 *   BENCH_TESTS=1000 npx tsx bench/archive.bench.ts
 */
import 'fake-indexeddb/auto';
import { mkdirSync, writeFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { Archive } from '../src-renderer/archive/archive';
import { StressLedgerDb, nameKey, type StoredSamples, type StoredTest } from '../src-renderer/archive/db';
import type { ArchiveQuery } from '../src-renderer/archive/api';
import { GRADES } from '../src-renderer/engine/result';
import { TEST_TYPES } from '../src-renderer/engine/record';

const TESTS = Number(process.env.BENCH_TESTS ?? 10_000);
const SAMPLES = Number(process.env.BENCH_SAMPLES ?? 5_000);
const TARGET_MS = 100;
const STATES = ['imported', 'in-review', 'accepted', 'rejected'] as const;

function row(i: number): StoredTest {
  const well = `HF-${1 + (i % 400)}`;
  return {
    id: `t${String(i).padStart(6, '0')}`, fieldId: i % 5 === 0 ? 'f2' : 'f1', fieldName: i % 5 === 0 ? 'Cinder Basin' : 'Harrow Flats',
    wellId: `w${i % 400}`, wellName: well, wellNameKey: nameKey(well), type: TEST_TYPES[i % TEST_TYPES.length], typeInferred: i % 3 === 0,
    depthTvd: i % 17 === 0 ? null : 500 + ((i * 37) % 3500), depthMd: null, shmin: 1e7 + ((i * 7919) % 5e7), shminKind: 'estimate',
    grade: GRADES[Math.floor(i / 7) % GRADES.length], state: STATES[Math.floor(i / 3) % STATES.length], reviewer: null, lastPickAuthor: null,
    fileName: `hf-${i}.csv`, fileHash: i.toString(16).padStart(64, '0'), importedAt: new Date(Date.UTC(2020, 0, 1) + i * 3.6e6).toISOString(),
    importedBy: 'Maren Holt', contractor: 'Cobalt Ridge Test Services',
    metadata: { well, field: 'Harrow Flats', contractor: 'Cobalt Ridge Test Services' },
    source: { fileName: `hf-${i}.csv`, format: 'delimited', layout: 'bench', columns: [], derived: { rate: false, volume: false }, warnings: [] },
  };
}

async function seed(db: StressLedgerDb): Promise<number> {
  const started = performance.now();
  const batch = 250;
  for (let start = 0; start < TESTS; start += batch) {
    const tests: StoredTest[] = [];
    const samples: StoredSamples[] = [];
    for (let i = start; i < Math.min(TESTS, start + batch); i++) {
      const r = row(i);
      tests.push(r);
      const time = new Float64Array(SAMPLES);
      const pressure = new Float64Array(SAMPLES);
      for (let k = 0; k < SAMPLES; k++) { time[k] = k; pressure[k] = 1e5 + k * 1e3; }
      samples.push({ testId: r.id, time, pressure, rate: new Float64Array(SAMPLES), volume: new Float64Array(SAMPLES) });
    }
    await db.transaction('rw', db.tests, db.samples, async () => {
      await db.tests.bulkAdd(tests);
      await db.samples.bulkAdd(samples);
    });
  }
  return performance.now() - started;
}

async function time(label: string, work: () => Promise<unknown>, runs = 5): Promise<{ label: string; medianMs: number; maxMs: number; rows: number }> {
  const times: number[] = [];
  let rows = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    const result = await work();
    times.push(performance.now() - t0);
    rows = Array.isArray(result) ? result.length : 1;
  }
  times.sort((a, b) => a - b);
  return { label, medianMs: times[Math.floor(times.length / 2)], maxMs: times[times.length - 1], rows };
}

export async function runArchiveBench() {
  const db = new StressLedgerDb(`bench-${Date.now()}`);
  const archive = await Archive.open({ db, engine: { parse: async () => { throw new Error('not used'); }, analyse: () => { throw new Error('not used'); } } });
  const seedMs = await seed(db);
  console.log(`Seeded ${TESTS} tests x ${SAMPLES} samples (${(TESTS * SAMPLES / 1e6).toFixed(1)} M samples) in ${(seedMs / 1000).toFixed(1)} s`);
  const queries: [string, ArchiveQuery][] = [
    ['all, newest first', {}],
    ['all, by depth', { sortBy: 'depthTvd' }],
    ['accepted, by depth', { state: 'accepted', sortBy: 'depthTvd' }],
    ['field, type and grade', { fieldId: 'f1', type: 'lot', grade: 'B' }],
    ['well text "hf-12"', { wellSearch: 'hf-12', sortBy: 'wellName' }],
  ];
  const results = [];
  // The first call reads every summary from IndexedDB into memory (cold); later calls filter in memory.
  results.push(await time('listTests: first call (cold read)', () => archive.listTests(), 1));
  for (const [label, query] of queries) results.push(await time(`listTests: ${label}`, () => archive.listTests(query)));
  results.push(await time('countByState', () => archive.countByState()));
  results.push(await time('countByState (type filter)', () => archive.countByState({ type: 'fit' })));
  for (const r of results) {
    const verdict = r.label.includes('cold') ? '(not a target)' : r.medianMs <= TARGET_MS ? 'ok' : 'OVER TARGET';
    console.log(`${r.label.padEnd(40)} median ${r.medianMs.toFixed(1).padStart(7)} ms  max ${r.maxMs.toFixed(1).padStart(7)} ms  rows ${String(r.rows).padStart(6)}  ${verdict}`);
  }
  console.log('BENCH-RESULT ' + JSON.stringify({
    name: 'archive list (node, fake-indexeddb)',
    metrics: results.map((r) => ({
      metric: `${r.label} (${TESTS} tests)`, value: Number(r.medianMs.toFixed(1)), unit: 'ms',
      ...(r.label.includes('cold') ? {} : { target: `< ${TARGET_MS} ms`, met: r.medianMs <= TARGET_MS }),
    })),
  }));
  mkdirSync('bench-output', { recursive: true });
  const report = { tests: TESTS, samplesPerTest: SAMPLES, targetMs: TARGET_MS, seedMs, results, environment: 'node + fake-indexeddb' };
  writeFileSync('bench-output/archive.json', JSON.stringify(report, null, 2));
  archive.close();
  return report;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  runArchiveBench().then((report) => {
    process.exit(report.results.filter((r) => !r.label.includes('cold')).every((r) => r.medianMs <= TARGET_MS) ? 0 : 2);
  }, (error: unknown) => { console.error(error); process.exit(1); });
}
