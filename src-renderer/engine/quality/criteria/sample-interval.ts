/**
 * The median sample interval of a record, exactly as sorting all n - 1 intervals and
 * taking the middle one (the mean of the middle two for an even count) would give it, but
 * without a sorted copy of the whole record: a long record is bracketed by selection.
 *
 * Method: sample selection (Floyd and Rivest, "Expected time bounds for selection",
 * Communications of the ACM 18(3), 1975): a strided sample of the intervals is sorted and
 * two of its values, a few standard errors either side of the median rank, bracket the
 * median; one pass over the record counts the intervals below the lower bracket and equal
 * to either bracket and keeps only those strictly between; the ranks wanted are then read
 * from that small set, sorted. When the brackets miss (an unusual record), when the set
 * between them would be large, or when any interval is NaN or zero (where the order of
 * -0 and +0 matters), the full copy is sorted as before, so the result is always the same.
 */

/** Records shorter than this are sorted whole (cheap). */
const SORT_WHOLE_BELOW = 8192;
/** Size of the strided sample. */
const SAMPLE_SIZE = 2048;

/**
 * Median of the intervals time[i] - time[i - 1].
 *
 * @param time sample times, s (any order; a record's times increase), at least 2 values
 * @returns the median interval, s (NaN for fewer than 2 samples)
 * @throws nothing
 * @example medianSampleInterval(new Float64Array([0, 1, 2, 4])) // 1
 */
export function medianSampleInterval(time: ArrayLike<number>): number {
  const m = time.length - 1;
  if (m < 1) return NaN;
  if (m >= SORT_WHOLE_BELOW) {
    const bracketed = bracketedMedian(time, m);
    if (bracketed !== null) return bracketed;
  }
  return sortedMedian(time, m);
}

/** The median from a sorted copy of all intervals (the reference method). */
function sortedMedian(time: ArrayLike<number>, m: number): number {
  const intervals = new Float64Array(m);
  for (let i = 1; i <= m; i++) intervals[i - 1] = time[i] - time[i - 1];
  intervals.sort();
  const mid = Math.floor(m / 2);
  return m % 2 ? intervals[mid] : (intervals[mid - 1] + intervals[mid]) / 2;
}

/** The median by bracketing, or null when the brackets do not settle it exactly. */
function bracketedMedian(time: ArrayLike<number>, m: number): number | null {
  const mid = Math.floor(m / 2);
  const rankLow = m % 2 ? mid : mid - 1;
  const rankHigh = mid;
  const stride = Math.floor(m / SAMPLE_SIZE);
  const sample = new Float64Array(SAMPLE_SIZE);
  for (let k = 0; k < SAMPLE_SIZE; k++) {
    const i = 1 + k * stride;
    sample[k] = time[i] - time[i - 1];
  }
  sample.sort();
  // about four standard errors of the sample rank either side of the median
  const margin = Math.ceil(4 * Math.sqrt(SAMPLE_SIZE) / 2);
  const lo = sample[Math.max(0, SAMPLE_SIZE / 2 - margin)];
  const hi = sample[Math.min(SAMPLE_SIZE - 1, SAMPLE_SIZE / 2 + margin)];
  if (!(lo <= hi) || lo === 0 || hi === 0) return null;
  const capacity = Math.max(4096, m >> 2);
  const inside = new Float64Array(capacity);
  let kept = 0;
  let below = 0;
  let equalLow = 0;
  let equalHigh = 0;
  let above = 0;
  for (let i = 1; i <= m; i++) {
    const v = time[i] - time[i - 1];
    if (v < lo) below++;
    else if (v > hi) above++;
    else if (v === lo) equalLow++;
    else if (v === hi) equalHigh++;
    else {
      if (kept === capacity) return null;
      inside[kept++] = v;
    }
  }
  if (below + equalLow + kept + equalHigh + above !== m) return null; // NaN intervals
  const between = inside.subarray(0, kept).sort();
  const at = (rank: number): number | null => {
    let r = rank - below;
    if (r < 0) return null;
    if (r < equalLow) return lo;
    r -= equalLow;
    if (r < kept) {
      const v = between[r];
      return v === 0 ? null : v;
    }
    r -= kept;
    return r < equalHigh ? hi : null;
  };
  const a = at(rankLow);
  const b = at(rankHigh);
  if (a === null || b === null) return null;
  return m % 2 ? b : (a + b) / 2;
}
