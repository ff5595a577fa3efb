/**
 * Derivatives of noisy records: a sliding local linear regression, Bourdet's L-spacing
 * log derivative, and the log-log diagnostic series of a shut-in (pressure change and
 * its derivative dt dP/d(dt) against elapsed shut-in time).
 *
 * Results feed picks for review by a qualified engineer; they are not a substitute for
 * the operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import { RunningLineFit } from './least-squares';

function checkSeries(x: ArrayLike<number>, y: ArrayLike<number>, start: number, end: number): void {
  if (x.length !== y.length) {
    throw new EngineError('bad-argument', `x has ${x.length} values but y has ${y.length}`, {}, 'x and y of equal length');
  }
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end < start || end >= x.length) {
    throw new EngineError('out-of-range', `range [${start}, ${end}] is outside 0..${x.length - 1}`, {}, 'start <= end inside the arrays');
  }
  for (let i = start; i <= end; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) {
      throw new EngineError('bad-argument', `value at index ${i} is not a finite number`, {}, 'finite values');
    }
    if (i > start && x[i] < x[i - 1]) {
      throw new EngineError('bad-argument', `x decreases at index ${i}`, {}, 'x non-decreasing');
    }
  }
}

/** Local slopes and the spread of x behind each (for slope standard errors). */
export interface LocalSlopes {
  /** dy/dx at each point; NaN where the window holds fewer than 3 points. */
  slope: Float64Array;
  /** Weighted sum of (x - mean x)^2 over each window; the slope's standard error is
   * sigma_y / sqrt(spread) for independent y of standard deviation sigma_y per unit weight. */
  spread: Float64Array;
}

/**
 * Local least-squares slopes with their x spread, the detail behind
 * {@link smoothedDerivative} (same parameters, same method, same errors).
 *
 * @example localSlopes(g, p, 0, g.length - 1, 0.5).slope
 */
export function localSlopes(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  start: number,
  end: number,
  window: number,
  weights?: ArrayLike<number>,
): LocalSlopes {
  checkSeries(x, y, start, end);
  if (!(window > 0) || !Number.isFinite(window)) {
    throw new EngineError('bad-argument', `derivative window ${window} is not positive`, {}, 'a window > 0');
  }
  const w = (i: number) => (weights ? weights[i] : 1);
  const half = window / 2;
  const slope = new Float64Array(end - start + 1);
  const spread = new Float64Array(end - start + 1);
  const fit = new RunningLineFit();
  let left = start; // first index in the window
  let right = start - 1; // last index in the window
  // Centre on the first sample so the running sums see small numbers.
  const x0 = x[start];
  const y0 = y[start];
  for (let i = start; i <= end; i++) {
    while (right < end && x[right + 1] <= x[i] + half) {
      right++;
      fit.add(x[right] - x0, y[right] - y0, w(right));
    }
    while (x[left] < x[i] - half) {
      fit.remove(x[left] - x0, y[left] - y0, w(left));
      left++;
    }
    const ok = fit.n >= 3 && fit.spreadX > 0;
    slope[i - start] = ok ? fit.slope : NaN;
    spread[i - start] = ok ? fit.spreadX : 0;
  }
  return { slope, spread };
}

/**
 * Derivative dy/dx at each sample start..end by local linear regression over the samples
 * whose x lies within +-window/2 of the sample's x (a moving least-squares slope; the
 * window is one-sided near the ends). O(n) by a sliding {@link RunningLineFit}, so usable
 * on 1,000,000-sample records. Local regression derivative: common practice (e.g.
 * Savitzky & Golay 1964, Anal. Chem. 36(8), first-order case).
 *
 * @param x abscissa, non-decreasing, finite (any unit). @param y ordinate, finite.
 * @param start first index (inclusive). @param end last index (inclusive).
 * @param window full window width in x units, > 0.
 * @param weights optional weight per sample (> 0), e.g. sample counts of bin means.
 * @returns Float64Array of length end-start+1 (dy/dx in y-units per x-unit); NaN where the
 *   window holds fewer than 3 points or a single x value.
 * @throws EngineError 'bad-argument' for unequal lengths, non-finite or decreasing x, or
 *   window <= 0; 'out-of-range' for bad indices.
 * @example smoothedDerivative(t, p, 0, t.length - 1, 30) // dP/dt over 30 s windows
 */
