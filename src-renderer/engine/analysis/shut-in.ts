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
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { ClosureCandidate, Cycle, Pick } from '../result';
import { binAverages, binnedSlopes, type BinnedSeries } from './derivative';
import { medianOfNumbers, scaleErrorsToScatter } from './derivative-scatter';
import { gFunction, type GFunctionAlpha } from './gfunction';
import { fitHingedLine, fitLine, fitLinearModel } from './least-squares';

/** Tuning of the shut-in picks; every field has a documented default. */
export interface ShutInOptions {
  /** Seconds after shut-in left out (water hammer, friction); default max(2 s, 3 sample intervals, 0.05 tp). */
  skipSeconds?: number;
  /** G-function exponent, default 1. */
  alpha?: GFunctionAlpha;
  /** Bins for the G and sqrt(dt) derivatives (evenly spaced in the logarithm), default 600. */
  bins?: number;
  /** Derivative window in natural-log units of G or sqrt(dt) (relative width, 0.1 = +-5 %), default 0.1. */
  smoothing?: number;
  /** Relative drop (or rise) of dP/dG that counts as a departure, default 0.03. */
  departureFraction?: number;
}

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

interface ShutIn {
  t0: number;
  tp: number;
  first: number;
  last: number;
  noise: number;
  options: Required<ShutInOptions>;
}

const MIN_SHUT_IN_SAMPLES = 30;
const MIN_VALID_BINS = 10;
/** The compliance rise must exceed this many departure fractions (a stiffening is a large change). */
const COMPLIANCE_RISE_FACTOR = 3;
/** Default skip as a fraction of the pumping time (water hammer in a deep well lasts tens of seconds). */
const SKIP_FRACTION_OF_PUMPING = 0.05;
/** Fewest samples behind one derivative value (fewer, down to 12, on a shut-in of under 1000 samples: n/25; 8 let single noisy windows of a few-minute shut-in look like closure). */
const MIN_WINDOW_SAMPLES = 40;
/** Smallest ratio between the two slopes of the bilinear |dP/dt| versus P fit. */
const BILINEAR_SLOPE_RATIO = 1.5;

/** A Float64Array of length n filled by fn(i) (a plain loop: fast on a million samples). */
function series(n: number, fn: (i: number) => number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = fn(i);
  return out;
}

function checkCycle(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle): void {
  if (time.length !== pressure.length) {
    throw new EngineError('bad-argument', `time has ${time.length} samples but pressure has ${pressure.length}`, {}, 'equal lengths');
  }
  const { pumpStart, pumpEnd, shutInEnd } = cycle;
  if (![pumpStart, pumpEnd, shutInEnd].every(Number.isInteger) || pumpStart < 0 || pumpEnd < pumpStart || shutInEnd < pumpEnd || shutInEnd >= time.length) {
    throw new EngineError('out-of-range', `cycle ${cycle.index} indices ${pumpStart}/${pumpEnd}/${shutInEnd} do not fit a record of ${time.length} samples`, {}, 'pumpStart <= pumpEnd <= shutInEnd < samples');
  }
}

/**
 * Pressure noise per sample, Pa, from second differences (which cancel a smooth decline):
 * median absolute value / (0.6745 sqrt 6), robust to spikes (common practice). A gauge that
 * rounds its readings makes most second differences zero; then the root mean square / sqrt 6
 * is used instead. Noise correlated between samples (filtered records) is underestimated.
 */
function pressureNoise(pressure: ArrayLike<number>, first: number, last: number): number {
  const count = last - first - 1;
  if (count < 3) return 0;
  const stride = Math.max(1, Math.floor(count / 20000));
  const d: number[] = [];
  let squares = 0;
  for (let i = first + 1; i < last; i += stride) {
    const v = pressure[i + 1] - 2 * pressure[i] + pressure[i - 1];
    d.push(Math.abs(v));
    squares += v * v;
  }
  d.sort((a, b) => a - b);
  const median = d[Math.floor(d.length / 2)];
  return median > 0 ? median / (0.6745 * Math.sqrt(6)) : Math.sqrt(squares / d.length / 6);
}

