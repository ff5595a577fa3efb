/**
 * Display decimation for long records. The full record is always kept for
 * computation; these functions choose which sample indices to draw.
 *
 * Both return sorted sample indices (Uint32Array), so every series of a record
 * (time, pressure, rate, volume) can be thinned with the same selection.
 */

/**
 * Largest-Triangle-Three-Buckets downsampling.
 *
 * Method: Steinarsson, S. (2013), "Downsampling Time Series for Visual
 * Representation", MSc thesis, University of Iceland, section 4.2 (LTTB): keep the
 * first and last points; split the rest into `threshold - 2` equal buckets; in
 * each bucket keep the point forming the largest triangle with the point kept in
 * the previous bucket and the average of the next bucket.
 *
 * @param x abscissa (e.g. time, s), non-decreasing, same length as y
 * @param y ordinate (any unit)
 * @param threshold number of points to keep, >= 3; when >= the length, every index is returned
 * @returns sorted indices of the kept samples
 * @example largestTriangleThreeBuckets(t, p, 2000)
 */
export function largestTriangleThreeBuckets(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  threshold: number,
): Uint32Array {
  const n = Math.min(x.length, y.length);
  if (threshold >= n || threshold < 3) return allIndices(n);
  const out = new Uint32Array(threshold);
  const bucketSize = (n - 2) / (threshold - 2);
  let a = 0;
  out[0] = 0;
  for (let i = 0; i < threshold - 2; i++) {
    // Average of the next bucket (the last point for the final bucket).
    const nextStart = Math.floor((i + 1) * bucketSize) + 1;
    const nextEnd = Math.min(Math.floor((i + 2) * bucketSize) + 1, n);
    let avgX = 0;
    let avgY = 0;
    const nextCount = nextEnd - nextStart;
    if (nextCount > 0) {
      for (let j = nextStart; j < nextEnd; j++) { avgX += x[j]; avgY += y[j]; }
      avgX /= nextCount;
      avgY /= nextCount;
    } else {
      avgX = x[n - 1];
      avgY = y[n - 1];
    }
    const start = Math.floor(i * bucketSize) + 1;
    const end = Math.floor((i + 1) * bucketSize) + 1;
    const ax = x[a];
    const ay = y[a];
    let maxArea = -1;
    let chosen = start;
    for (let j = start; j < end; j++) {
      const area = Math.abs((ax - avgX) * (y[j] - ay) - (ax - x[j]) * (avgY - ay));
      if (area > maxArea) { maxArea = area; chosen = j; }
    }
    out[i + 1] = chosen;
    a = chosen;
  }
  out[threshold - 1] = n - 1;
  return out;
}

/**
 * Minimum and maximum per pixel column: splits the x range into `pixels` equal
 * columns and keeps, in each, the first, lowest, highest and last sample (in
 * sample order). Drawn as a line, the result covers exactly the same pixels as
 * the full record, so no spike is lost (common practice for plotting dense
 * signals, e.g. oscilloscope displays).
 *
 * @param x abscissa, non-decreasing, same length as y
 * @param y ordinate
 * @param pixels number of columns (>= 1), usually the plot width in device pixels
 * @returns sorted indices, at most 4 per column
 * @example minMaxPerPixel(t, p, 1200)
 */
export function minMaxPerPixel(x: ArrayLike<number>, y: ArrayLike<number>, pixels: number): Uint32Array {
  const n = Math.min(x.length, y.length);
  if (n === 0) return new Uint32Array(0);
  const columns = Math.max(1, Math.floor(pixels));
  if (n <= columns * 4) return allIndices(n);
  const x0 = x[0];
  const span = x[n - 1] - x0;
  if (!(span > 0)) return Uint32Array.from([0, n - 1]);
  // x is non-decreasing, so each column is one run of samples: find where each run
  // starts (binary search with the same column formula), then scan only y inside it.
  const columnOf = (i: number) => Math.min(columns - 1, Math.floor(((x[i] - x0) / span) * columns));
  const kept = new Uint32Array(columns * 4);
  let count = 0;
  const keep = (k: number) => { if (count === 0 || kept[count - 1] !== k) kept[count++] = k; };
  let first = 0;
  while (first < n) {
    // Last sample of the run that starts at `first`: the first index of a higher column, minus one.
    const col = columnOf(first);
    let a = first + 1;
    let b = n;
    while (a < b) { const m = (a + b) >>> 1; if (columnOf(m) > col) b = m; else a = m + 1; }
    const last = a - 1;
    let lo = first;
    let hi = first;
    let low = y[first];
    let high = low;
    for (let i = first + 1; i <= last; i++) {
      const v = y[i];
      if (v < low) { low = v; lo = i; }
      if (v > high) { high = v; hi = i; }
    }
    // The four in sample order (first <= lo, hi <= last).
    keep(first);
    if (lo <= hi) { keep(lo); keep(hi); } else { keep(hi); keep(lo); }
    keep(last);
    first = last + 1;
  }
  return kept.slice(0, count);
}

/**
 * Chooses a decimation for drawing: min/max per pixel for very dense records
 * (keeps every spike), LTTB otherwise, nothing below `target`.
 */
export function displayIndices(x: ArrayLike<number>, y: ArrayLike<number>, target: number): Uint32Array {
  const n = Math.min(x.length, y.length);
  if (n <= target) return allIndices(n);
  if (n > target * 20) return minMaxPerPixel(x, y, Math.floor(target / 4));
  return withExtremes(largestTriangleThreeBuckets(x, y, Math.max(3, target - 2)), y);
}

/**
 * Adds the samples of the global minimum and maximum of y when a selection lacks them,
 * so a thinned curve still reaches the record's true peak (e.g. the breakdown pressure).
 */
export function withExtremes(indices: Uint32Array, y: ArrayLike<number>): Uint32Array {
  const n = y.length;
  if (n === 0) return indices;
  let lo = 0;
  let hi = 0;
  for (let i = 1; i < n; i++) { if (y[i] < y[lo]) lo = i; if (y[i] > y[hi]) hi = i; }
  const extra = [lo, hi].filter((k) => !indices.includes(k));
  if (extra.length === 0) return indices;
  return Uint32Array.from([...indices, ...extra]).sort();
}

/** Picks the given indices out of a series, as [x, y] pairs for ECharts. */
export function pairsAt(x: ArrayLike<number>, y: ArrayLike<number>, indices: ArrayLike<number>,
  scaleX: (v: number) => number = identity, scaleY: (v: number) => number = identity): [number, number][] {
  const out: [number, number][] = new Array(indices.length);
  for (let i = 0; i < indices.length; i++) {
    const k = indices[i];
    out[i] = [scaleX(x[k]), scaleY(y[k])];
  }
  return out;
}

function identity(v: number): number { return v; }

function allIndices(n: number): Uint32Array {
  const out = new Uint32Array(n);
  for (let i = 0; i < n; i++) out[i] = i;
  return out;
}