export function smoothedDerivative(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  start: number,
  end: number,
  window: number,
  weights?: ArrayLike<number>,
): Float64Array {
  return localSlopes(x, y, start, end, window, weights).slope;
}

/** Averages of a series in bins evenly spaced in x. */
export interface BinnedSeries {
  /** Mean x of each non-empty bin. */
  x: Float64Array;
  /** Mean y of each bin. */
  y: Float64Array;
  /** Mean of the companion series (e.g. time) of each bin; equal to x when none is given. */
  companion: Float64Array;
  /** Samples in each bin. */
  count: Float64Array;
  /** Index of the sample nearest the bin's mean x. */
  index: Int32Array;
  /** Index of the first sample in each bin (the bin holds first .. first + count - 1). */
  first: Int32Array;
}

/**
 * Averages samples start..end of a series in `bins` bins evenly spaced in x between
 * x[start] and x[end] (empty bins are dropped; with fewer samples than bins every sample
 * is its own bin). Reduces noise and makes later picks independent of the record length.
 * Common practice.
 *
 * @param x non-decreasing, finite. @param y finite. @param start, end inclusive indices.
 * @param bins number of bins, integer >= 1. @param companion optional series averaged alike.
 * @throws EngineError as {@link smoothedDerivative}; 'bad-argument' for bins < 1.
 * @example binAverages(g, p, 0, g.length - 1, 300)
 */
export function binAverages(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  start: number,
  end: number,
  bins: number,
  companion?: ArrayLike<number>,
): BinnedSeries {
  checkSeries(x, y, start, end);
  if (!Number.isInteger(bins) || bins < 1) throw new EngineError('bad-argument', `bin count ${bins} is not a positive integer`, {}, 'bins >= 1');
  const c = companion ?? x;
  const lo = x[start];
  const span = x[end] - lo;
  const xs: number[] = [];
  const ys: number[] = [];
  const cs: number[] = [];
  const counts: number[] = [];
  const indices: number[] = [];
  const firsts: number[] = [];
  let i = start;
  while (i <= end) {
    const b = span > 0 && end - start + 1 > bins ? Math.min(bins - 1, Math.floor(((x[i] - lo) / span) * bins)) : i;
    let sx = 0;
    let sy = 0;
    let sc = 0;
    let n = 0;
    const first = i;
    while (i <= end && (span > 0 && end - start + 1 > bins ? Math.min(bins - 1, Math.floor(((x[i] - lo) / span) * bins)) : i) === b) {
      sx += x[i] - lo;
      sy += y[i];
      sc += c[i];
      n++;
      i++;
    }
    const meanX = sx / n + lo;
    let best = first;
    for (let k = first; k < i; k++) if (Math.abs(x[k] - meanX) < Math.abs(x[best] - meanX)) best = k;
    xs.push(meanX);
    ys.push(sy / n);
    cs.push(sc / n);
    counts.push(n);
    indices.push(best);
    firsts.push(first);
  }
  return {
    x: Float64Array.from(xs),
    y: Float64Array.from(ys),
    companion: Float64Array.from(cs),
    count: Float64Array.from(counts),
    index: Int32Array.from(indices),
    first: Int32Array.from(firsts),
  };
}

/**
 * Local slopes dy/du of binned data: at each bin, the least-squares slope of bin-mean y
 * against `u` (bin means of the variable itself), weighted by the bin counts, over the bins
 * whose position bins.x lies within +-halfWidth of the bin's (bins.x may be u or ln u),
 * widened one bin on each side at a time until the window holds minSamples samples, so
 * sparse bins are not differentiated from a handful of samples. Regressing on u (not on
 * the position) keeps the slope unbiased for y linear in u however wide the window.
 * Moving least squares: common practice.
 *
 * @param bins output of {@link binAverages} (x non-decreasing). @param u bin means of the
 *   regression variable, same length. @param halfWidth in bins.x units, >= 0.
 * @param minSamples fewest samples per window, >= 0.
 * @returns slope (NaN where a window has fewer than 3 bins or one u) and the weighted
 *   spread sum w (u - mean u)^2 behind each (slope standard error = sigma / sqrt(spread)).
 * @throws never (caller validates).
 * @example binnedSlopes(bins, bins.x, 0.05, 40).slope
 */
