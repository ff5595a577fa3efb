/**
 * The shut-in of one cycle as every shut-in method sees it (METHODS.md "Closure picks on
 * the shut-in decline"): the shut-in instant, the pumping time of the G-function, the first
 * seconds left out after shut-in, the record's pressure noise and the tuning options with
 * their defaults.
 *
 * Picks are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { Cycle } from '../result';
import type { GFunctionAlpha } from './gfunction';

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

/**
 * A prepared shut-in: the shut-in instant t0 = time[pumpEnd] (s), the pumping time tp (s),
 * the first analysed sample (after the skip) and the last, the pressure noise per sample
 * (Pa) and the options with every default filled in.
 */
export interface ShutInWindow {
  t0: number;
  tp: number;
  first: number;
  last: number;
  noise: number;
  options: Required<ShutInOptions>;
}

/** Fewest shut-in samples after the skip before any shut-in method picks. */
export const MIN_SHUT_IN_SAMPLES = 30;
/** Default skip as a fraction of the pumping time (water hammer in a deep well lasts tens of seconds). */
const SKIP_FRACTION_OF_PUMPING = 0.05;
/** Fewest samples behind one derivative value (fewer, down to 12, on a shut-in of under 1000 samples: n/25; 8 let single noisy windows of a few-minute shut-in look like closure). */
export const MIN_WINDOW_SAMPLES = 40;

/**
 * A Float64Array of length n filled by fn(i) (a plain loop: fast on a million samples).
 *
 * @param n length, a non-negative integer. @param fn value of element i (any unit).
 * @returns the filled array. @throws RangeError from Float64Array for a negative or
 *   non-integer n.
 * @example filledSeries(3, (i) => i * i) // Float64Array [0, 1, 4]
 */
export function filledSeries(n: number, fn: (i: number) => number): Float64Array {
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

/**
 * Prepares the shut-in of `cycle` for the closure and ISIP methods (the shared construction
 * of shut-in.ts): t0 = time[pumpEnd], tp = time[pumpEnd] - time[pumpStart], the first
 * `skipSeconds` after t0 left out (default max(2 s, 3 sample intervals, 0.05 tp): water
 * hammer and friction drop, common practice) and the pressure noise from second differences.
 *
 * @param time elapsed time, s, increasing. @param pressure downhole pressure, Pa, same length.
 * @param cycle the cycle (pumpStart <= pumpEnd <= shutInEnd, sample indices).
 * @param options see {@link ShutInOptions}; skipSeconds >= 0.
 * @returns the prepared window, or null when fewer than 30 shut-in samples remain after the
 *   skip or the cycle has no pumping time.
 * @throws EngineError 'bad-argument' for unequal lengths or a negative skipSeconds;
 *   'out-of-range' for cycle indices outside the record.
 * @example prepareShutIn(time, p, cycle, {})?.tp
 */
export function prepareShutIn(time: ArrayLike<number>, pressure: ArrayLike<number>, cycle: Cycle, options: ShutInOptions): ShutInWindow | null {
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
