/**
 * The G-function diagnostic of a shut-in for plotting (Nolte 1979; Barree, Barree & Craig
 * 2009): the same bins and derivatives the G-function closure picks use.
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { Cycle } from '../result';
import { gFunctionDerivatives } from './shut-in-derivatives';
import { prepareShutIn, type ShutInOptions } from './shut-in-window';

/** The G-function diagnostic series the app plots (all per bin). */
export interface GFunctionDiagnostic {
  g: Float64Array;
  /** Bin mean time from the record's start, s. */
  time: Float64Array;
  /** Bin mean downhole pressure, Pa. */
  pressure: Float64Array;
  /** -dP/dG, Pa (positive for a decline); NaN where a window is too thin. */
  derivative: Float64Array;
  /** G (-dP/dG), Pa: the superposition derivative of Barree et al. (2009). */
  superposition: Float64Array;
  /** Standard error of each derivative from the record's noise, Pa. */
  derivativeError: Float64Array;
  sampleIndex: Int32Array;
}

/**
 * The G-function diagnostic of a shut-in: per bin G, time, pressure, -dP/dG and
 * G(-dP/dG) (Nolte 1979; Barree, Barree & Craig 2009), for plotting and for the picks.
 * The same bins and derivatives the 'g-dpdg-tangent' and 'compliance' picks use, so a chart
 * drawn from it shows exactly what was picked (the skipped first seconds are left out).
 *
 * @param time elapsed time, s, increasing. @param pressure downhole pressure, Pa.
 * @param cycle the cycle. @param options see {@link ShutInOptions}.
 * @returns the series, or null when the shut-in is too short (fewer than 30 samples after
 *   the skip) or the cycle has no pumping time.
 * @throws EngineError 'out-of-range' for cycle indices outside the record.
 * @example gFunctionDiagnostic(time, p, cycle)?.superposition
 */
export function gFunctionDiagnostic(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle, options: ShutInOptions = {}): GFunctionDiagnostic | null {
  const s = prepareShutIn(time, pressure, cycle, options);
  if (!s) return null;
  const d = gFunctionDerivatives(time, pressure, s);
  return {
    g: d.bins.x,
    time: d.bins.companion,
    pressure: d.bins.y,
    derivative: d.rate,
    superposition: d.rate.map((v, k) => v * d.bins.x[k]),
    derivativeError: d.error,
    sampleIndex: d.bins.index,
  };
}