export function binnedSlopes(bins: BinnedSeries, u: ArrayLike<number>, halfWidth: number, minSamples: number): LocalSlopes {
  const n = bins.x.length;
  const slope = new Float64Array(n).fill(NaN);
  const spread = new Float64Array(n);
  let a = 0;
  let b = -1;
  for (let k = 0; k < n; k++) {
    while (a < k && bins.x[k] - bins.x[a] > halfWidth) a++;
    if (b < k) b = k;
    while (b + 1 < n && bins.x[b + 1] - bins.x[k] <= halfWidth) b++;
    let lo = a;
    let hi = b;
    let count = 0;
    for (let j = lo; j <= hi; j++) count += bins.count[j];
    while (count < minSamples && (lo > 0 || hi < n - 1)) {
      if (lo > 0) count += bins.count[--lo];
      if (hi < n - 1) count += bins.count[++hi];
    }
    if (hi - lo + 1 < 3) continue;
    let w = 0;
    let mx = 0;
    let my = 0;
    for (let j = lo; j <= hi; j++) {
      w += bins.count[j];
      mx += bins.count[j] * u[j];
      my += bins.count[j] * bins.y[j];
    }
    mx /= w;
    my /= w;
    let sxx = 0;
    let sxy = 0;
    for (let j = lo; j <= hi; j++) {
      const dx = u[j] - mx;
      sxx += bins.count[j] * dx * dx;
      sxy += bins.count[j] * dx * (bins.y[j] - my);
    }
    if (sxx > 0) {
      slope[k] = sxy / sxx;
      spread[k] = sxx;
    }
  }
  return { slope, spread };
}

/**
 * Bourdet's log derivative dP/d ln(dt) = dt dP/d(dt) with differentiation interval L
 * (Bourdet, Ayoub & Pirard 1989, SPE Form. Eval. 4(2)): at each point i, the left point j
 * is the nearest with ln dt_i - ln dt_j >= L and the right point k the nearest with
 * ln dt_k - ln dt_i >= L; the derivative is the slopes' average weighted by the opposite
 * spacings, [m_l dX_r + m_r dX_l] / (dX_l + dX_r), X = ln dt. L here is in natural-log
 * units (0.1-0.5 typical; that range is from memory).
 *
 * @param dt elapsed time since the event, s, strictly increasing, > 0.
 * @param p pressure (or pressure change), Pa, finite.
 * @param lSpacing L, natural-log units, >= 0 (0 uses the adjacent points).
 * @returns Float64Array, same length, in Pa; NaN where a side has no point at distance L.
 * @throws EngineError 'bad-argument' for unequal lengths, dt <= 0, non-increasing dt,
 *   non-finite values or negative L.
 * @example bourdetDerivative(dt, deltaP, 0.2)
 */
export function bourdetDerivative(dt: ArrayLike<number>, p: ArrayLike<number>, lSpacing: number): Float64Array {
  const n = dt.length;
  if (p.length !== n) throw new EngineError('bad-argument', `dt has ${n} values but p has ${p.length}`, {}, 'equal lengths');
  if (!(lSpacing >= 0) || !Number.isFinite(lSpacing)) {
    throw new EngineError('bad-argument', `L-spacing ${lSpacing} is not a number >= 0`, {}, 'L >= 0 (natural-log units)');
  }
  const logT = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    if (!(dt[i] > 0) || !Number.isFinite(dt[i]) || !Number.isFinite(p[i])) {
      throw new EngineError('bad-argument', `value at index ${i} is not usable (dt must be > 0, both finite)`, {}, 'dt > 0 and finite p');
    }
    logT[i] = Math.log(dt[i]);
    if (i > 0 && !(logT[i] > logT[i - 1])) {
      throw new EngineError('bad-argument', `dt does not increase at index ${i}`, {}, 'strictly increasing dt');
    }
  }
  const out = new Float64Array(n).fill(NaN);
  const spacing = Math.max(lSpacing, 0);
  let j = -1; // left partner: largest index with logT[i] - logT[j] >= L
  let k = 0; // right partner: smallest index > i with logT[k] - logT[i] >= L
  for (let i = 0; i < n; i++) {
    while (j + 1 < i && logT[i] - logT[j + 1] >= spacing) j++;
    if (k <= i) k = i + 1;
    while (k < n && logT[k] - logT[i] < spacing) k++;
    if (j < 0 || k >= n) continue;
    const dxl = logT[i] - logT[j];
    const dxr = logT[k] - logT[i];
    const ml = (p[i] - p[j]) / dxl;
    const mr = (p[k] - p[i]) / dxr;
    out[i] = (ml * dxr + mr * dxl) / (dxl + dxr);
  }
  return out;
}

