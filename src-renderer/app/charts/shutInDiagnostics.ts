/**
 * Shut-in diagnostic series of one cycle for the review charts, computed with the
 * engine's published methods: Nolte's G-function (engine/analysis/gfunction.ts),
 * a local-regression derivative and Bourdet's log derivative (engine/analysis/derivative.ts).
 */
import { shutInArrays, type ShutInArrays } from '../workers/shutInArrays';
import type { CycleAnalysis, PickKind } from '../../engine/result';
import { pickKey, type ShutInSeries } from './options';

export { shutInArrays, type ShutInArrays };

/** Whether a cycle has a shut-in long enough to diagnose (at least 5 samples after the pumps stop). */
export function hasShutIn(c: CycleAnalysis): boolean {
  return c.cycle.shutInEnd - c.cycle.pumpEnd >= 5;
}

/** The shut-in samples of one cycle: time (s) and downhole pressure (Pa) from the pump stop to the end of the shut-in. */
export interface ShutInSlice {
  /** Elapsed time of each shut-in sample, s (a copy of the record's, element 0 at the pump stop). */
  time: Float64Array;
  /** Downhole pressure of each shut-in sample, Pa (a copy). */
  downhole: Float64Array;
  /** Pumping duration tp of the cycle, s (> 0). */
  pumpingTime: number;
}

/** Copies out a cycle's shut-in samples, or null when the cycle has no usable shut-in. */
export function shutInSlice(time: Float64Array, downhole: Float64Array, c: CycleAnalysis): ShutInSlice | null {
  if (!hasShutIn(c)) return null;
  const { pumpStart, pumpEnd, shutInEnd } = c.cycle;
  const pumpingTime = time[pumpEnd] - time[pumpStart];
  if (!(pumpingTime > 0)) return null;
  return { time: time.slice(pumpEnd, shutInEnd + 1), downhole: downhole.slice(pumpEnd, shutInEnd + 1), pumpingTime };
}

/**
 * Builds the G-function, square-root-of-time and log-log series of a cycle's shut-in.
 * Returns null when the cycle has no usable shut-in. All values SI.
 */
export function shutInDiagnostics(time: Float64Array, downhole: Float64Array, c: CycleAnalysis): ShutInSeries | null {
  const slice = shutInSlice(time, downhole, c);
  return slice ? shutInSeriesOf(shutInArrays(slice.time, slice.downhole, slice.pumpingTime), c) : null;
}

/** Adds a cycle's picks, closure candidates and closure tangent to its shut-in arrays (cheap; runs on the window's thread). */
export function shutInSeriesOf(arrays: ShutInArrays, c: CycleAnalysis): ShutInSeries {
  const { pumpEnd, shutInEnd, index } = c.cycle;
  const { g, gdpdg } = arrays;
  const t0 = arrays.shutInTime;
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
    cycle: index, dt: arrays.dt, pressure: arrays.pressure, g, gdpdg, tangentSlope, rootDt: arrays.rootDt, sqrtDerivative: arrays.sqrtDerivative,
    logElapsed: arrays.logElapsed, deltaP: arrays.deltaP, logDerivative: arrays.logDerivative,
    candidates, picks,
  };
}