function prepare(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle, options: ShutInOptions): ShutIn | null {
  checkCycle(time, pressure, cycle);
  const t0 = time[cycle.pumpEnd];
  const tp = t0 - time[cycle.pumpStart];
  const samples = cycle.shutInEnd - cycle.pumpEnd;
  if (samples < MIN_SHUT_IN_SAMPLES || !(tp > 0)) return null;
  const interval = (time[cycle.shutInEnd] - t0) / samples;
  const skip = options.skipSeconds ?? Math.max(2, 3 * interval, SKIP_FRACTION_OF_PUMPING * tp);
  if (!(skip >= 0)) throw new EngineError('bad-argument', `skipSeconds ${skip} is negative`, {}, 'skipSeconds >= 0');
  let first = cycle.pumpEnd + 1;
  while (first <= cycle.shutInEnd && time[first] - t0 < skip) first++;
  if (cycle.shutInEnd - first + 1 < MIN_SHUT_IN_SAMPLES) return null;
  const full: Required<ShutInOptions> = {
    skipSeconds: skip,
    alpha: options.alpha ?? 1,
    bins: options.bins ?? 600,
    smoothing: options.smoothing ?? 0.1,
    departureFraction: options.departureFraction ?? 0.03,
  };
  return { t0, tp, first, last: cycle.shutInEnd, noise: pressureNoise(pressure, first, cycle.shutInEnd), options: full };
}