/** Series of the shut-in log-log diagnostic plot. */
export interface LogLogDiagnostic {
  /** Elapsed shut-in time dt, s (> 0), one per log-spaced bin. */
  elapsed: Float64Array;
  /** Pressure change P(shut-in) - P(t), Pa (positive for a decline). */
  pressureChange: Float64Array;
  /** Bourdet derivative dt d(pressureChange)/d(dt), Pa; NaN at the ends. */
  derivative: Float64Array;
  /** Index in the record of the sample nearest each point. */
  sampleIndex: Int32Array;
}

/**
 * Log-log diagnostic of a shut-in: pressure change dP = P(t_s) - P(t) and its Bourdet
 * derivative dt d(dP)/d(dt) against dt = t - t_s (Bourdet, Ayoub & Pirard 1989). Before
 * closure the derivative runs at slope near +1/2; after closure -1/2 (linear flow) then -1
 * (radial flow) on the derivative of the pressure difference to reservoir pressure
 * (METHODS.md). Samples are first averaged in log-spaced bins (pointsPerDecade) so noise
 * does not dominate the L-spacing differences and the series stays small for plotting.
 *
 * @param time elapsed time, s, increasing. @param pressure downhole pressure, Pa.
 * @param shutInIndex index of the shut-in instant t_s.
 * @param endIndex last shut-in sample (inclusive).
 * @param options.lSpacing L in natural-log units, default 0.2.
 * @param options.pointsPerDecade bins per decade of dt, default 20 (1..1000).
 * @param options.referencePressure pressure dP is measured from, Pa; default the pressure
 *   at shutInIndex (pass the ISIP to leave the friction drop out).
 * @returns the series, possibly empty when the shut-in has no sample after t_s.
 * @throws EngineError 'out-of-range' for bad indices; 'bad-argument' for bad options or
 *   non-finite samples.
 * @example logLogDiagnostic(time, p, cycle.pumpEnd, cycle.shutInEnd)
 */
export function logLogDiagnostic(
  time: ArrayLike<number>,
  pressure: ArrayLike<number>,
  shutInIndex: number,
  endIndex: number,
  options: { lSpacing?: number; pointsPerDecade?: number; referencePressure?: number } = {},
): LogLogDiagnostic {
  checkSeries(time, pressure, shutInIndex, endIndex);
  const perDecade = options.pointsPerDecade ?? 20;
  if (!(perDecade >= 1 && perDecade <= 1000)) {
    throw new EngineError('bad-argument', `points per decade ${perDecade} is outside 1..1000`, {}, '1 to 1000');
  }
  const t0 = time[shutInIndex];
  const p0 = options.referencePressure ?? pressure[shutInIndex];
  if (!Number.isFinite(p0)) throw new EngineError('bad-argument', `reference pressure ${p0} is not a number`, {}, 'a finite pressure in Pa');
  const binWidth = Math.LN10 / perDecade;
  const elapsed: number[] = [];
  const change: number[] = [];
  const index: number[] = [];
  let bin = Number.NaN;
  let sumLog = 0;
  let sumP = 0;
  let count = 0;
  let first = -1;
  const flush = () => {
    if (count === 0) return;
    const meanLog = sumLog / count;
    elapsed.push(Math.exp(meanLog));
    change.push(p0 - sumP / count);
    // Nearest sample to the bin's mean time, searched inside the bin.
    let best = first;
    const target = Math.exp(meanLog) + t0;
    for (let i = first; i < first + count; i++) if (Math.abs(time[i] - target) < Math.abs(time[best] - target)) best = i;
    index.push(best);
  };
  for (let i = shutInIndex + 1; i <= endIndex; i++) {
    const dt = time[i] - t0;
    if (!(dt > 0)) continue;
    const b = Math.floor(Math.log(dt) / binWidth);
    if (b !== bin) {
      flush();
      bin = b;
      sumLog = sumP = count = 0;
      first = i;
    }
    sumLog += Math.log(dt);
    sumP += pressure[i];
    count++;
  }
  flush();
  const elapsedArray = Float64Array.from(elapsed);
  const changeArray = Float64Array.from(change);
  return {
    elapsed: elapsedArray,
    pressureChange: changeArray,
    derivative: bourdetDerivative(elapsedArray, changeArray, options.lSpacing ?? 0.2),
    sampleIndex: Int32Array.from(index),
  };
}
