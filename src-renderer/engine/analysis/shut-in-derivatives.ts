/**
 * Binned derivatives of a shut-in decline shared by the closure methods: bins in G,
 * sqrt(dt) or time, -dP/du by local least squares with a standard error from the record's
 * noise, and the helpers that judge them (peak, significance, windows spanned) and turn an
 * abscissa into a closure candidate (METHODS.md "Closure picks on the shut-in decline").
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { ClosureCandidate } from '../result';
import { binAverages, binnedSlopes, type BinnedSeries } from './derivative';
import { scaleErrorsToScatter } from './derivative-scatter';
import { gFunction } from './gfunction';
import { filledSeries, MIN_WINDOW_SAMPLES, type ShutInWindow } from './shut-in-window';

/** Fewest bins with a two-sided derivative window before a closure method picks. */
export const MIN_VALID_BINS = 10;

/** Bins in a variable u(t), their -dP/du and its standard error. */
export interface ShutInDerivatives {
  /** Bins; bins.x is the variable u itself (converted back from ln u for logarithmic bins). */
  bins: BinnedSeries;
  rate: Float64Array;
  error: Float64Array;
  /** First and last bins whose window is two-sided. */
  lo: number;
  hi: number;
}

/**
 * Bin the shut-in in a variable u > 0 and differentiate. Logarithmic: bins evenly spaced in
 * ln u and a window of fixed width in ln u (a relative window, +-smoothing/2 of u, as in
 * Bourdet's L-spacing, Bourdet, Ayoub & Pirard 1989, SPE Form. Eval. 4(2)), so the
 * resolution follows the scale of u on short and long shut-ins alike; linear: bins and
 * window evenly in u over its range. Each derivative gets a standard error from the
 * record's noise, scaled up to the observed scatter (derivative-scatter.ts).
 *
 * @param variable u at each analysed sample (window.first..window.last), > 0 when logarithmic.
 * @param pressure downhole pressure, Pa. @param time elapsed time, s.
 * @param s the prepared shut-in. @param logarithmic bins in ln u (true) or in u.
 * @param smoothing window width: in ln u when logarithmic (0.1 = +-5 %), else a fraction of the range.
 * @param binCount number of bins, >= 1.
 * @returns bins (x = u, y = Pa, companion = time s, index = record sample), -dP/du and its
 *   error, and the first and last bins with a two-sided window.
 * @throws nothing for valid input (binning errors propagate from derivative.ts).
 * @example derivativesInVariable(g, p, time, s, true, 0.1, 600).rate
 */
export function derivativesInVariable(variable: Float64Array, pressure: ArrayLike<number>, time: ArrayLike<number>, s: ShutInWindow, logarithmic: boolean, smoothing: number, binCount: number): ShutInDerivatives {
  const p = filledSeries(s.last - s.first + 1, (i) => pressure[s.first + i]);
  const t = filledSeries(s.last - s.first + 1, (i) => time[s.first + i]);
  const u = logarithmic ? variable.map(Math.log) : variable;
  const bins = binAverages(u, p, 0, u.length - 1, binCount, t);
  const range = bins.x[bins.x.length - 1] - bins.x[0];
  const window = logarithmic ? smoothing : Math.max(range * smoothing, 1e-300);
  // Mean of the variable itself in each bin (bins.x holds the mean of ln u when logarithmic).
  const meanU = new Float64Array(bins.x.length);
  for (let k = 0; k < bins.x.length; k++) {
    let sum = 0;
    for (let i = bins.first[k]; i < bins.first[k] + bins.count[k]; i++) sum += variable[i];
    meanU[k] = sum / bins.count[k];
  }
  const minSamples = Math.min(MIN_WINDOW_SAMPLES, Math.max(12, Math.round(variable.length / 25)));
  const local = binnedSlopes(bins, meanU, window / 2, minSamples);
  let lo = 0;
  while (lo < bins.x.length && bins.x[lo] - bins.x[0] < window / 2) lo++;
  let hi = bins.x.length - 1;
  while (hi >= 0 && bins.x[bins.x.length - 1] - bins.x[hi] < window / 2) hi--;
  bins.x = meanU;
  const rate = local.slope.map((v) => -v);
  const error = local.spread.map((v) => (v > 0 ? s.noise / Math.sqrt(v) : Infinity));
  scaleErrorsToScatter(rate, error, bins.x, lo, hi, window);
  for (let i = 0; i < bins.index.length; i++) bins.index[i] += s.first;
  return { bins, rate, error, lo, hi };
}

/**
 * The -dP/dG derivatives of a shut-in, G the Nolte (1979, SPE 8341) G-function of
 * dtD = (t - t0) / tp with the window's alpha, binned in ln G.
 *
 * @param time elapsed time, s. @param pressure downhole pressure, Pa. @param s the prepared shut-in.
 * @returns the derivatives, bins.x holding G. @throws nothing for a prepared window.
 * @example gFunctionDerivatives(time, p, s).rate
 */
export function gFunctionDerivatives(time: ArrayLike<number>, pressure: ArrayLike<number>, s: ShutInWindow): ShutInDerivatives {
  const g = filledSeries(s.last - s.first + 1, (i) => gFunction((time[s.first + i] - s.t0) / s.tp, s.options.alpha));
  return derivativesInVariable(g, pressure, time, s, true, s.options.smoothing, s.options.bins);
}