/** Bins in a variable u(t), their -dP/du and its standard error. */
interface Derivatives {
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
 * Bourdet's L-spacing), so the resolution follows the scale of u on short and long
 * shut-ins alike; linear: bins and window evenly in u over its range.
 */
function derivativesIn(variable: Float64Array, pressure: ArrayLike<number>, time: ArrayLike<number>, s: ShutIn, logarithmic: boolean, smoothing: number, binCount: number): Derivatives {
  const p = series(s.last - s.first + 1, (i) => pressure[s.first + i]);
  const t = series(s.last - s.first + 1, (i) => time[s.first + i]);
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


function gDerivatives(time: ArrayLike<number>, pressure: ArrayLike<number>, s: ShutIn): Derivatives {
  const g = series(s.last - s.first + 1, (i) => gFunction((time[s.first + i] - s.t0) / s.tp, s.options.alpha));
  return derivativesIn(g, pressure, time, s, true, s.options.smoothing, s.options.bins);
}

/** Candidate at abscissa u between bins, interpolating time and pressure of the bins. */
function candidateAt(method: string, d: Derivatives, u: number, time: ArrayLike<number>, withG: boolean): ClosureCandidate {
  const { x, y, companion } = d.bins;
  let k = 1;
  while (k < x.length - 1 && x[k] < u) k++;
  const f = x[k] === x[k - 1] ? 0 : Math.min(1, Math.max(0, (u - x[k - 1]) / (x[k] - x[k - 1])));
  const t = companion[k - 1] + f * (companion[k] - companion[k - 1]);
  const pressure = y[k - 1] + f * (y[k] - y[k - 1]);
  const candidate: ClosureCandidate = { method, pressure, time: t, sampleIndex: nearestSample(time, t) };
  if (withG) candidate.g = u;
  return candidate;
}

function nearestSample(time: ArrayLike<number>, t: number): number {
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
 */
function peakBin(d: Derivatives, lo: number, hi: number): number {
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

/** True when the decline is significant: the largest rate stands 5 standard errors above zero. */
function declines(d: Derivatives, k: number): boolean {
  return k >= 0 && d.rate[k] > 5 * d.error[k];
}

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
  const s = prepare(time, pressure, cycle, options);
  if (!s) return null;
  const duration = time[s.last] - s.t0;
  const interval = duration / (s.last - cycle.pumpEnd);
  const window = Math.max(options.windowSeconds ?? Math.min(0.25 * s.tp, 0.1 * duration), 5 * interval);
  let end = s.first;
  while (end < s.last && time[end + 1] - time[s.first] <= window) end++;
  if (end - s.first + 1 < 5) return null;
  const g = series(end - s.first + 1, (i) => gFunction((time[s.first + i] - s.t0) / s.tp, 1));
  const p = series(end - s.first + 1, (i) => pressure[s.first + i]);
  const fit = fitLine(g, p);
  // A held (flat) shut-in, as in a FIT, still has an ISIP; a clearly rising one does not.
  if (fit.slope > 2 * fit.slopeStandardError) return null;
  const value = Math.min(fit.intercept, pressure[cycle.pumpEnd]);
  return { kind: 'isip', pressure: value, time: s.t0, method: 'early-decline-extrapolation', sampleIndex: cycle.pumpEnd };
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
  const s = prepare(time, pressure, cycle, options);
  if (!s) return null;
  const d = gDerivatives(time, pressure, s);
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

/** Bins in one derivative window (ln-width smoothing) after bin k. */
function windowBins(d: Derivatives, k: number, smoothing: number): number {
  let j = k;
  while (j < d.bins.x.length - 1 && Math.log(d.bins.x[j] / d.bins.x[k]) < smoothing) j++;
  return j - k;
}

/**
 * Fewest independent derivative windows the analysed shut-in must span (ln(u_hi / u_lo) of
 * at least this many smoothing widths) before a closure method may pick: a shut-in of a
 * minute or so, stopped long before closure, spans six or fewer (G from 0.11 to 0.21), and a
 * noise wiggle in them must not come out as closure. Eight windows (G growing 2.2-fold) is the
 * engine's own choice (common practice: a closure pick needs the decline well recorded
 * before and after it); a shut-in recorded to twice the closure time spans far more.
 */
const MIN_SPANNED_WINDOWS = 10;
/** Windows of straight decline (from the first two-sided derivative) a tangent departure must follow. */
const MIN_WINDOWS_BEFORE_DEPARTURE = 3;

/** Whether the derivatives from bin lo to hi span `count` windows of ln-width smoothing. */
function spansWindows(d: Derivatives, from: number, to: number, count: number, smoothing: number): boolean {
  return from >= 0 && to > from && d.bins.x[from] > 0 && Math.log(d.bins.x[to] / d.bins.x[from]) >= count * smoothing;
}

/** Median of the finite derivatives within one ln-width `smoothing` either side of bin k. */
function medianAround(d: Derivatives, k: number, smoothing: number): number {
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
function tangentPeakBin(d: Derivatives, smoothing: number): number {
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

function tangentFrom(d: Derivatives, s: ShutIn, time: ArrayLike<number>): ClosureCandidate | null {
  if (d.hi - d.lo + 1 < MIN_VALID_BINS) return null;
  if (!spansWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, s.options.smoothing)) return null;
  const kt = tangentPeakBin(d, s.options.smoothing);
  if (!declines(d, kt)) return null;
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
      if (!spansWindows(d, d.lo, k, MIN_WINDOWS_BEFORE_DEPARTURE, s.options.smoothing)) return null;
      // Crossing of the departure limit between bins k-1 and k.
      const over = d.rate[k - 1] - limit(k - 1);
      const under = limit(k) - d.rate[k];
      const f = over > 0 && over + under > 0 ? over / (over + under) : 0;
      const g = d.bins.x[k - 1] + f * (d.bins.x[k] - d.bins.x[k - 1]);
      return candidateAt('g-dpdg-tangent', d, g, time, true);
    }
  }
  return null;
}

function complianceFrom(d: Derivatives, s: ShutIn, time: ArrayLike<number>): ClosureCandidate | null {
  if (d.hi - d.lo + 1 < MIN_VALID_BINS) return null;
  if (!spansWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, s.options.smoothing)) return null;
  const kt = peakBin(d, d.lo, d.hi);
  if (!declines(d, kt) || kt - d.lo < 6) return null;
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
  return candidateAt('compliance', d, g[h], time, true);
}

function squareRootFrom(time: ArrayLike<number>, pressure: ArrayLike<number>, s: ShutIn): ClosureCandidate | null {
  const root = series(s.last - s.first + 1, (i) => Math.sqrt(time[s.first + i] - s.t0));
  const d = derivativesIn(root, pressure, time, s, true, s.options.smoothing, s.options.bins);
  if (d.hi - d.lo + 1 < MIN_VALID_BINS) return null;
  if (!spansWindows(d, d.lo, d.hi, MIN_SPANNED_WINDOWS, s.options.smoothing)) return null;
  const k = peakBin(d, d.lo, d.hi);
  if (!declines(d, k) || k - d.lo < 2 || d.hi - k < 2) return null;
  // The maximum must lie a whole window past the first two-sided derivative: at the very
  // start it is the rising flank of a decline still straight in sqrt(dt), not closure.
  if (!spansWindows(d, d.lo, k, 1, s.options.smoothing)) return null;
  // The extremum must be a real maximum: the rate falls clearly afterwards, and stays lower
  // over at least one whole derivative window past the peak (independent data). Without
  // that, a short shut-in whose P vs sqrt(dt) is still straight (the rate still rising
  // towards its pre-closure level) would put a noise wiggle near its end forward as closure.
  const span = Math.max(3, windowBins(d, k, s.options.smoothing));
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
  const candidate = candidateAt('sqrt-time', d, vertex, time, false);
  candidate.g = gFunction(vertex * vertex / s.tp, s.options.alpha);
  return candidate;
}

function bilinearFrom(time: ArrayLike<number>, pressure: ArrayLike<number>, s: ShutIn): ClosureCandidate | null {
  // Bins evenly spaced in time: the |dP/dt| versus P plot as the record samples it.
  const elapsed = series(s.last - s.first + 1, (i) => time[s.first + i] - s.t0);
  const d = derivativesIn(elapsed, pressure, time, s, false, 0.08, 100);
  const points: { p: number; r: number; k: number }[] = [];
  for (let k = d.lo; k <= d.hi; k++) {
    if (Number.isFinite(d.rate[k])) points.push({ p: d.bins.y[k], r: d.rate[k], k });
  }
  if (points.length < MIN_VALID_BINS || !declines(d, peakBin(d, d.lo, d.hi))) return null;
  const p = points.map((v) => v.p);
  const r = points.map((v) => v.r);
  let best: { rss: number; p: number; ratio: number } | null = null;
  for (let j = 3; j <= points.length - 3; j++) {
    const early = fitLine(p, r, 0, j - 1);
    const late = fitLine(p, r, j, points.length - 1);
    const rss = early.residualSd ** 2 * (early.n - 2) + late.residualSd ** 2 * (late.n - 2);
    if (Math.abs(early.slope - late.slope) <= 1e-12 * Math.max(Math.abs(early.slope), Math.abs(late.slope))) continue;
    const crossing = (late.intercept - early.intercept) / (early.slope - late.slope);
    const ratio = Math.max(early.slope / late.slope, late.slope / early.slope);
    if (!best || rss < best.rss) best = { rss, p: crossing, ratio };
  }
  if (!best) return null;
  const pMin = Math.min(...p);
  const pMax = Math.max(...p);
  if (!(best.p > pMin && best.p < pMax)) return null;
  // Two regimes must really be there: the slopes of one sign and differing by a factor of
  // BILINEAR_SLOPE_RATIO, and two lines fitting four times better than one (common practice).
  const single = fitLine(p, r);
  if (!(best.ratio >= BILINEAR_SLOPE_RATIO) || !(best.rss <= 0.25 * single.residualSd ** 2 * (single.n - 2))) return null;
  // A gradual change of regime (a leaking shut-in, a slowly closing fracture) is a curve, not
  // a corner: unless two lines fit four times better than one parabola, their intersection is
  // an artefact of the fit. The candidate is kept (its disagreement with the other methods is
  // the quality signal) but marked, so it is never taken as the cycle's closure pick (the
  // engine's own test; ISRM SM asks for a bilinear trend, Haimson & Cornet 2003).
  const gradual = !twoLinesBeatParabola(p, r, best.rss);
  // Time: the first bin whose pressure is at or below the intersection.
  let k = 0;
  while (k < points.length - 1 && points[k].p > best.p) k++;
  const t = d.bins.companion[points[k].k];
  return { method: 'bilinear-dpdt', pressure: best.p, time: t, sampleIndex: nearestSample(time, t), ...(gradual ? { gradual: true } : {}) };
}

/**
 * Two lines must leave at most this fraction of a parabola's residual sum of squares: the same
 * factor of four the lines must beat one straight line by. On the synthetic records the
 * gradual change of a leaking DFIT shut-in leaves 31-52 % (its intersection 1.3-1.5 MPa below
 * closure), tight shut-ins from 2000 m down 1-14 %, but shallow, short-pumped ones up to 55 %
 * with a good intersection: the test is a caution, not a sharp line. As the bilinear method
 * is last in preference, a mark only matters when no other method picks.
 */
const BILINEAR_OVER_PARABOLA = 0.25;

/** Whether two lines (rss given) fit r(p) clearly better than one parabola (4 vs 3 parameters). */
function twoLinesBeatParabola(p: number[], r: number[], twoLineRss: number): boolean {
  const mean = p.reduce((a, v) => a + v, 0) / p.length;
  const centred = p.map((v) => v - mean);
  try {
    const parabola = fitLinearModel([centred, centred.map((v) => v * v)], r, { intercept: true });
    return twoLineRss <= BILINEAR_OVER_PARABOLA * parabola.rss;
  } catch {
    return true; // a degenerate parabola (all p equal) cannot compete with the lines
  }
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
  const s = prepare(time, pressure, cycle, options);
  if (!s) return null;
  if (method === 'sqrt-time') return squareRootFrom(time, pressure, s);
  if (method === 'bilinear-dpdt') return bilinearFrom(time, pressure, s);
  const d = gDerivatives(time, pressure, s);
  return method === 'g-dpdg-tangent' ? tangentFrom(d, s, time) : complianceFrom(d, s, time);
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
  const s = prepare(time, pressure, cycle, options);
  if (!s) return [];
  const d = gDerivatives(time, pressure, s);
  const found = [tangentFrom(d, s, time), complianceFrom(d, s, time), squareRootFrom(time, pressure, s), bilinearFrom(time, pressure, s)];
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
