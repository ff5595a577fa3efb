/**
 * Benchmark of the `analyze` command on a 1,000,000-row contractor-style CSV (about 30 MB;
 * elapsed s, psi, bbl/min, bbl; an invented two-cycle XLOT of the Harrow Flats field).
 *
 * Measured as whole processes, 3 runs each, medians reported:
 *   (a) node running papaparse on the file alone (bench/papaparse-only.mjs), the baseline;
 *   (b) the bundled command line (esbuild, so that TypeScript start-up is not measured)
 *       running `analyze FILE --json`.
 * Targets: wall time of (b) at most 0.3 x (a); peak RSS of (b) under 5 x the file size.
 * Peak RSS (and CPU time) from /usr/bin/time -v when present, else peak RSS from
 * process.resourceUsage() of a wrapper. CPU time is reported beside wall time because wall
 * time on a shared machine varies with the other load.
 *
 * Prints a table and one line `BENCH-RESULT {json}` for bench/run.ts.
 */
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, statSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const ROWS = 1_000_000;
const INTERVAL = 0.1; // s
const PSI = 6894.757293168361; // Pa (NIST SP 811)
const BBL = 0.158987294928; // m3 (NIST SP 811)
const RUNS = 3;

/** Deterministic normal numbers (mulberry32 + Box-Muller). */
function normalSource(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = (): number => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** Surface pressure (psi) and rate (bbl/min) of the invented XLOT at time t (s). */
function xlotAt(t: number): { psi: number; bblMin: number } {
  const rate = 0.5;
  const slopePsiPerS = (30e6 * (rate * BBL / 60)) / PSI; // 30 MPa/m3 stiffness at 0.5 bbl/min
  const c1 = 60;
  const c2 = c1 + 600 + 40_000;
  if (t < c1) return { psi: 0, bblMin: 0 };
  if (t < c1 + 600) return { psi: loading(t - c1, slopePsiPerS, 400, 500, 1450), bblMin: rate };
  const stop1 = loading(600, slopePsiPerS, 400, 500, 1450);
  if (t < c2) return { psi: decline(t - c1 - 600, stop1 - 60, 900, 2000), bblMin: 0 };
  const start2 = decline(c2 - c1 - 600, stop1 - 60, 900, 2000);
  if (t < c2 + 400) return { psi: start2 + reloading(t - c2, slopePsiPerS, 60, 120), bblMin: rate };
  const stop2 = start2 + reloading(400, slopePsiPerS, 60, 120);
  return { psi: decline(t - c2 - 400, stop2 - 30, 900, 2500), bblMin: 0 };
}

/** Straight loading, parabolic bend from leak-off to the peak, drop to a plateau. */
function loading(t: number, slope: number, leakOff: number, peak: number, plateau: number): number {
  if (t <= leakOff) return slope * t;
  const a = slope / (2 * (peak - leakOff));
  const tt = Math.min(t, peak);
  const bend = slope * tt - a * (tt - leakOff) ** 2;
  return t <= peak ? bend : plateau + (bend - plateau) * Math.exp(-(t - peak) / 8);
}

function reloading(t: number, slope: number, reopening: number, flat: number): number {
  if (t <= reopening) return slope * t;
  const a = slope / (2 * (flat - reopening));
  const tt = Math.min(t, flat);
  return slope * tt - a * (tt - reopening) ** 2;
}

function decline(dt: number, start: number, floor: number, tau: number): number {
  return floor + (start - floor) * Math.exp(-dt / tau);
}

/** Writes the CSV (metadata block, header, rows) unless a file of the same size exists. */
function writeBenchFile(path: string): void {
  const normal = normalSource(42);
  const fd = openSync(path, 'w');
  writeSync(fd, [
    'Well,Harrow Flats HF-9', 'Field,Harrow Flats', 'Contractor,Cobalt Ridge Test Services', 'Test type,XLOT',
    'TVD (ft),6561.7', 'Mud density (ppg),10.000', 'Gauge position,surface', 'Gauge range (psi),10000.0',
    'System volume (bbl),377.39', 'Compressibility (1/psi),4.1369e-6', '',
    'Elapsed Time (s),Pressure (psi),Rate (bbl/min),Volume (bbl)', '',
  ].join('\n'));
  let volume = 0;
  let chunk: string[] = [];
  for (let i = 0; i < ROWS; i++) {
    const t = i * INTERVAL;
    const { psi, bblMin } = xlotAt(t);
    const q = bblMin > 0 ? bblMin * (1 + 0.01 * normal()) : 0;
    if (i > 0) volume += (q / 60) * INTERVAL;
    chunk.push(`${t.toFixed(2)},${(psi + 0.5 * normal()).toFixed(2)},${q.toFixed(4)},${volume.toFixed(4)}`);
    if (chunk.length === 50_000) {
      writeSync(fd, chunk.join('\n') + '\n');
      chunk = [];
    }
  }
  if (chunk.length) writeSync(fd, chunk.join('\n') + '\n');
  closeSync(fd);
}

interface Measurement {
  wallMs: number;
  /** User + system CPU time, ms (NaN without /usr/bin/time): steadier than wall time on a shared machine. */
  cpuMs: number;
  maxRssBytes: number;
  status: number | null;
  stdout: string;
}

const haveTime = existsSync('/usr/bin/time');

/** Runs a command as a whole process, returning wall time and peak RSS. */
function measure(command: string, args: string[]): Measurement {
  const started = process.hrtime.bigint();
  const r = haveTime
    ? spawnSync('/usr/bin/time', ['-v', command, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 })
    : spawnSync(process.execPath, ['-e', RSS_WRAPPER, command, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 });
  const wallMs = Number(process.hrtime.bigint() - started) / 1e6;
  const match = haveTime ? /Maximum resident set size \(kbytes\): (\d+)/.exec(r.stderr) : /WRAPPER-MAXRSS (\d+)/.exec(r.stderr);
  const user = /User time \(seconds\): ([\d.]+)/.exec(r.stderr);
  const system = /System time \(seconds\): ([\d.]+)/.exec(r.stderr);
  const cpuMs = user && system ? (Number(user[1]) + Number(system[1])) * 1000 : NaN;
  return { wallMs, cpuMs, maxRssBytes: match ? Number(match[1]) * 1024 : NaN, status: r.status, stdout: r.stdout };
}

/** Fallback wrapper: runs argv[1..] and prints the child's peak RSS (kB) on stderr. */
const RSS_WRAPPER = `
const { spawnSync } = require('node:child_process');
const [cmd, ...rest] = process.argv.slice(1);
const r = spawnSync(cmd, rest, { stdio: ['ignore', 'inherit', 'inherit'] });
process.stderr.write('WRAPPER-MAXRSS ' + process.resourceUsage().maxRSS + '\\n');
process.exit(r.status ?? 1);`;

const median = (v: number[]): number => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
const mb = (b: number): string => `${(b / 1e6).toFixed(1)} MB`;

function main(): void {
  const file = join(tmpdir(), 'stress-ledger-bench-xlot-1m.csv');
  if (!existsSync(file) || statSync(file).size < 29e6) {
    process.stderr.write(`writing ${file} ...\n`);
    writeBenchFile(file);
  }
  const size = statSync(file).size;

  const bundle = join(root, 'out', 'cli', 'stress-ledger-cli.mjs');
  mkdirSync(dirname(bundle), { recursive: true });
  const built = spawnSync(join(root, 'node_modules', '.bin', 'esbuild'), [
    join(root, 'src-renderer/engine/cli/main.ts'), '--bundle', '--platform=node', '--format=esm',
    '--external:exceljs', `--outfile=${bundle}`, '--log-level=warning',
  ], { encoding: 'utf8' });
  if (built.status !== 0) throw new Error(`esbuild failed: ${built.stderr}`);

  const baseline: Measurement[] = [];
  const analyze: Measurement[] = [];
  for (let run = 0; run < RUNS; run++) {
    baseline.push(measure(process.execPath, [join(root, 'bench', 'papaparse-only.mjs'), file]));
    analyze.push(measure(process.execPath, [bundle, 'analyze', file, '--json']));
  }
  for (const m of analyze) {
    if (m.status !== 0) throw new Error(`analyze exited ${m.status}`);
    const doc = JSON.parse(m.stdout);
    if (doc.results[0].error) throw new Error(`analyze failed: ${JSON.stringify(doc.results[0].error)}`);
  }
  const first = JSON.parse(analyze[0].stdout).results[0];
  const a = median(analyze.map((m) => m.wallMs));
  const b = median(baseline.map((m) => m.wallMs));
  const rssA = median(analyze.map((m) => m.maxRssBytes));
  const rssB = median(baseline.map((m) => m.maxRssBytes));
  const ratio = a / b;
  const cpuA = median(analyze.map((m) => m.cpuMs));
  const cpuB = median(baseline.map((m) => m.cpuMs));
  const rssRatio = rssA / size;

  process.stdout.write([
    `analyze benchmark: ${ROWS.toLocaleString('en')} rows, ${mb(size)} (${file})`,
    `  result: ${first.type.toUpperCase()}, ${first.cycles.length} cycles, grade ${first.quality.grade}`,
    `  papaparse only  median ${b.toFixed(0)} ms  (${baseline.map((m) => m.wallMs.toFixed(0)).join(', ')})  peak RSS ${mb(rssB)}`,
    `  analyze --json  median ${a.toFixed(0)} ms  (${analyze.map((m) => m.wallMs.toFixed(0)).join(', ')})  peak RSS ${mb(rssA)}`,
    `  CPU time (user + system) median: papaparse ${cpuB.toFixed(0)} ms, analyze ${cpuA.toFixed(0)} ms, ratio ${(cpuA / cpuB).toFixed(3)}`,
    `  time ratio analyze / papaparse: ${ratio.toFixed(3)} (target <= 0.3) ${ratio <= 0.3 ? 'met' : 'NOT met'}`,
    `  peak RSS / file size: ${rssRatio.toFixed(2)} (target < 5) ${rssRatio < 5 ? 'met' : 'NOT met'}`,
    '',
  ].join('\n'));
  const result = {
    name: 'analyze',
    metrics: [
      { metric: 'analyze wall time (median)', value: Math.round(a), unit: 'ms' },
      { metric: 'papaparse wall time (median)', value: Math.round(b), unit: 'ms' },
      { metric: 'time ratio analyze/papaparse', value: Number(ratio.toFixed(3)), target: '<= 0.3', met: ratio <= 0.3 },
      { metric: 'CPU time ratio analyze/papaparse', value: Number((cpuA / cpuB).toFixed(3)) },
      { metric: 'analyze peak RSS', value: Math.round(rssA / 1e6), unit: 'MB' },
      { metric: 'peak RSS / file size', value: Number(rssRatio.toFixed(2)), target: '< 5', met: rssRatio < 5 },
    ],
  };
  process.stdout.write(`BENCH-RESULT ${JSON.stringify(result)}\n`);
}

main();