/**
 * Closure candidate at abscissa u between bins, interpolating time and pressure of the bins.
 *
 * @param method method id. @param d the derivatives. @param u abscissa (G or sqrt(dt) s^0.5), clamped to the bins.
 * @param time elapsed time of the record, s. @param withG store u as the candidate's G.
 * @returns the candidate (pressure Pa, time s, nearest sample). @throws nothing.
 * @example candidateAtAbscissa('compliance', d, 1.4, time, true).pressure
 */
export function candidateAtAbscissa(method: string, d: ShutInDerivatives, u: number, time: ArrayLike<number>, withG: boolean): ClosureCandidate {
  const { x, y, companion } = d.bins;
  let k = 1;
  while (k < x.length - 1 && x[k] < u) k++;
  const f = x[k] === x[k - 1] ? 0 : Math.min(1, Math.max(0, (u - x[k - 1]) / (x[k] - x[k - 1])));
  const t = companion[k - 1] + f * (companion[k] - companion[k - 1]);
  const pressure = y[k - 1] + f * (y[k] - y[k - 1]);
  const candidate: ClosureCandidate = { method, pressure, time: t, sampleIndex: nearestSampleIndex(time, t) };
  if (withG) candidate.g = u;
  return candidate;
}

/**
 * Index of the sample nearest time t, by bisection of an increasing time array.
 *
 * @param time elapsed time, s, increasing, at least one sample. @param t time, s.
 * @returns the index. @throws nothing.
 * @example nearestSampleIndex(Float64Array.of(0, 1, 2), 1.4) // 1
 */
export function nearestSampleIndex(time: ArrayLike<number>, t: number): number {
  let lo = 0;
  let hi = time.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (time[mid] <= t) lo = mid;
    else hi = mid;
  }
  return Math.abs(time[hi] - t) < Math.abs(time[lo] - t) ? hi : lo;
}

/**
 * Bin of the largest rate in [lo, hi], judged by its lower confidence bound
 * (rate - 2 standard errors) so a noisy early bin does not win; -1 when none is finite.
 *
 * @param d the derivatives. @param lo first bin. @param hi last bin (inclusive).
 * @returns the bin index or -1. @throws nothing.
 * @example peakRateBin(d, d.lo, d.hi)
 */
export function peakRateBin(d: ShutInDerivatives, lo: number, hi: number): number {
  let best = -1;
  let bestBound = -Infinity;
  for (let k = lo; k <= hi; k++) {
    const bound = d.rate[k] - 2 * d.error[k];
    if (Number.isFinite(d.rate[k]) && bound > bestBound) {
      best = k;
      bestBound = bound;
    }
  }
  return best;
}

/**
 * True when the decline is significant: the rate of bin k (the largest) stands 5 standard
 * errors above zero (the engine's own limit).
 *
 * @param d the derivatives. @param k bin index, -1 for none. @returns the verdict. @throws nothing.
 * @example declinesSignificantly(d, peakRateBin(d, d.lo, d.hi))
 */
export function declinesSignificantly(d: ShutInDerivatives, k: number): boolean {
  return k >= 0 && d.rate[k] > 5 * d.error[k];
}

/**
 * Bins in one derivative window (ln-width smoothing) after bin k.
 *
 * @param d the derivatives (bins.x > 0). @param k bin index. @param smoothing window width in ln units.
 * @returns the bin count. @throws nothing.
 * @example binsInOneWindow(d, k, 0.1)
 */
export function binsInOneWindow(d: ShutInDerivatives, k: number, smoothing: number): number {
  let j = k;
  while (j < d.bins.x.length - 1 && Math.log(d.bins.x[j] / d.bins.x[k]) < smoothing) j++;
  return j - k;
}

/**
 * Fewest independent derivative windows the analysed shut-in must span (ln(u_hi / u_lo) of
 * at least this many smoothing widths) before a closure method may pick: a shut-in of a
 * minute or so, stopped long before closure, spans six or fewer (G from 0.11 to 0.21), and a
 * noise wiggle in them must not come out as closure. Ten windows (G growing 2.2-fold) is the
 * engine's own choice (common practice: a closure pick needs the decline well recorded
 * before and after it); a shut-in recorded to twice the closure time spans far more.
 */
export const MIN_SPANNED_WINDOWS = 10;

/**
 * Whether the derivatives from bin `from` to `to` span `count` windows of ln-width smoothing:
 * ln(x[to] / x[from]) >= count x smoothing.
 *
 * @param d the derivatives. @param from first bin. @param to last bin.
 * @param count number of windows. @param smoothing window width in ln units.
 * @returns the verdict (false for from < 0, to <= from or x[from] <= 0). @throws nothing.
 * @example spansDerivativeWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, 0.1)
 */
export function spansDerivativeWindows(d: ShutInDerivatives, from: number, to: number, count: number, smoothing: number): boolean {
  return from >= 0 && to > from && d.bins.x[from] > 0 && Math.log(d.bins.x[to] / d.bins.x[from]) >= count * smoothing;
}
