/**
 * Picks on the shut-in decline of a cycle: the instantaneous shut-in pressure (ISIP) and
 * fracture closure by several published methods (METHODS.md "Closure picks on the
 * shut-in decline"; ISRM Suggested Methods, Haimson & Cornet 2003, IJRMMS 40:1011-1020,
 * which asks for several methods whose agreement is itself a quality signal).
 *
 * Shared construction: the shut-in starts at t_s = time[pumpEnd]; the pumping time of the
 * G-function is tp = time[pumpEnd] - time[pumpStart]; the first `skipSeconds` after t_s
 * (water hammer, friction drop) are left out; samples are averaged into bins (evenly spaced
 * in ln G or ln sqrt(dt), or in time for the bilinear method) and differentiated by local
 * least squares over a relative window (+-5 % of G or sqrt(dt) by default; a fixed fraction
 * of the range for time), widened to hold at least 40 samples. The record's noise, from its
 * second differences, gives each derivative a standard error, and every departure must
 * exceed both a relative limit and 3 standard errors. Every method returns null when it
 * cannot pick (shut-in too short, no decline, no departure) rather than guessing.
 *
 * Layout: this file holds the ISIP, the closure orchestration and the public API; the
 * shared construction is in shut-in-window.ts and shut-in-derivatives.ts, the methods in
 * closure-g-function.ts, closure-square-root.ts and closure-bilinear.ts, and the plotted
 * G-function series in shut-in-diagnostics.ts (all re-exported here).
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { ClosureCandidate, Cycle, Pick } from '../result';
import { bilinearClosure } from './closure-bilinear';
import { complianceClosure, tangentClosure } from './closure-g-function';
import { squareRootClosure } from './closure-square-root';
import { gFunction } from './gfunction';
import { fitLine } from './least-squares';
import { gFunctionDerivatives } from './shut-in-derivatives';
import { filledSeries, prepareShutIn, type ShutInOptions } from './shut-in-window';

export type { ShutInOptions } from './shut-in-window';
export { gFunctionDiagnostic, type GFunctionDiagnostic } from './shut-in-diagnostics';

/**
 * ISIP by extrapolating the early shut-in decline back to the shut-in instant: a straight
 * line in G (alpha 1) fitted from skipSeconds to the end of the early window, evaluated at
 * G = 0. Linear in G means linear in dt for dtD << 1 and in sqrt(dt) for dtD >> 1, the two
 * early-decline extrapolations in use (ISRM SM, Haimson & Cornet 2003; Nolte 1979; common
 * practice). The pick is capped at the last pumping pressure (an extrapolation above it
 * would be a negative friction drop).
 *
 * @param time elapsed time, s, increasing. @param pressure downhole pressure, Pa.
 * @param cycle the cycle (pumpStart, pumpEnd, shutInEnd sample indices).
 * @param options.skipSeconds as {@link ShutInOptions}; options.windowSeconds length of the
 *   early window, default min(0.25 tp, 0.1 x shut-in duration), at least 5 samples.
 * @returns Pick {kind 'isip', method 'early-decline-extrapolation', time t_s, sampleIndex
 *   pumpEnd}, or null when the shut-in is too short (fewer than 30 samples after the skip,
 *   or fewer than 5 in the window) or its pressure rises significantly (slope above 2 standard
 *   errors). A flat (held) shut-in gives its level.
 * @throws EngineError 'out-of-range' for cycle indices outside the record; 'bad-argument'.
 * @example isipPick(record.time, downhole, cycle)?.pressure
 */
export function isipPick(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle, options: ShutInOptions & { windowSeconds?: number } = {}): Pick | null {
  const s = prepareShutIn(time, pressure, cycle, options);
  if (!s) return null;
  const duration = time[s.last] - s.t0;
  const interval = duration / (s.last - cycle.pumpEnd);
  const window = Math.max(options.windowSeconds ?? Math.min(0.25 * s.tp, 0.1 * duration), 5 * interval);
  let end = s.first;
  while (end < s.last && time[end + 1] - time[s.first] <= window) end++;
  if (end - s.first + 1 < 5) return null;
  const g = filledSeries(end - s.first + 1, (i) => gFunction((time[s.first + i] - s.t0) / s.tp, 1));
  const p = filledSeries(end - s.first + 1, (i) => pressure[s.first + i]);
  const fit = fitLine(g, p);
  // A held (flat) shut-in, as in a FIT, still has an ISIP; a clearly rising one does not.
  if (fit.slope > 2 * fit.slopeStandardError) return null;
  const value = Math.min(fit.intercept, pressure[cycle.pumpEnd]);
  return { kind: 'isip', pressure: value, time: s.t0, method: 'early-decline-extrapolation', sampleIndex: cycle.pumpEnd };
}

/** Method ids of {@link closureCandidates}, in the order they are tried. */
export const CLOSURE_METHODS = ['g-dpdg-tangent', 'compliance', 'sqrt-time', 'bilinear-dpdt'] as const;
export type ClosureMethod = (typeof CLOSURE_METHODS)[number];

