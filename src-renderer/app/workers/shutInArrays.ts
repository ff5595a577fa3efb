/**
 * The costly part of the shut-in diagnostics of one cycle: Nolte's G-function
 * (engine/analysis/gfunction.ts), a local-regression derivative and Bourdet's log
 * derivative (engine/analysis/derivative.ts) over every shut-in sample. Runs in the
 * analysis worker; kept free of chart code so the worker stays small.
 */
import { gFunctionSeries } from '../../engine/analysis/gfunction';
import { logLogDiagnostic, smoothedDerivative } from '../../engine/analysis/derivative';

/** Fraction of the x range used as the derivative window (common practice: a few per cent smooths gauge noise). */
const WINDOW_FRACTION = 0.04;

/** The per-sample and log-log arrays of a shut-in (the costly part of the diagnostics, run in the analysis worker). */
export interface ShutInArrays {
  /** Elapsed time of the pump stop (the shut-in instant), s. */
  shutInTime: number;
  /** Time since shut-in, s. */
  dt: Float64Array;
  pressure: Float64Array;
  g: Float64Array;
  /** G dP/dG, Pa. */
  gdpdg: Float64Array;
  /** Square root of the time since shut-in, s^0.5. */
  rootDt: Float64Array;
  /** dP/d sqrt(t) magnitude, Pa/s^0.5. */
  sqrtDerivative: Float64Array;
  logElapsed: Float64Array;
  deltaP: Float64Array;
  logDerivative: Float64Array;
}

/**
 * G-function, square-root-of-time and log-log arrays of a shut-in slice (element 0 at the
 * pump stop), SI. Throws the engine's EngineError for a slice the methods refuse
 * (time running backwards, non-finite samples).
 */
export function shutInArrays(time: Float64Array, downhole: Float64Array, pumpingTime: number): ShutInArrays {
  const n = time.length;
  const t0 = time[0];
  const dt = new Float64Array(n);
  for (let i = 0; i < n; i++) dt[i] = time[i] - t0;
  const pressure = downhole;
  const g = gFunctionSeries(time, 0, n - 1, pumpingTime);
  const gMax = g[n - 1];
  const dpdg = gMax > 0 ? smoothedDerivative(g, pressure, 0, n - 1, gMax * WINDOW_FRACTION) : new Float64Array(n).fill(NaN);
  const gdpdg = new Float64Array(n);
  for (let i = 0; i < n; i++) gdpdg[i] = -g[i] * dpdg[i];
  const root = new Float64Array(n);
  for (let i = 0; i < n; i++) root[i] = Math.sqrt(dt[i]);
  const rootMax = root[n - 1];
  const sqrtDerivative = rootMax > 0 ? smoothedDerivative(root, pressure, 0, n - 1, rootMax * WINDOW_FRACTION) : new Float64Array(n).fill(NaN);
  for (let i = 0; i < n; i++) sqrtDerivative[i] = -sqrtDerivative[i];
  const loglog = logLogDiagnostic(time, downhole, 0, n - 1);
  return {
    shutInTime: t0, dt, pressure, g, gdpdg, rootDt: root, sqrtDerivative,
    logElapsed: loglog.elapsed, deltaP: loglog.pressureChange, logDerivative: loglog.derivative,
  };
}
