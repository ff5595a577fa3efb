/**
 * Benchmark of the engine's numerical methods on record sizes the product must handle:
 * - closure candidates (all four methods) and the ISIP on a 1,000,000-sample shut-in;
 * - a sliding 500-sample line fit across 1,000,000 samples (the loading-line scan);
 * - minimum curvature over a 10,000-station survey, then 10,000 TVD look-ups.
 * Synthetic inputs whose truth is set here (Carter-type decline linear in G, closure at
 * G = 5). Medians of 3 runs. Targets (the product's own): closure + ISIP under 2 s, the
 * sliding fit under 0.2 s, the survey work under 0.5 s.
 *
 * Prints a table and one line `BENCH-RESULT {json}` for bench/run.ts.
 */
import { closureCandidates, isipPick } from '../src-renderer/engine/analysis/shut-in';
import { gFunction } from '../src-renderer/engine/analysis/gfunction';
import { RunningLineFit } from '../src-renderer/engine/analysis/least-squares';
import { minimumCurvature, tvdAtMd } from '../src-renderer/engine/analysis/survey';
import type { Cycle } from '../src-renderer/engine/result';

const N = 1_000_000;
const RUNS = 3;

function median(values: number[]): number {
  const v = [...values].sort((a, b) => a - b);
  return v[Math.floor(v.length / 2)];
}

function timed(run: () => void): number {
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    run();
    times.push((performance.now() - start) / 1000);
  }
  return median(times);
}

const tp = 3600;
const time = new Float64Array(N);
const pressure = new Float64Array(N);
for (let i = 0; i < N; i++) {
  time[i] = i;
  const g = i <= tp ? 0 : gFunction((i - tp) / tp);
  pressure[i] = i <= tp ? 3e7 + 1e7 * (i / tp) : 4e7 - 1e6 * Math.min(g, 5) - 1e5 * Math.max(0, g - 5) + 1000 * Math.sin(i * 1.7);
}
const cycle: Cycle = { index: 1, pumpStart: 0, pumpEnd: tp, shutInEnd: N - 1, meanRate: 1e-3, volumePumped: 3.6, flowBack: false };

let closureCount = 0;
const shutInSeconds = timed(() => {
  closureCount = closureCandidates(time, pressure, cycle).length;
  isipPick(time, pressure, cycle);
});

const slidingSeconds = timed(() => {
  const fit = new RunningLineFit();
  for (let i = 0; i < N; i++) {
    fit.add(time[i], pressure[i]);
    if (i >= 500) fit.remove(time[i - 500], pressure[i - 500]);
  }
  if (!Number.isFinite(fit.slope)) throw new Error('sliding fit failed');
});

const stations = Array.from({ length: 10_000 }, (_, i) => ({ md: i * 1, inc: Math.min(90, i * 0.02), azi: (i * 0.01) % 360 }));
const surveySeconds = timed(() => {
  const path = minimumCurvature(stations);
  for (let i = 0; i < 10_000; i++) tvdAtMd(path, i * 0.999);
});

const rows = [
  { metric: 'closure + ISIP, 1e6-sample shut-in', value: Number(shutInSeconds.toFixed(3)), unit: 's', target: '< 2', met: shutInSeconds < 2 },
  { metric: 'closure methods that picked', value: closureCount },
  { metric: 'sliding line fit, 1e6 samples', value: Number(slidingSeconds.toFixed(3)), unit: 's', target: '< 0.2', met: slidingSeconds < 0.2 },
  { metric: 'survey 1e4 stations + 1e4 TVD look-ups', value: Number(surveySeconds.toFixed(3)), unit: 's', target: '< 0.5', met: surveySeconds < 0.5 },
];
for (const r of rows) process.stdout.write(`${r.metric.padEnd(45)} ${String(r.value).padStart(8)} ${r.unit ?? ''}${r.target ? `  (target ${r.target})` : ''}\n`);
process.stdout.write(`BENCH-RESULT ${JSON.stringify({ name: 'analysis-methods', metrics: rows })}\n`);
