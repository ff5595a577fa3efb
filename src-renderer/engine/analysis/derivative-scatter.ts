/**
 * The real scatter of a binned derivative, as a floor of its stated standard errors
 * (shut-in.ts). Pure array code, O(bins).
 */

/**
 * Widens the derivative standard errors (in place) to the scatter the derivative really
 * shows. The errors from the noise assume independent samples of a smooth decline; short
 * windows (12 samples on a shut-in of a few minutes) and correlated or filtered noise scatter
 * more. The scatter is measured on second differences of derivatives one full window apart
 * (no shared data, and a steady trend of the derivative cancels): SD = 1.4826 x median
 * |r[k - w] - 2 r[k] + r[k + w]| / sqrt 6 (robust, so the bend at closure, a minority of the
 * triples, hardly counts). When that exceeds the median stated error, every error is
 * multiplied by their ratio; never made smaller. Common practice (a residual-based error when
 * the model error is in doubt), the engine's own rule. `x` holds the binning variable (ln u
 * for logarithmic bins), `window` its derivative width. O(bins).
 *
 * @param rate derivative per bin (any unit); NaN where undefined. @param error its standard
 *   errors (same unit), widened in place. @param x bin abscissa, increasing. @param lo first
 *   and @param hi last bin with a two-sided window. @param window derivative width in x (> 0).
 * @returns nothing; throws nothing (too few finite bins: errors unchanged).
 * @example scaleErrorsToScatter(rate, error, lnG, 3, 590, 0.1)
 */
export function scaleErrorsToScatter(rate: Float64Array, error: Float64Array, x: Float64Array, lo: number, hi: number, window: number): void {
  const differences: number[] = [];
  const stated: number[] = [];
  let before = lo;
  let after = lo;
  for (let k = lo; k <= hi; k++) {
    if (Number.isFinite(error[k]) && Number.isFinite(rate[k])) stated.push(error[k]);
    while (before + 1 < k && x[k] - x[before + 1] >= window) before++;
    while (after <= hi && x[after] - x[k] < window) after++;
    if (after > hi || x[k] - x[before] < window) continue;
    const v = rate[before] - 2 * rate[k] + rate[after];
    if (Number.isFinite(v)) differences.push(Math.abs(v));
  }
  if (differences.length < 5 || stated.length < 5) return;
  const scatter = (1.4826 * medianOfNumbers(differences)) / Math.sqrt(6);
  const typical = medianOfNumbers(stated);
  if (!(typical > 0) || !(scatter > typical)) return;
  const factor = scatter / typical;
  for (let k = 0; k < error.length; k++) error[k] *= factor;
}

/**
 * Median of a short list of numbers (upper median for an even count), by a sorted copy (bins
 * are at most a few hundred). @param values finite numbers, not empty. @returns the median;
 * throws nothing. @example medianOfNumbers([3, 1, 2]) // 2
 */
export function medianOfNumbers(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}
