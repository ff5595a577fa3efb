/**
 * Rate and cumulative volume derived from each other when a file gives only one, and gaps
 * (blank optional cells) filled. Volume from rate: trapezoidal rule. Rate from volume: a
 * central difference over a window of about 5 s either side (at least one sample), which
 * averages out the quantisation of volume counters; one-sided at the ends (numerical
 * differentiation, e.g. Press et al., Numerical Recipes, 3rd ed., 5.7; window: common practice).
 */

/**
 * Cumulative volume by the trapezoidal rule, starting at 0.
 *
 * @param time s, increasing
 * @param rate m3/s
 * @returns volume, m3
 * @example volumeFromRate(new Float64Array([0, 10]), new Float64Array([1, 1])) // [0, 10]
 */
export function volumeFromRate(time: Float64Array, rate: Float64Array): Float64Array {
  const volume = new Float64Array(time.length);
  for (let i = 1; i < time.length; i++) {
    volume[i] = volume[i - 1] + 0.5 * (rate[i] + rate[i - 1]) * (time[i] - time[i - 1]);
  }
  return volume;
}

/**
 * Half-width (in samples) of the differentiation window: about `halfSpanSeconds` at the
 * median sample interval, between 1 and 50 samples.
 *
 * @param time s, increasing
 * @param halfSpanSeconds wanted half-span, s (default 5)
 * @returns half-width in samples
 * @example differenceHalfWidth(new Float64Array([0, 1, 2, 3]), 5) // 3
 */
export function differenceHalfWidth(time: Float64Array, halfSpanSeconds = 5): number {
  if (time.length < 3) return 1;
  const step = Math.max(1, Math.floor(time.length / 2001));
  const intervals: number[] = [];
  for (let i = step; i < time.length; i += step) intervals.push((time[i] - time[i - step]) / step);
  intervals.sort((a, b) => a - b);
  const median = intervals[intervals.length >> 1];
  const k = median > 0 ? Math.round(halfSpanSeconds / median) : 1;
  return Math.min(50, Math.max(1, k, 0) | 0);
}

/**
 * Rate from cumulative volume: (V[i+k] - V[i-k]) / (t[i+k] - t[i-k]), the window clipped at
 * the ends of the record.
 *
 * @param time s, increasing
 * @param volume m3
 * @param halfWidth window half-width in samples (see differenceHalfWidth)
 * @returns rate, m3/s (zeros for fewer than two samples)
 * @example rateFromVolume(new Float64Array([0, 1, 2]), new Float64Array([0, 2, 4]), 1) // [2, 2, 2]
 */
export function rateFromVolume(time: Float64Array, volume: Float64Array, halfWidth: number): Float64Array {
  const n = time.length;
  const rate = new Float64Array(n);
  if (n < 2) return rate;
  for (let i = 0; i < n; i++) {
    const lo = Math.max(0, i - halfWidth);
    const hi = Math.min(n - 1, i + halfWidth);
    rate[i] = (volume[hi] - volume[lo]) / (time[hi] - time[lo]);
  }
  return rate;
}

/**
 * Fills NaN gaps by linear interpolation in time; leading and trailing gaps take the nearest
 * value. Modifies in place.
 *
 * @param time s, increasing
 * @param values samples with NaN gaps
 * @returns number of samples filled (-1 when every sample is NaN, nothing changed)
 * @example fillGaps(new Float64Array([0, 1, 2]), new Float64Array([0, NaN, 2])) // 1, values [0, 1, 2]
 */
export function fillGaps(time: Float64Array, values: Float64Array): number {
  let filled = 0;
  let previous = -1;
  for (let i = 0; i < values.length; i++) {
    if (values[i] !== values[i]) continue;
    if (i - previous > 1) filled += fillRun(time, values, previous, i);
    previous = i;
  }
  if (previous < 0) return values.length === 0 ? 0 : -1;
  for (let i = previous + 1; i < values.length; i++, filled++) values[i] = values[previous];
  return filled;
}

/** Fills values strictly between known indices a (or -1) and b. */
function fillRun(time: Float64Array, values: Float64Array, a: number, b: number): number {
  for (let j = a + 1; j < b; j++) {
    values[j] = a < 0 ? values[b] : values[a] + ((values[b] - values[a]) * (time[j] - time[a])) / (time[b] - time[a]);
  }
  return b - a - 1;
}

/**
 * Relative mismatch between a given volume and the integral of a given rate at the end of
 * the record: |V_end - V_0 - integral| / max(|integral|, tiny). Used to warn when a file's two
 * columns disagree.
 *
 * @param time s
 * @param rate m3/s
 * @param volume m3
 * @returns relative mismatch (0 when both are zero)
 * @example rateVolumeMismatch(t, q, v) // 0.01 for 1 %
 */
export function rateVolumeMismatch(time: Float64Array, rate: Float64Array, volume: Float64Array): number {
  const n = time.length;
  if (n < 2) return 0;
  let integral = 0;
  for (let i = 1; i < n; i++) integral += 0.5 * (rate[i] + rate[i - 1]) * (time[i] - time[i - 1]);
  const change = volume[n - 1] - volume[0];
  const scale = Math.max(Math.abs(integral), Math.abs(change));
  return scale > 1e-12 ? Math.abs(change - integral) / scale : 0;
}
