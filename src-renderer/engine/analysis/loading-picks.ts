/**
 * The linear loading part of a pumping period and the events on it: leak-off (or
 * reopening in a later cycle), breakdown, propagation plateau and the maximum of a
 * limit test. Event definitions follow White, Traugott & Swarbrick (2002), Petroleum
 * Geoscience 8(2):189-193, and Zoback et al. (2003), IJRMMS 40:1049-1076 (see METHODS.md).
 *
 * Loading line: pressure against the volume pumped in the cycle (against time x mean rate
 * when the volume does not increase, i.e. the pressure-time fallback at constant rate).
 * It is the near-linear stretch before the peak that covers the largest pressure rise,
 * found by one two-pointer pass of a running least-squares fit (O(n)): a stretch is
 * near-linear when its residual SD is at most the linearity tolerance
 * max(1.25 x noise SD, 0.05 % of the cycle's pressure rise). The concave toe (air, slack in the
 * system) at the start fails that test and is skipped. The stretch is then refitted
 * exactly and trimmed where a lasting departure begins inside it.
 *
 * Departure (leak-off, reopening): the first sample from which the pressure stays below the
 * loading line by more than k x max(residual SD, noise SD, 0.05 % of the rise) for at least
 * 3 samples and 2 % of the cycle's pumped volume ("lasting"); k = 3 by default (limit key
 * `loading-departure.thresholdSd`). The pick is then moved back to where a short centred
 * mean residual (up to 9 samples on dense records) first fell below its own SD: the start
 * of the bend seen through the noise. Common practice thresholds, the engine's own choice.
 *
 * Breakdown: the pumping peak when the pressure then drops, still pumping, by at least
 * max(5 x noise SD, 3 % of the rise). Propagation: the plateau at the end of pumping after
 * the breakdown or departure, where pressure stays within a band of
 * max(3 x noise SD, 0.5 % of the rise) and its fitted slope is below 15 % of the loading
 * slope; the pick is its median.
 */
import type { Cycle, LineFit, Pick, PickKind } from '../result';
import { fitLine, RunningLineFit } from './least-squares';
import { medianOf, noiseStandardDeviation, quantisationStep } from './robust-statistics';

/**
 * A stretch is near-linear when its residual SD is at most this many noise SDs: a straight
 * stretch of 50 samples shows about 1 +- 0.1 noise SD, so 1.25 admits noise, not a bend.
 */
const LINEARITY_NOISE_FACTOR = 1.25;

/** Default k of the departure threshold (k x residual SD). Common practice. */
export const DEFAULT_DEPARTURE_SD = 3;

/** What {@link analyseLoading} finds in one pumping period. Indices are record sample indices. */
export interface LoadingFeatures {
  /** Loading line, pressure (Pa) against cycle volume (m3); slope Pa/m3; null when none was found. */
  fit: LineFit | null;
  /** What the fit's abscissa was: the volume column, or time x mean rate. */
  abscissa: 'volume' | 'time-at-mean-rate';
  /** Noise SD of the pressure while pumping, Pa (at least the quantisation step / sqrt 12 and the stated gauge resolution / sqrt 12). */
  noise: number;
  /** Departure threshold used, Pa (k x SD). */
  departureThreshold: number;
  /** First lasting departure below the loading line, or null. */
  departureIndex: number | null;
  /** Highest pressure while pumping. */
  peakIndex: number;
  /** The peak when a drop follows it while pumping, else null. */
  breakdownIndex: number | null;
  /** Near-constant pumping pressure at the end of pumping after the departure or breakdown. */
  plateau: { start: number; end: number; pressure: number } | null;
}

/** Options of {@link analyseLoading}. */
export interface LoadingOptions {
  /** k of the departure threshold, > 0. Default {@link DEFAULT_DEPARTURE_SD}. */
  departureSd?: number;
  /** Gauge resolution, Pa, used as a floor of the noise. */
  gaugeResolution?: number;
}

/**
 * Finds the loading line, departure, peak, breakdown and plateau of one cycle.
 *
 * @param time s, strictly increasing. @param pressure downhole pressure, Pa.
 * @param volume cumulative pumped volume, m3. @param cycle the cycle (sample indices).
 * @param options departure k (> 0) and gauge resolution (Pa).
 * @returns the features; fit null when the pumping period has fewer than 3 samples or no rise.
 * @throws nothing for valid cycles (the fit's own EngineErrors cannot arise: ranges are checked).
 * @example analyseLoading(t, p, v, cycles[0]).fit?.slope // Pa/m3
 */
