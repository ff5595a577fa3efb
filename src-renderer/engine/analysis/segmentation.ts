/**
 * Cycle segmentation: splits a record into pumping periods, each followed by its
 * shut-in (and, when the rate turns negative, a flagged flow-back).
 *
 * Method (the engine's own, common practice thresholds):
 * 1. Pump rate per sample: the rate column when it was read from the file; when it was
 *    derived from the volume column, the volume increment over a short centred window
 *    (noisy differentiated rates then do not split cycles).
 * 2. Pumping when the rate exceeds `thresholdFraction` (default 5 %) of the record's
 *    sustained maximum rate (the highest rate held for 5 consecutive samples, so single
 *    spikes do not count); flow-back below minus that threshold.
 * 3. Non-pumping gaps shorter than `dropoutDuration` (default 10 s) or of at most
 *    `dropoutSamples` (default 2) samples are rate dropouts, bridged into the pumping period.
 * 4. Pumping runs of fewer than 3 samples that carry less than 1 % of the pumped volume
 *    are rate spikes and are dropped.
 * Several rate levels within one pumping period (a step-rate test) stay one cycle.
 */
import { EngineError } from '../errors';
import type { Cycle } from '../result';

/** Tuning of {@link segmentCycles}. */
export interface SegmentationOptions {
  /** Pumping threshold as a fraction of the high rate level, (0, 1). Default 0.05. */
  thresholdFraction?: number;
  /** Longest rate dropout bridged inside a pumping period, s. Default 10. */
  dropoutDuration?: number;
  /** Gaps of at most this many samples are always bridged. Default 2. */
  dropoutSamples?: number;
  /** Treat `rate` as derived from `volume` (use volume increments). Default false. */
  rateDerived?: boolean;
}

/** Inputs of {@link segmentCycles}: equal-length SI arrays. */
export interface SegmentationInput {
  /** Elapsed time, s, strictly increasing. */
  time: Float64Array;
  /** Pump rate, m3/s. */
  rate: Float64Array;
  /** Cumulative pumped volume, m3. */
  volume: Float64Array;
}

/**
 * Splits a record into cycles (pumping period then shut-in), 1-based, in time order.
 *
 * @param input time (s), rate (m3/s) and cumulative volume (m3), equal lengths, >= 2 samples.
 * @param options thresholds; see the module comment.
 * @returns the cycles; an empty array when the record never pumps.
 * @throws EngineError 'bad-argument' for unequal lengths; 'too-few-points' for < 2 samples.
 * @example segmentCycles({ time, rate, volume }).length // 2 for a two-cycle XLOT
 */
export function segmentCycles(input: SegmentationInput, options: SegmentationOptions = {}): Cycle[] {
  const { time, volume } = input;
  const n = time.length;
  if (input.rate.length !== n || volume.length !== n) {
    throw new EngineError('bad-argument', `time, rate and volume differ in length (${n}, ${input.rate.length}, ${volume.length})`, {}, 'arrays of equal length');
  }
  if (n < 2) throw new EngineError('too-few-points', `a record needs at least 2 samples to segment, got ${n}`, {}, '2 or more samples');
  const thresholdFraction = options.thresholdFraction ?? 0.05;
  const dropoutDuration = options.dropoutDuration ?? 10;
  const dropoutSamples = options.dropoutSamples ?? 2;

  const rate = options.rateDerived ? rateFromVolume(time, volume) : input.rate;
  const high = sustainedMaximum(rate, Math.min(5, n));
  if (!(high > 0)) return [];
  const threshold = thresholdFraction * high;

  // 1 = pumping, -1 = flow-back, 0 = neither.
  const state = new Int8Array(n);
  for (let i = 0; i < n; i++) {
    const q = rate[i];
    state[i] = q > threshold ? 1 : q < -threshold ? -1 : 0;
  }

  const runs = pumpingRuns(state);
  bridgeDropouts(runs, time, dropoutDuration, dropoutSamples);
  const totalVolume = Math.max(0, volume[n - 1] - volume[0]);
  const kept = runs.filter((r) => r.end - r.start + 1 >= 3 || volumeOf(volume, r.start, r.end) > 0.01 * totalVolume);

  const cycles: Cycle[] = [];
  for (let c = 0; c < kept.length; c++) {
    const { start, end } = kept[c];
    const nextStart = c + 1 < kept.length ? kept[c + 1].start : n;
    let shutInEnd = nextStart - 1;
    let flowBack = false;
    for (let i = end + 1; i < nextStart; i++) {
      if (state[i] === -1) {
        flowBack = true;
        shutInEnd = Math.max(end, i - 1);
        break;
      }
    }
    let rateSum = 0;
    for (let i = start; i <= end; i++) rateSum += rate[i];
    cycles.push({
      index: c + 1,
      pumpStart: start,
      pumpEnd: end,
      shutInEnd,
      meanRate: rateSum / (end - start + 1),
      volumePumped: volumeOf(volume, start, end),
      flowBack,
    });
  }
  return cycles;
}

interface Run {
  start: number;
  end: number;
}

function pumpingRuns(state: Int8Array): Run[] {
  const runs: Run[] = [];
  let start = -1;
  for (let i = 0; i < state.length; i++) {
    if (state[i] === 1) {
      if (start < 0) start = i;
    } else if (start >= 0) {
      runs.push({ start, end: i - 1 });
      start = -1;
    }
  }
  if (start >= 0) runs.push({ start, end: state.length - 1 });
  return runs;
}

/** Merges consecutive runs separated by a short gap (in place). */
function bridgeDropouts(runs: Run[], time: Float64Array, duration: number, samples: number): void {
  for (let i = runs.length - 2; i >= 0; i--) {
    const gapSamples = runs[i + 1].start - runs[i].end - 1;
    const gapDuration = time[runs[i + 1].start] - time[runs[i].end];
    if (gapSamples <= samples || gapDuration <= duration) {
      runs[i].end = runs[i + 1].end;
      runs.splice(i + 1, 1);
    }
  }
}

/** Volume pumped between the sample before `start` (the cycle's starting level) and `end`. */
function volumeOf(volume: Float64Array, start: number, end: number): number {
  const base = start > 0 ? volume[start - 1] : volume[start];
  return Math.max(0, volume[end] - base);
}

/**
 * Rate from volume increments over a centred window of about 5 samples or 10 s,
 * whichever is longer, m3/s.
 */
function rateFromVolume(time: Float64Array, volume: Float64Array): Float64Array {
  const n = time.length;
  const out = new Float64Array(n);
  const span = n > 1 ? (time[n - 1] - time[0]) / (n - 1) : 1;
  const half = Math.max(2, Math.ceil(5 / Math.max(span, 1e-9)));
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - half);
    const b = Math.min(n - 1, i + half);
    const dt = time[b] - time[a];
    out[i] = dt > 0 ? (volume[b] - volume[a]) / dt : 0;
  }
  return out;
}

/** Highest value held by `width` consecutive samples: max over i of min(values[i..i+width-1]). */
function sustainedMaximum(values: Float64Array, width: number): number {
  let best = -Infinity;
  for (let i = 0; i + width <= values.length; i++) {
    let low = values[i];
    for (let j = 1; j < width; j++) if (values[i + j] < low) low = values[i + j];
    if (low > best) best = low;
  }
  return best;
}
