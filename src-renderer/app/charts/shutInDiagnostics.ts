/**
 * Shut-in diagnostic series of one cycle for the review charts, computed with the
 * engine's published methods: Nolte's G-function (engine/analysis/gfunction.ts),
 * a local-regression derivative and Bourdet's log derivative (engine/analysis/derivative.ts).
 */
import { gFunctionSeries } from '../../engine/analysis/gfunction';
import { logLogDiagnostic, smoothedDerivative } from '../../engine/analysis/derivative';
import type { CycleAnalysis, PickKind } from '../../engine/result';
import { pickKey, type ShutInSeries } from './options';

/** Fraction of the x range used as the derivative window (common practice: a few per cent smooths gauge noise). */
const WINDOW_FRACTION = 0.04;

/** Whether a cycle has a shut-in long enough to diagnose (at least 5 samples after the pumps stop). */
export function hasShutIn(c: CycleAnalysis): boolean {
  return c.cycle.shutInEnd - c.cycle.pumpEnd >= 5;
}

/**
 * Builds the G-function, square-root-of-time and log-log series of a cycle's shut-in.
 * Returns null when the cycle has no usable shut-in. All values SI.
 */
export function shutInDiagnostics(time: Float64Array, downhole: Float64Array, c: CycleAnalysis): ShutInSeries | null {
  if (!hasShutIn(c)) return null;
  const { pumpStart, pumpEnd, shutInEnd, index } = c.cycle;
  const pumpingTime = time[pumpEnd] - time[pumpStart];
  if (!(pumpingTime > 0)) return null;
  const t0 = time[pumpEnd];
  const n = shutInEnd - pumpEnd + 1;
  const dt = new Float64Array(n);
  for (let i = 0; i < n; i++) dt[i] = time[pumpEnd + i] - t0;
  const pressure = downhole.slice(pumpEnd, shutInEnd + 1);
  const g = gFunctionSeries(time, pumpEnd, shutInEnd, pumpingTime);
  const gMax = g[n - 1];
  const dpdg = gMax > 0 ? smoothedDerivative(g, pressure, 0, n - 1, gMax * WINDOW_FRACTION) : new Float64Array(n).fill(NaN);
  const gdpdg = new Float64Array(n);
  for (let i = 0; i < n; i++) gdpdg[i] = -g[i] * dpdg[i];
  const root = new Float64Array(n);
  for (let i = 0; i < n; i++) root[i] = Math.sqrt(dt[i]);
  const rootMax = root[n - 1];
  const sqrtDerivative = rootMax > 0 ? smoothedDerivative(root, pressure, 0, n - 1, rootMax * WINDOW_FRACTION) : new Float64Array(n).fill(NaN);
  for (let i = 0; i < n; i++) sqrtDerivative[i] = -sqrtDerivative[i];
  const loglog = logLogDiagnostic(time, downhole, pumpEnd, shutInEnd);

  const picks: ShutInSeries['picks'] = [];
  for (const kind of ['isip', 'closure'] as PickKind[]) {
    const p = c.picks[kind];
    if (p && p.sampleIndex >= pumpEnd && p.sampleIndex <= shutInEnd) {
      picks.push({ key: pickKey(index, kind), kind, dt: p.time - t0, pressure: p.pressure });
    }
  }
  const closure = c.picks.closure;
  let tangentSlope: number | null = null;
  if (closure && closure.sampleIndex > pumpEnd && closure.sampleIndex <= shutInEnd) {
    const k = closure.sampleIndex - pumpEnd;
    if (g[k] > 0 && Number.isFinite(gdpdg[k])) tangentSlope = gdpdg[k] / g[k];
  }
  const candidates = c.closureCandidates
    .filter((cc) => cc.sampleIndex >= pumpEnd && cc.sampleIndex <= shutInEnd)
    .map((cc) => ({ method: cc.method, dt: cc.time - t0, pressure: cc.pressure, g: cc.g ?? g[cc.sampleIndex - pumpEnd] }));
  return {
    cycle: index, dt, pressure, g, gdpdg, tangentSlope, rootDt: root, sqrtDerivative,
    logElapsed: loglog.elapsed, deltaP: loglog.pressureChange, logDerivative: loglog.derivative,
    candidates, picks,
  };
}
