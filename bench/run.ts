/**
 * Runs every bench/*.bench.ts in turn (each a standalone tsx script), passes their output
 * through, and prints a summary table of the `BENCH-RESULT {json}` lines they print:
 * {name, metrics: [{metric, value, unit?, target?, met?}]}. Exit status 1 when a bench
 * fails to run or misses a target. BENCH_ONLY=app (comma-separated name starts) runs only those.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

interface Metric {
  metric: string;
  value: number;
  unit?: string;
  target?: string;
  met?: boolean;
}

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
const tsx = join(root, 'node_modules', '.bin', 'tsx');
// BENCH_ONLY=app,archive runs only the benches whose names start with one of these.
const only = (process.env.BENCH_ONLY ?? '').split(',').map((s) => s.trim()).filter(Boolean);
const benches = readdirSync(here).filter((f) => f.endsWith('.bench.ts') && (only.length === 0 || only.some((o) => f.startsWith(o)))).sort();

const rows: { bench: string; m: Metric }[] = [];
let failed = false;
for (const bench of benches) {
  process.stdout.write(`\n== ${bench}\n`);
  const r = spawnSync(tsx, [join(here, bench)], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'], maxBuffer: 1 << 26 });
  const out = r.stdout ?? '';
  for (const line of out.split('\n')) {
    if (line.startsWith('BENCH-RESULT ')) {
      const parsed = JSON.parse(line.slice('BENCH-RESULT '.length)) as { name: string; metrics: Metric[] };
      for (const m of parsed.metrics) rows.push({ bench: parsed.name, m });
    } else if (line) {
      process.stdout.write(line + '\n');
    }
  }
  if (r.status !== 0) {
    failed = true;
    rows.push({ bench: bench.replace(/\.bench\.ts$/, ''), m: { metric: `failed (exit ${r.status})`, value: NaN, met: false } });
  }
}

const table = [['bench', 'metric', 'value', 'target', 'met']];
for (const { bench, m } of rows) {
  table.push([bench, m.metric, `${m.value}${m.unit ? ' ' + m.unit : ''}`, m.target ?? '', m.met === undefined ? '' : m.met ? 'yes' : 'NO']);
  if (m.met === false) failed = true;
}
const widths = table[0].map((_, c) => Math.max(...table.map((r) => r[c].length)));
process.stdout.write('\nSummary\n');
for (const r of table) process.stdout.write(r.map((cell, c) => cell.padEnd(widths[c])).join('  ').trimEnd() + '\n');
process.exitCode = failed ? 1 : 0;
