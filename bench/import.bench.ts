/**
 * Import speed benchmark (a tsx script, not a vitest test): generates a 1,000,000-row CSV of
 * a synthetic Harrow Flats test in the OS temp folder, then times the engine's delimited
 * importer and, for scale, papaparse parsing the same file alone. Each run is a fresh child
 * process, so its peak RSS is its own. Prints medians of 3 runs and peak RSS; 'baseline' is
 * a child that only loads the runtime and reads the file, for the RSS the parser adds.
 *
 *   npx tsx bench/import.bench.ts      (also run by `npm run bench`, which reads its BENCH-RESULT line)
 */
import { spawnSync } from 'node:child_process';
import { readFileSync, statSync, writeFileSync, unlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROWS = 1_000_000;
const RUNS = 3;

/** Writes the synthetic CSV: metadata block, header with units, 1e6 rows. */
function writeBenchFile(path: string): void {
  const chunks: string[] = [
    'Well: HF-3\nField: Harrow Flats\nContractor: Cobalt Ridge Test Services\nTest type: XLOT\nTVD: 2033 m\nMud weight: 1.25 sg\n',
    'Time (s),Pressure (kPa),Rate (m3/min),Volume (m3)\n',
  ];
  let volume = 0;
  let block = '';
  for (let i = 0; i < ROWS; i++) {
    const t = i * 0.1;
    const rate = (i % 20000) < 12000 ? 0.8 : 0;
    volume += (rate / 60) * 0.1;
    const p = 2000 + 15000 * Math.sin(i / 50000) ** 2 + (i % 7) * 0.13;
    block += `${t.toFixed(1)},${p.toFixed(2)},${rate.toFixed(3)},${volume.toFixed(4)}\n`;
    if (block.length > 1 << 20) {
      chunks.push(block);
      block = '';
    }
  }
  chunks.push(block);
  writeFileSync(path, chunks.join(''));
}

/** Child: load the code, then parse once (timed), print elapsed and CPU ms and peak RSS (bytes) as JSON. */
async function child(kind: string, path: string): Promise<void> {
  const bytes: Uint8Array = readFileSync(path);
  const { parseDelimitedTest } = await import('../src-renderer/engine/import/delimitedImport');
  const Papa = (await import('papaparse')).default;
  const start = performance.now();
  const cpuStart = process.cpuUsage();
  let rows: number;
  if (kind === 'baseline') {
    rows = bytes.length > 0 ? 0 : -1;
  } else if (kind === 'engine') {
    rows = parseDelimitedTest(bytes, 'bench.csv').time.length;
  } else {
    const text = new TextDecoder().decode(bytes);
    rows = Papa.parse<string[]>(text, { dynamicTyping: true, skipEmptyLines: true }).data.length;
  }
  const ms = performance.now() - start;
  const cpu = process.cpuUsage(cpuStart);
  process.stdout.write(JSON.stringify({ ms, cpuMs: (cpu.user + cpu.system) / 1000, rows, maxRss: process.resourceUsage().maxRSS * 1024 }));
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[s.length >> 1];
}

function runChild(kind: string, path: string): { ms: number; cpuMs: number; rows: number; maxRss: number } {
  const self = fileURLToPath(import.meta.url);
  const out = spawnSync(process.execPath, [...process.execArgv, self, '--child', kind, path], { encoding: 'utf8', maxBuffer: 1 << 20 });
  if (out.status !== 0) throw new Error(`${kind} run failed: ${out.stderr}`);
  return JSON.parse(out.stdout);
}

async function main(): Promise<void> {
  const i = process.argv.indexOf('--child');
  if (i >= 0) return child(process.argv[i + 1], process.argv[i + 2]);
  const path = join(tmpdir(), `stress-ledger-import-bench-${process.pid}.csv`);
  writeBenchFile(path);
  const size = statSync(path).size;
  try {
    const results: Record<string, { ms: number[]; cpu: number[]; rss: number[]; rows: number }> = {};
    for (const kind of ['baseline', 'engine', 'papaparse']) {
      const runs = Array.from({ length: RUNS }, () => runChild(kind, path));
      results[kind] = { ms: runs.map((r) => r.ms), cpu: runs.map((r) => r.cpuMs), rss: runs.map((r) => r.maxRss), rows: runs[0].rows };
    }
    const mb = (b: number) => (b / 1e6).toFixed(1);
    console.log(`file: ${mb(size)} MB, ${ROWS} rows`);
    for (const [kind, r] of Object.entries(results)) {
      console.log(`${kind.padEnd(10)} median ${median(r.ms).toFixed(0)} ms  (runs ${r.ms.map((m) => m.toFixed(0)).join(', ')}; CPU median ${median(r.cpu).toFixed(0)} ms)  peak RSS ${mb(Math.max(...r.rss))} MB = ${(Math.max(...r.rss) / size).toFixed(2)}x file  rows ${r.rows}`);
    }
    console.log(`engine / papaparse time: ${(median(results.engine.ms) / median(results.papaparse.ms)).toFixed(3)} (CPU ${(median(results.engine.cpu) / median(results.papaparse.cpu)).toFixed(3)})`);
    const added = Math.max(...results.engine.rss) - Math.max(...results.baseline.rss);
    const ratio = median(results.engine.ms) / median(results.papaparse.ms);
    console.log(`RSS the engine adds over the baseline: ${mb(added)} MB`);
    console.log('BENCH-RESULT ' + JSON.stringify({
      name: 'import',
      metrics: [
        { metric: 'delimited import of 1e6 rows, median', value: Math.round(median(results.engine.ms)), unit: 'ms' },
        { metric: 'import / papaparse wall time', value: Number(ratio.toFixed(3)), target: '<= 0.3', met: ratio <= 0.3 },
        { metric: 'RSS added by the import / file size', value: Number((added / size).toFixed(2)), target: '< 2', met: added / size < 2 },
      ],
    }));
  } finally {
    unlinkSync(path);
  }
}

void main();