export function analyseLoading(
  time: Float64Array,
  pressure: Float64Array,
  volume: Float64Array,
  cycle: Cycle,
  options: LoadingOptions = {},
): LoadingFeatures {
  const s = cycle.pumpStart;
  const e = cycle.pumpEnd;
  const count = e - s + 1;
  const p = pressure.subarray(s, e + 1);
  const { x, abscissa } = cycleAbscissa(time, volume, cycle);
  const peak = indexOfMaximum(p);
  const rise = Math.max(0, p[peak] - p[0]);
  // Quantisation floor from second differences: the first-difference step of a steep ramp
  // sampled every 10 s is the ramp's own rise per sample, not a resolution.
  const step = quantisationStep(p);
  const noise = Math.max(noiseStandardDeviation(p), step / Math.sqrt(12), options.gaugeResolution ? options.gaugeResolution / Math.sqrt(12) : 0);
  const floor = Math.max(5e-4 * rise, 1e-9);
  const k = options.departureSd ?? DEFAULT_DEPARTURE_SD;
  const features: LoadingFeatures = {
    fit: null, abscissa, noise, departureThreshold: k * Math.max(noise, floor),
    departureIndex: null, peakIndex: s + peak, breakdownIndex: null, plateau: null,
  };
  if (count < 3 || !(rise > 0)) return features;

  const lasting = { samples: 3, extent: 0.02 * (x[count - 1] - x[0]) };
  const window = longestLinearStretch(x, p, peak, Math.max(LINEARITY_NOISE_FACTOR * noise, floor));
  let local: LineFit | null = null;
  let departure: number | null = null;
  if (window) {
    const a = window[0];
    let b = window[1];
    for (let iteration = 0; iteration < 4; iteration++) {
      local = fitLine(x, p, a, b);
      const sd = Math.max(local.residualSd, noise, floor);
      departure = firstLastingDeparture(x, p, local, a, count - 1, k * sd, sd, lasting);
      if (departure === null || departure > b || departure - a + 1 < 3) break;
      b = departure - 1;
    }
    if (local) {
      features.departureThreshold = k * Math.max(local.residualSd, noise, floor);
      features.fit = { ...local, start: local.start + s, end: local.end + s };
    }
  }
  features.departureIndex = departure === null ? null : departure + s;

  const drop = Math.max(5 * noise, 0.03 * rise);
  let lowAfterPeak = Infinity;
  for (let i = peak + 1; i < count; i++) if (p[i] < lowAfterPeak) lowAfterPeak = p[i];
  if (peak < count - 1 && p[peak] - lowAfterPeak >= drop) features.breakdownIndex = s + peak;

  const reference = features.breakdownIndex ?? features.departureIndex;
  if (reference !== null) {
    features.plateau = endPlateau(x, p, reference - s, Math.max(3 * noise, 0.005 * rise), local ? local.slope : null, s);
  }
  return features;
}

/**
 * Cycle abscissa: volume pumped since the cycle start (m3), or elapsed time x mean rate
 * when the volume column does not increase over the pumping period.
 */
function cycleAbscissa(time: Float64Array, volume: Float64Array, cycle: Cycle): { x: Float64Array; abscissa: LoadingFeatures['abscissa'] } {
  const s = cycle.pumpStart;
  const count = cycle.pumpEnd - s + 1;
  const x = new Float64Array(count);
  const v0 = volume[s];
  const span = volume[cycle.pumpEnd] - v0;
  if (Number.isFinite(span) && span > 0) {
    for (let i = 0; i < count; i++) x[i] = volume[s + i] - v0;
    return { x, abscissa: 'volume' };
  }
  const q = cycle.meanRate > 0 ? cycle.meanRate : 1;
  for (let i = 0; i < count; i++) x[i] = (time[s + i] - time[s]) * q;
  return { x, abscissa: 'time-at-mean-rate' };
}

/**
 * Two-pointer scan over [0, last]: for each end b the longest window [a, b] whose running
 * fit has residual SD <= tolerance; keeps the window with the largest fitted pressure rise
 * (positive slope x volume span). O(n): a only moves forward.
 */
