/**
 * Robust summary statistics on sample arrays (medians, quantiles, noise level), in
 * linear time so they stay usable on records of 1,000,000 samples.
 */

/**
 * The q-quantile (0..1) of values[start..end] (inclusive) by Hoare's selection
 * algorithm (Hoare 1961, CACM 4(7), "FIND"), expected O(n), on a copy (the input is
 * not changed). Non-finite values are skipped. Nearest-rank definition, no interpolation.
 *
 * @param values any unit. @param q quantile in [0, 1]. @param start first index. @param end last index.
 * @returns the quantile, or NaN when the range holds no finite value.
 * @example quantileOf(Float64Array.of(3, 1, 2), 0.5) // 2
 */
export function quantileOf(values: ArrayLike<number>, q: number, start = 0, end = values.length - 1): number {
  const copy = new Float64Array(Math.max(0, end - start + 1));
  let n = 0;
  for (let i = start; i <= end; i++) {
    const v = values[i];
    if (Number.isFinite(v)) copy[n++] = v;
  }
  if (n === 0) return NaN;
  const k = Math.min(n - 1, Math.max(0, Math.round(q * (n - 1))));
  return selectInPlace(copy, n, k);
}

/**
 * The median of values[start..end] (inclusive); see {@link quantileOf}.
 * @example medianOf([5, 1, 4]) // 4
 */
export function medianOf(values: ArrayLike<number>, start = 0, end = values.length - 1): number {
  return quantileOf(values, 0.5, start, end);
}

/** k-th smallest of a[0..n-1] (0-based), rearranging a. Median-of-three pivots, deterministic. */
function selectInPlace(a: Float64Array, n: number, k: number): number {
  let lo = 0;
  let hi = n - 1;
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // Median of three as the pivot value.
    const x = a[lo];
    const y = a[mid];
    const z = a[hi];
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

/**
 * Standard deviation of the white noise on a smooth signal, from the median absolute
 * second difference: for white noise of SD s, d2 = y[i+1] - 2 y[i] + y[i-1] has SD
 * s sqrt(6), and a Gaussian's SD is 1.4826 x its median absolute value (common practice;
 * the difference-based variance estimate is von Neumann's, Ann. Math. Stat. 12, 1941).
 * Smooth trends (ramps, gentle curvature) hardly contribute at field sampling rates.
 *
 * @param values signal, any unit. @param start first index. @param end last index (inclusive).
 * @param limit at most this many second differences are used, spread evenly (default 50,000).
 * @returns noise SD in the signal's unit; 0 for fewer than 3 samples or a noiseless signal.
 * @example noiseStandardDeviation(Float64Array.of(1, 2, 3, 4)) // 0
 */
export function noiseStandardDeviation(values: ArrayLike<number>, start = 0, end = values.length - 1, limit = 50000): number {
  const n = end - start + 1;
  if (n < 3) return 0;
  // At most `limit` second differences, evenly spread (each from three consecutive samples).
  const stride = Math.max(1, Math.floor((n - 2) / limit));
  const d2 = new Float64Array(Math.ceil((n - 2) / stride));
  let k = 0;
  for (let i = start + 1; i < end; i += stride) d2[k++] = Math.abs(values[i + 1] - 2 * values[i] + values[i - 1]);
  const mad = quantileOf(d2, 0.5, 0, k - 1);
  return Number.isFinite(mad) ? (1.4826 * mad) / Math.sqrt(6) : 0;
}

/**
 * The smallest non-zero step between consecutive samples (the recording resolution of a
 * quantised gauge), looking at at most `limit` samples spread over the range.
 *
 * @returns the step in the signal's unit, or 0 when every sample is equal.
 * @example recordingStep(Float64Array.of(0, 0.5, 1.5, 1.5)) // 0.5
 */
export function recordingStep(values: ArrayLike<number>, start = 0, end = values.length - 1, limit = 20000): number {
  const n = end - start;
  if (n < 1) return 0;
  const stride = Math.max(1, Math.floor(n / limit));
  let smallest = Infinity;
  for (let i = start; i < end; i += stride) {
    const d = Math.abs(values[i + 1] - values[i]);
    if (d > 0 && d < smallest) smallest = d;
  }
  return Number.isFinite(smallest) ? smallest : 0;
}

/**
 * The quantisation step of a gauge that rounds its readings, from second differences:
 * for readings k_i x step the second differences are whole multiples of the step, and
 * with any noise the smallest non-zero one is the step itself; on an unrounded signal
 * the smallest non-zero second difference is a small fraction of the noise, so the result
 * is harmless as a noise floor. Unlike {@link recordingStep} it does not mistake the rise
 * of a steep, sparsely sampled ramp (every first difference large) for a resolution.
 * Differences below 1e-9 of the largest |value| are floating-point rounding and ignored.
 *
 * @param values signal, any unit. @param start first index. @param end last index (inclusive).
 * @param limit at most this many second differences are looked at, spread evenly (default 20,000).
 * @returns the step in the signal's unit, or 0 for fewer than 3 samples or a straight signal.
 * @example quantisationStep(Float64Array.of(0, 10, 20, 40, 50)) // 10
 */
export function quantisationStep(values: ArrayLike<number>, start = 0, end = values.length - 1, limit = 20000): number {
  const n = end - start + 1;
  if (n < 3) return 0;
  let scale = 0;
  for (let i = start; i <= end; i++) scale = Math.max(scale, Math.abs(values[i]));
  const ignore = 1e-9 * scale;
  const stride = Math.max(1, Math.floor((n - 2) / limit));
  let smallest = Infinity;
  for (let i = start + 1; i < end; i += stride) {
    const d = Math.abs(values[i + 1] - 2 * values[i] + values[i - 1]);
    if (d > ignore && d < smallest) smallest = d;
  }
  return Number.isFinite(smallest) ? smallest : 0;
}
