/**
 * Benchmark of the `analyze` command on a 1,000,000-row contractor-style CSV (about 30 MB;
 * elapsed s, psi, bbl/min, bbl; an invented two-cycle XLOT of the Harrow Flats field).
 *
 * Steps:
 *   1. bundle the command line with esbuild (so that TypeScript start-up is not measured):
 *      out/cli/stress-ledger-cli.mjs plus out/cli/chunks/ (code split: the model command,
 *      the import-option schema library and exceljs are loaded only when used);
 *   2. start-up: median of 5 runs of `stress-ledger-cli.mjs --help` (reported, no target);
 *   3. one untimed run of each command (file cache, disk), then 3 timed runs each as whole
 *      processes, the order alternating (papaparse first, analyze first, papaparse first)
 *      so that a burst of load from elsewhere on a shared machine falls on both alike:
 *      (a) node running papaparse on the file alone (bench/papaparse-only.mjs), the baseline;
 *      (b) the bundled command line running `analyze FILE --json`.
 * Before each timed run the bench waits (up to 5 s) until at least one core has been idle
 * over a quarter of a second (Linux /proc/stat), so that a run does not start in the middle
 * of a burst of other work; the waits are reported. Both commands are treated alike.
 * Targets: median wall time of (b) at most 0.3 x that of (a); median peak RSS of (b) under
 * 5 x the file size. Median CPU time (user + system) is reported beside wall time, with its
 * ratio, because wall time on a shared machine varies with the other load. Peak RSS and CPU
 * time come from /usr/bin/time -v when present, else from the measured process itself
 * (a --require'd hook printing process.resourceUsage() at exit).
 *
 * Prints a table and one line `BENCH-RESULT {json}` for bench/run.ts.
 */
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, rmSync, statSync, writeFileSync, writeSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom } from '../src-renderer/engine/synthetic/random';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const ROWS = 1_000_000;
const INTERVAL = 0.1; // s
const PSI = 6894.757293168361; // Pa (NIST SP 811)
const BBL = 0.158987294928; // m3 (NIST SP 811)
const RUNS = 3;

/** Deterministic standard normal numbers from the engine's seeded generator (mulberry32). */
function normalSource(seed: number): () => number {
  const random = seededRandom(seed);
  return () => random.normal();
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
  /** User + system CPU time, ms: steadier than wall time on a shared machine. */
  cpuMs: number;
  maxRssBytes: number;
  status: number | null;
  stdout: string;
  stderr: string;
}

const haveTime = existsSync('/usr/bin/time');

/** Fallback hook (node --require): prints the process's own peak RSS (kB) and CPU (us) at exit. */
const USAGE_HOOK = `process.on('exit', () => {
  const u = process.resourceUsage();
  process.stderr.write('BENCH-USAGE ' + JSON.stringify({ maxRss: u.maxRSS, user: u.userCPUTime, system: u.systemCPUTime }) + '\\n');
});
`;