function longestLinearStretch(x: Float64Array, p: Float64Array, last: number, tolerance: number): [number, number] | null {
  const minPoints = Math.min(50, Math.max(3, Math.ceil(0.05 * (last + 1))));
  const fit = new RunningLineFit();
  let a = 0;
  let best: [number, number] | null = null;
  let bestRise = 0;
  for (let b = 0; b <= last; b++) {
    fit.add(x[b], p[b]);
    while (fit.n > minPoints && !(fit.residualSd <= tolerance)) {
      fit.remove(x[a], p[a]);
      a++;
    }
    if (fit.n >= minPoints && fit.residualSd <= tolerance) {
      const rise = fit.slope * (x[b] - x[a]);
      if (rise > bestRise) {
        bestRise = rise;
        best = [a, b];
      }
    }
  }
  return best;
}

/**
 * First index i in [from, to] from which residuals p - line stay below -threshold for at least
 * `lasting.samples` samples spanning `lasting.extent` in x; then moved back to where the
 * centred mean residual of 2h+1 samples (h = 0..4, growing with the number of samples)
 * first fell below its own SD. Null when no lasting departure.
 */
function firstLastingDeparture(
  x: Float64Array, p: Float64Array, line: LineFit, from: number, to: number, threshold: number, sd: number,
  lasting: { samples: number; extent: number },
): number | null {
  let runStart = -1;
  for (let i = from; i <= to; i++) {
    const residual = p[i] - (line.intercept + line.slope * x[i]);
    if (residual < -threshold) {
      if (runStart < 0) runStart = i;
      if (i - runStart + 1 >= lasting.samples && x[i] - x[runStart] >= lasting.extent) {
        // Back to the start of the bend: the centred mean residual of 2h+1 samples below its own
        // SD, -sd/sqrt(2h+1); h grows with the density of the loading (0 below 100 samples, at most 4).
        const half = Math.min(4, Math.floor((to - from + 1) / 100));
        const level = sd / Math.sqrt(2 * half + 1);
        const meanResidual = (j: number): number => {
          let sum = 0;
          let count = 0;
          for (let m = Math.max(from, j - half); m <= Math.min(to, j + half); m++) {
            sum += p[m] - (line.intercept + line.slope * x[m]);
            count++;
          }
          return sum / count;
        };
        let j = runStart;
        while (j > from && meanResidual(j - 1) < -level) j--;
        return j;
      }
    } else {
      runStart = -1;
    }
  }
  return null;
}

/**
 * Plateau at the end of p after `after`: walk back from the end while max - min <= 2 band;
 * at least 3 samples and 20 % of the pumping after `after`; and, when the loading slope is
 * known, a fitted slope below 15 % of it (still rising steeply is not a plateau).
 */
function endPlateau(x: Float64Array, p: Float64Array, after: number, band: number, loadingSlope: number | null, offset: number): LoadingFeatures['plateau'] {
  const last = p.length - 1;
  let low = p[last];
  let high = p[last];
  let j = last;
  while (j - 1 > after) {
    const v = p[j - 1];
    const nextLow = v < low ? v : low;
    const nextHigh = v > high ? v : high;
    if (nextHigh - nextLow > 2 * band) break;
    low = nextLow;
    high = nextHigh;
    j--;
  }
  const length = last - j + 1;
  if (length < 3 || length < 0.2 * (last - after)) return null;
  if (loadingSlope !== null && x[last] > x[j]) {
    const tail = fitLine(x, p, j, last);
    if (Math.abs(tail.slope) > 0.15 * Math.abs(loadingSlope)) return null;
  }
  return { start: j + offset, end: last + offset, pressure: medianOf(p, j, last) };
}

function indexOfMaximum(p: ArrayLike<number>): number {
  let best = 0;
  for (let i = 1; i < p.length; i++) if (p[i] > p[best]) best = i;
  return best;
}

/**
 * A pick at one sample of the record.
 *
 * @param kind event kind. @param index sample index. @param time s. @param pressure downhole, Pa.
 * @param method method id. @param value pressure to report when not the sample's own (a median), Pa.
 * @returns the pick.
 * @example pickAt('breakdown', 120, time, pressure, 'pumping-peak-before-drop')
 */
export function pickAt(kind: PickKind, index: number, time: Float64Array, pressure: Float64Array, method: string, value?: number): Pick {
  return { kind, pressure: value ?? pressure[index], time: time[index], method, sampleIndex: index };
}

/** Method ids of the loading picks (stable: they appear in exports). */
export const LOADING_METHODS = {
  leakOff: 'departure-from-linear-loading',
  reopening: 'departure-from-linear-reloading',
  breakdown: 'pumping-peak-before-drop',
  propagation: 'median-of-pumping-plateau',
  fitMaximum: 'maximum-pumping-pressure',
} as const;
