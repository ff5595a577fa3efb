/**
 * Closure pick on the square root of shut-in time (METHODS.md "Closure picks on the shut-in
 * decline"; Castillo 1987, SPE 16417, from memory).
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { ClosureCandidate } from '../result';
import { gFunction } from './gfunction';
import {
  binsInOneWindow, candidateAtAbscissa, declinesSignificantly, derivativesInVariable, MIN_SPANNED_WINDOWS, MIN_VALID_BINS, peakRateBin, spansDerivativeWindows,
} from './shut-in-derivatives';
import { filledSeries, type ShutInWindow } from './shut-in-window';

/**
 * Closure by the square root of time: the maximum of -dP/d sqrt(dt), the end of the straight
 * P versus sqrt(dt) segment (Castillo 1987, SPE 16417, from memory), placed by a parabola
 * through the three bins around it; null unless the rate one derivative window past the
 * maximum is lower by departureFraction plus 3 standard errors.
 *
 * @param time elapsed time, s. @param pressure downhole pressure, Pa. @param s the prepared shut-in.
 * @returns the candidate 'sqrt-time' (pressure Pa, time s, G at that time), or null.
 * @throws nothing.
 * @example squareRootClosure(time, p, s)?.time
 */
export function squareRootClosure(time: ArrayLike<number>, pressure: ArrayLike<number>, s: ShutInWindow): ClosureCandidate | null {
  const root = filledSeries(s.last - s.first + 1, (i) => Math.sqrt(time[s.first + i] - s.t0));
  const d = derivativesInVariable(root, pressure, time, s, true, s.options.smoothing, s.options.bins);
  if (d.hi - d.lo + 1 < MIN_VALID_BINS) return null;
  if (!spansDerivativeWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, s.options.smoothing)) return null;
  const k = peakRateBin(d, d.lo, d.hi);
  if (!declinesSignificantly(d, k) || k - d.lo < 2 || d.hi - k < 2) return null;
  // The maximum must lie a whole window past the first two-sided derivative: at the very
  // start it is the rising flank of a decline still straight in sqrt(dt), not closure.
  if (!spansDerivativeWindows(d, d.lo, k, 1, s.options.smoothing)) return null;
  // The extremum must be a real maximum: the rate falls clearly afterwards, and stays lower
  // over at least one whole derivative window past the peak (independent data). Without
  // that, a short shut-in whose P vs sqrt(dt) is still straight (the rate still rising
  // towards its pre-closure level) would put a noise wiggle near its end forward as closure.
  const span = Math.max(3, binsInOneWindow(d, k, s.options.smoothing));
  if (d.hi - k < span) return null;
  let lowest = Infinity;
  for (let j = k + span; j <= d.hi; j++) if (Number.isFinite(d.rate[j])) lowest = Math.min(lowest, d.rate[j]);
  if (!(d.rate[k] - lowest > d.rate[k] * s.options.departureFraction + 3 * d.error[k])) return null;
  // Parabola through the three bins around the maximum.
  const [x0, x1, x2] = [d.bins.x[k - 1], d.bins.x[k], d.bins.x[k + 1]];
  const [y0, y1, y2] = [d.rate[k - 1], d.rate[k], d.rate[k + 1]];
  const denominator = (x0 - x1) * (x0 - x2) * (x1 - x2);
  const A = (x2 * (y1 - y0) + x1 * (y0 - y2) + x0 * (y2 - y1)) / denominator;
  const B = (x2 * x2 * (y0 - y1) + x1 * x1 * (y2 - y0) + x0 * x0 * (y1 - y2)) / denominator;
  const vertex = A < 0 ? Math.min(x2, Math.max(x0, -B / (2 * A))) : x1;
  const candidate = candidateAtAbscissa('sqrt-time', d, vertex, time, false);
  candidate.g = gFunction(vertex * vertex / s.tp, s.options.alpha);
  return candidate;
}
