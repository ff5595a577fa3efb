/**
 * Closure picks in the G-function domain (Nolte 1979, SPE 8341): the G dP/dG tangent
 * (Barree, Barree & Craig 2009) and the compliance method (McClure et al. 2016), both on the
 * same -dP/dG derivatives the G-function diagnostic plots.
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { ClosureCandidate } from '../result';
import { medianOfNumbers } from './derivative-scatter';
import { fitHingedLine } from './least-squares';
import {
  candidateAtAbscissa, declinesSignificantly, MIN_SPANNED_WINDOWS, MIN_VALID_BINS, peakRateBin, spansDerivativeWindows, type ShutInDerivatives,
} from './shut-in-derivatives';
import type { ShutInWindow } from './shut-in-window';

/** The compliance rise must exceed this many departure fractions (a stiffening is a large change). */
const COMPLIANCE_RISE_FACTOR = 3;
/** Windows of straight decline (from the first two-sided derivative) a tangent departure must follow. */
const MIN_WINDOWS_BEFORE_DEPARTURE = 3;

/** Median of the finite derivatives within one ln-width `smoothing` either side of bin k. */
function medianAround(d: ShutInDerivatives, k: number, smoothing: number): number {
  const values: number[] = [];
  for (let j = d.lo; j <= d.hi; j++) {
    if (Number.isFinite(d.rate[j]) && Math.abs(Math.log(d.bins.x[j] / d.bins.x[k])) <= smoothing) values.push(d.rate[j]);
  }
  return values.length > 0 ? medianOfNumbers(values) : d.rate[k];
}

/**
 * The tangent's bin: the largest derivative by its lower 2-standard-error bound, leaving out
 * isolated spikes, bins more than 2 standard errors above the median of the derivatives
 * within one window either side. The tangent of Barree et al. (2009) touches the straight
 * part of G dP/dG; one high noisy window (early bins hold few samples) would tilt it above the
 * whole normal decline, which would then look like a departure. -1 when none qualifies.
 */
function tangentPeakBin(d: ShutInDerivatives, smoothing: number): number {
  let best = -1;
  let bestBound = -Infinity;
  for (let k = d.lo; k <= d.hi; k++) {
    const bound = d.rate[k] - 2 * d.error[k];
    if (!Number.isFinite(d.rate[k]) || !(bound > bestBound)) continue;
    if (d.rate[k] - medianAround(d, k, smoothing) > 2 * d.error[k]) continue;
    best = k;
    bestBound = bound;
  }
  return best;
}

/**
 * Closure by the G dP/dG tangent (Barree, Barree & Craig 2009, SPE Prod. & Oper. 24(3)):
 * a straight line through the origin tangent to G dP/dG, i.e. the largest -dP/dG (by its
 * lower 2-standard-error bound, isolated spikes left out); closure where -dP/dG falls below
 * it by departureFraction plus 3 standard errors and stays below over two derivative windows.
 *
 * @param d -dP/dG derivatives (gFunctionDerivatives). @param s the prepared shut-in.
 * @param time elapsed time of the record, s.
 * @returns the candidate 'g-dpdg-tangent' (pressure Pa, time s, G), or null when the shut-in
 *   spans too few windows, does not decline or shows no lasting departure. @throws nothing.
 * @example tangentClosure(gFunctionDerivatives(time, p, s), s, time)?.pressure
 */