/**
 * One closure pick by a named method on the shut-in of `cycle`:
 * - 'g-dpdg-tangent': straight line through the origin tangent to G dP/dG; closure where
 *   the curve falls below it (Barree, Barree & Craig 2009, SPE Prod. & Oper. 24(3)). The
 *   tangent slope is the largest -dP/dG (by its lower 2-standard-error bound) that is not an
 *   isolated spike (2 standard errors above the median within a window); the departure
 *   must exceed departureFraction of it plus 3 standard errors over two whole derivative
 *   windows; the pick is where that limit is crossed.
 * - 'compliance': where -dP/dG starts to increase as the closing fracture stiffens
 *   (McClure et al. 2016, SPE J. 21(4)): a hinged two-segment line fitted to -dP/dG up to
 *   its maximum, closure at the hinge; null unless the rise exceeds 3 departure fractions
 *   plus 3 standard errors over at least two derivative windows, the hinge lies three windows
 *   or more past the first derivative and the trend before it falls by less than half that
 *   rise (normal leak-off shows none). Here "dP/dG" is the magnitude
 *   -dP/dG, as plotted; it picks earlier and higher than the tangent method.
 * - 'sqrt-time': the maximum of -dP/d sqrt(dt), the end of the straight P vs sqrt(dt)
 *   segment (Castillo 1987, SPE 16417, from memory); null unless the rate one derivative
 *   window past the maximum is lower by departureFraction plus 3 standard errors (a short
 *   shut-in that ends before closure gives null, not a pick at its end).
 * - 'bilinear-dpdt': two straight lines on |dP/dt| versus P, closure at their intersection
 *   (ISRM SM, Haimson & Cornet 2003); break chosen by least total squared error; null unless
 *   the slopes (of one sign) differ by 1.5 times or more, two lines fit four times better
 *   than one. When one parabola fits nearly as well (two lines not four times better), the
 *   change of regime is gradual (a leaking shut-in): the candidate is returned marked
 *   `gradual: true`, counts in the spread, and is never the cycle's closure pick.
 *
 * @param time elapsed time, s. @param pressure downhole pressure, Pa. @param cycle the cycle.
 * @param method one of {@link CLOSURE_METHODS}. @param options see {@link ShutInOptions}.
 * @returns the candidate (pressure Pa, time s, sample index, G where the method works in G) or null.
 * @throws EngineError 'out-of-range' for cycle indices outside the record; 'bad-argument' for an unknown method.
 * @example closurePick(time, p, cycle, 'g-dpdg-tangent')
 */
export function closurePick(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle, method: ClosureMethod, options: ShutInOptions = {}): ClosureCandidate | null {
  if (!CLOSURE_METHODS.includes(method)) throw new EngineError('bad-argument', `unknown closure method "${String(method)}"`, {}, CLOSURE_METHODS.join(', '));
  const s = prepareShutIn(time, pressure, cycle, options);
  if (!s) return null;
  if (method === 'sqrt-time') return squareRootClosure(time, pressure, s);
  if (method === 'bilinear-dpdt') return bilinearClosure(time, pressure, s);
  const d = gFunctionDerivatives(time, pressure, s);
  return method === 'g-dpdg-tangent' ? tangentClosure(d, s, time) : complianceClosure(d, s, time);
}

/**
 * Every closure method that finds a pick on the shut-in of `cycle` (see {@link closurePick}
 * for the methods and their sources). Methods that cannot pick are left out.
 *
 * @returns candidates in the order of {@link CLOSURE_METHODS}; empty when none picks or
 *   the shut-in is too short (fewer than 30 samples after the skip).
 * @throws EngineError 'out-of-range' for cycle indices outside the record.
 * @example closureCandidates(time, p, cycle).map((c) => c.method)
 */
export function closureCandidates(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle, options: ShutInOptions = {}): ClosureCandidate[] {
  const s = prepareShutIn(time, pressure, cycle, options);
  if (!s) return [];
  const d = gFunctionDerivatives(time, pressure, s);
  const found = [tangentClosure(d, s, time), complianceClosure(d, s, time), squareRootClosure(time, pressure, s), bilinearClosure(time, pressure, s)];
  return found.filter((c): c is ClosureCandidate => c !== null);
}

/**
 * Spread of closure candidates, max - min pressure, Pa: the disagreement between
 * methods, itself a quality signal (ISRM SM, Haimson & Cornet 2003).
 *
 * @param candidates closure candidates (pressures in Pa).
 * @returns spread in Pa, or null with fewer than two candidates. Never throws.
 * @example closureSpread([{ pressure: 3.1e7 }, { pressure: 3.0e7 }] as ClosureCandidate[]) // 1e6
 */
export function closureSpread(candidates: readonly ClosureCandidate[]): number | null {
  if (candidates.length < 2) return null;
  let lo = Infinity;
  let hi = -Infinity;
  for (const c of candidates) {
    lo = Math.min(lo, c.pressure);
    hi = Math.max(hi, c.pressure);
  }
  return hi - lo;
}