/** Runs `node ARGS` as a whole process, returning wall time, CPU time and peak RSS. */
function measure(args: string[], hook: string): Measurement {
  const started = process.hrtime.bigint();
  const r = haveTime
    ? spawnSync('/usr/bin/time', ['-v', process.execPath, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 })
    : spawnSync(process.execPath, ['--require', hook, ...args], { encoding: 'utf8', maxBuffer: 1 << 28 });
  const wallMs = Number(process.hrtime.bigint() - started) / 1e6;
  let cpuMs = NaN;
  let maxRssBytes = NaN;
  if (haveTime) {
    const rss = /Maximum resident set size \(kbytes\): (\d+)/.exec(r.stderr);
    const user = /User time \(seconds\): ([\d.]+)/.exec(r.stderr);
    const system = /System time \(seconds\): ([\d.]+)/.exec(r.stderr);
    if (rss) maxRssBytes = Number(rss[1]) * 1024;
    if (user && system) cpuMs = (Number(user[1]) + Number(system[1])) * 1000;
  } else {
    const usage = /BENCH-USAGE (\{.*\})/.exec(r.stderr);
    if (usage) {
      const u = JSON.parse(usage[1]) as { maxRss: number; user: number; system: number };
      maxRssBytes = u.maxRss * 1024;
      cpuMs = (u.user + u.system) / 1000;
    }
  }
  return { wallMs, cpuMs, maxRssBytes, status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Busy and total CPU ticks of the whole machine (Linux /proc/stat), or null elsewhere. */
function cpuTicks(): { idle: number; total: number } | null {
  try {
    const fields = readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
    const idle = fields[3] + (fields[4] ?? 0);
    return { idle, total: fields.reduce((a, b) => a + b, 0) };
  } catch {
    return null;
  }
}

const pause = new Int32Array(new SharedArrayBuffer(4));
const sleep = (ms: number): void => void Atomics.wait(pause, 0, 0, ms);

/** Waits until at least one core was idle over 250 ms (at most `limitMs`); returns the ms waited. */
function waitForIdleCore(limitMs = 5000): number {
  const cores = availableParallelism();
  const started = Date.now();
  for (;;) {
    const a = cpuTicks();
    sleep(250);
    const b = cpuTicks();
    if (!a || !b) return 0;
    const idleCores = ((b.idle - a.idle) / Math.max(1, b.total - a.total)) * cores;
    const waited = Date.now() - started;
    if (idleCores >= 0.9 || waited >= limitMs) return waited - 250;
  }
}

const median = (v: number[]): number => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
const mb = (b: number): string => `${(b / 1e6).toFixed(1)} MB`;
const list = (v: number[]): string => v.map((x) => x.toFixed(0)).join(', ');

/** Bundles the command line into out/cli (entry stress-ledger-cli.mjs, chunks/ beside it). */
function bundleCli(): { entry: string; ms: number } {
  const outdir = join(root, 'out', 'cli');
  mkdirSync(outdir, { recursive: true });
  rmSync(join(outdir, 'chunks'), { recursive: true, force: true }); // no stale chunks
  const started = process.hrtime.bigint();
  const built = spawnSync(join(root, 'node_modules', '.bin', 'esbuild'), [
    join(root, 'src-renderer/engine/cli/main.ts'), '--bundle', '--platform=node', '--format=esm',
    '--external:exceljs', '--splitting', `--outdir=${outdir}`, '--entry-names=stress-ledger-cli',
    '--chunk-names=chunks/[name]-[hash]', '--out-extension:.js=.mjs', '--log-level=warning',
  ], { encoding: 'utf8' });
  if (built.status !== 0) throw new Error(`esbuild failed: ${built.stderr}`);
  return { entry: join(outdir, 'stress-ledger-cli.mjs'), ms: Number(process.hrtime.bigint() - started) / 1e6 };
}

function checkedAnalysis(m: Measurement): { type: string; cycles: unknown[]; quality: { grade: string } } {
  if (m.status !== 0) throw new Error(`analyze exited ${m.status}: ${m.stderr.slice(-2000)}`);
  const doc = JSON.parse(m.stdout);
  if (doc.results[0].error) throw new Error(`analyze failed: ${JSON.stringify(doc.results[0].error)}`);
  return doc.results[0];
}

function main(): void {
  const file = join(tmpdir(), 'stress-ledger-bench-xlot-1m.csv');
  if (!existsSync(file) || statSync(file).size < 29e6) {
    process.stderr.write(`writing ${file} ...\n`);
    writeBenchFile(file);
  }
  const size = statSync(file).size;
  const hook = join(tmpdir(), 'stress-ledger-bench-usage.cjs');
  if (!haveTime) writeFileSync(hook, USAGE_HOOK);

  const bundle = bundleCli();
  const startup: Measurement[] = [];
  for (let run = 0; run < 5; run++) startup.push(measure([bundle.entry, '--help'], hook));
  if (startup.some((m) => m.status !== 0)) throw new Error('stress-ledger-cli.mjs --help failed');

  const papaArgs = [join(root, 'bench', 'papaparse-only.mjs'), file];
  const analyzeArgs = [bundle.entry, 'analyze', file, '--json'];
  checkedAnalysis(measure(analyzeArgs, hook)); // untimed warm-up of both (file cache)
  measure(papaArgs, hook);
  const baseline: Measurement[] = [];
  const analyze: Measurement[] = [];
  const waits: number[] = [];
  const timed = (args: string[]): Measurement => {
    waits.push(waitForIdleCore());
    return measure(args, hook);
  };
  for (let run = 0; run < RUNS; run++) {
    if (run % 2 === 0) {
      baseline.push(timed(papaArgs));
      analyze.push(timed(analyzeArgs));
    } else {
      analyze.push(timed(analyzeArgs));
      baseline.push(timed(papaArgs));
    }
  }
  const first = checkedAnalysis(analyze[0]);
  for (const m of analyze.slice(1)) checkedAnalysis(m);
  if (baseline.some((m) => m.status !== 0)) throw new Error('papaparse baseline failed');

  const wallA = median(analyze.map((m) => m.wallMs));
  const wallB = median(baseline.map((m) => m.wallMs));
  const cpuA = median(analyze.map((m) => m.cpuMs));
  const cpuB = median(baseline.map((m) => m.cpuMs));
  const rssA = median(analyze.map((m) => m.maxRssBytes));
  const rssB = median(baseline.map((m) => m.maxRssBytes));
  const ratio = wallA / wallB;
  const cpuRatio = cpuA / cpuB;
  const rssRatio = rssA / size;
  const timeMet = ratio <= 0.3;
  const rssMet = rssRatio < 5;

  process.stdout.write([
    `analyze benchmark: ${ROWS.toLocaleString('en')} rows, ${mb(size)} (${file})`,
    `  bundle: esbuild ${bundle.ms.toFixed(0)} ms; start-up (--help) median wall ${median(startup.map((m) => m.wallMs)).toFixed(0)} ms, CPU ${median(startup.map((m) => m.cpuMs)).toFixed(0)} ms, peak RSS ${mb(median(startup.map((m) => m.maxRssBytes)))}`,
    `  result: ${first.type.toUpperCase()}, ${first.cycles.length} cycles, grade ${first.quality.grade}`,
    `  runs alternate: papaparse first in runs 1 and 3, analyze first in run 2; waits for an idle core before the runs: ${list(waits)} ms`,
    `  papaparse only  wall median ${wallB.toFixed(0)} ms (${list(baseline.map((m) => m.wallMs))}), CPU median ${cpuB.toFixed(0)} ms (${list(baseline.map((m) => m.cpuMs))}), peak RSS ${mb(rssB)}`,
    `  analyze --json  wall median ${wallA.toFixed(0)} ms (${list(analyze.map((m) => m.wallMs))}), CPU median ${cpuA.toFixed(0)} ms (${list(analyze.map((m) => m.cpuMs))}), peak RSS ${mb(rssA)}`,
    `  CPU time ratio analyze / papaparse: ${cpuRatio.toFixed(3)} (reported)`,
    `  wall time ratio analyze / papaparse: ${ratio.toFixed(3)} (target <= 0.3) ${timeMet ? 'PASS' : 'FAIL'}`,
    `  peak RSS / file size: ${rssRatio.toFixed(2)} (target < 5) ${rssMet ? 'PASS' : 'FAIL'}`,
    '',
  ].join('\n'));
  const result = {
    name: 'analyze',
    metrics: [
      { metric: 'analyze wall time (median)', value: Math.round(wallA), unit: 'ms' },
      { metric: 'papaparse wall time (median)', value: Math.round(wallB), unit: 'ms' },
      { metric: 'time ratio analyze/papaparse', value: Number(ratio.toFixed(3)), target: '<= 0.3', met: timeMet },
      { metric: 'analyze CPU time (median)', value: Math.round(cpuA), unit: 'ms' },
      { metric: 'papaparse CPU time (median)', value: Math.round(cpuB), unit: 'ms' },
      { metric: 'CPU time ratio analyze/papaparse', value: Number(cpuRatio.toFixed(3)) },
      { metric: 'CLI start-up --help (median)', value: Math.round(median(startup.map((m) => m.wallMs))), unit: 'ms' },
      { metric: 'analyze peak RSS', value: Math.round(rssA / 1e6), unit: 'MB' },
      { metric: 'peak RSS / file size', value: Number(rssRatio.toFixed(2)), target: '< 5', met: rssMet },
    ],
  };
  process.stdout.write(`BENCH-RESULT ${JSON.stringify(result)}\n`);
}

main();