export function tangentClosure(d: ShutInDerivatives, s: ShutInWindow, time: ArrayLike<number>): ClosureCandidate | null {
  if (d.hi - d.lo + 1 < MIN_VALID_BINS) return null;
  if (!spansDerivativeWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, s.options.smoothing)) return null;
  const kt = tangentPeakBin(d, s.options.smoothing);
  if (!declinesSignificantly(d, kt)) return null;
  const m = d.rate[kt];
  const limit = (k: number) => m - m * s.options.departureFraction - 3 * Math.hypot(d.error[k], d.error[kt]);
  const below = (k: number) => Number.isFinite(d.rate[k]) && d.rate[k] < limit(k);
  // Persistence: the curve stays below the limit over two derivative windows after the
  // crossing, measured in ln G from the crossing itself (bins are sparse early, dense late)
  // and over at least 3 bins; independent data, so one noisy window cannot make a pick. A
  // crossing whose two windows run past the data cannot be confirmed: no pick.
  const persistence = 2 * s.options.smoothing;
  for (let k = kt + 1; k <= d.hi; k++) {
    if (!below(k)) continue;
    let j = k;
    let stays = true;
    while (stays && j <= d.hi && (Math.log(d.bins.x[j] / d.bins.x[k]) < persistence || j - k < 3)) stays = below(j++);
    if (stays && j > d.hi) return null;
    if (stays) {
      // A departure right after the first derivatives has no straight decline before it to
      // be a departure from: no pick (a short or disturbed shut-in), rather than a guess.
      if (!spansDerivativeWindows(d, d.lo, k, MIN_WINDOWS_BEFORE_DEPARTURE, s.options.smoothing)) return null;
      // Crossing of the departure limit between bins k-1 and k.
      const over = d.rate[k - 1] - limit(k - 1);
      const under = limit(k) - d.rate[k];
      const f = over > 0 && over + under > 0 ? over / (over + under) : 0;
      const g = d.bins.x[k - 1] + f * (d.bins.x[k] - d.bins.x[k - 1]);
      return candidateAtAbscissa('g-dpdg-tangent', d, g, time, true);
    }
  }
  return null;
}

/**
 * Closure by the compliance method (McClure et al. 2016, SPE J. 21(4)): where -dP/dG starts
 * to increase as the closing fracture stiffens; a hinged two-segment line fitted to -dP/dG
 * up to its maximum, closure at the hinge, with the checks listed at closurePick (shut-in.ts).
 *
 * @param d -dP/dG derivatives (gFunctionDerivatives). @param s the prepared shut-in.
 * @param time elapsed time of the record, s.
 * @returns the candidate 'compliance' (pressure Pa, time s, G), or null when no real rise
 *   is found. @throws nothing.
 * @example complianceClosure(gFunctionDerivatives(time, p, s), s, time)?.g
 */
export function complianceClosure(d: ShutInDerivatives, s: ShutInWindow, time: ArrayLike<number>): ClosureCandidate | null {
  if (d.hi - d.lo + 1 < MIN_VALID_BINS) return null;
  if (!spansDerivativeWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, s.options.smoothing)) return null;
  const kt = peakRateBin(d, d.lo, d.hi);
  if (!declinesSignificantly(d, kt) || kt - d.lo < 6) return null;
  const g: number[] = [];
  const rate: number[] = [];
  for (let k = d.lo; k <= kt; k++) {
    if (Number.isFinite(d.rate[k])) {
      g.push(d.bins.x[k]);
      rate.push(d.rate[k]);
    }
  }
  if (g.length < 7) return null;
  let best: { rss: number; h: number; b: number; c: number; a: number } | null = null;
  for (let h = 2; h <= g.length - 3; h++) {
    const fit = fitHingedLine(g, rate, g[h]);
    if (fit && fit.c > 0 && (!best || fit.rss < best.rss)) best = { ...fit, h };
  }
  if (!best) return null;
  const { a, b, c, h } = best;
  const atHinge = a + b * g[h];
  const atPeak = a + b * g[g.length - 1] + c * (g[g.length - 1] - g[h]);
  // McClure et al. (2016): the rise must be real (beyond the departure fraction and the noise),
  // and the trend must turn upward at the hinge.
  const needed = atHinge * COMPLIANCE_RISE_FACTOR * s.options.departureFraction + 3 * Math.hypot(d.error[kt], d.error[d.lo + h]);
  if (!(b + c > 0) || !(atPeak - atHinge > needed) || !(b < (b + c) / 2)) return null;
  // The rise must span at least two derivative windows (independent data), not a noisy bin or
  // two; and a fall before the hinge as large as half the rise makes a V of noise around a
  // dip, not a fracture that stiffens as it closes (McClure et al. 2016 describe a rise
  // from a steady or slowly changing dP/dG).
  if (!(Math.log(g[g.length - 1] / g[h]) >= 2 * s.options.smoothing)) return null;
  if (b < 0 && -b * (g[h] - g[0]) > 0.5 * (atPeak - atHinge)) return null;
  // As for the tangent, a hinge right after the first derivatives has no steady part before it.
  if (!(Math.log(g[h] / g[0]) >= MIN_WINDOWS_BEFORE_DEPARTURE * s.options.smoothing)) return null;
  return candidateAtAbscissa('compliance', d, g[h], time, true);
}
