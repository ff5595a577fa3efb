/**
 * Step-rate test (SRT) analysis: find the steps of near-constant rate, take the
 * stabilised pressure at the end of each, fit the matrix and fracture straight lines and
 * intersect them for the extension pressure (METHODS.md "Step-rate test"; US EPA Region 8
 * Underground Injection Control, Step-Rate Test Procedure, 1999: equal stabilised steps,
 * at least two points above the break).
 *
 *   q* = (a2 - a1) / (b1 - b2),  P* = a1 + b1 q*   (lines P = a + b q)
 *
 * Caution (common practice): radial flow bends the matrix line upward, so the intersection
 * can overestimate the extension pressure. Results are for review by a qualified engineer;
 * they are not a substitute for the operator's well-control policy and defer to local
 * regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { Cycle, LineFit, StepRateAnalysis } from '../result';
import { fitLine } from './least-squares';

/** Tuning of {@link stepRateAnalysis}; every field has a documented default. */
export interface StepRateOptions {
  /** Relative rate change that ends a step, default 0.05 (5 % of the step's rate). */
  relativeTolerance?: number;
  /** Absolute rate change that ends a step, m3/s; default 2 % of the cycle's largest rate. */
  absoluteTolerance?: number;
  /** Fraction of each step, at its end, averaged for the stabilised pressure; default 0.1. */
  endFraction?: number;
  /** Shortest step kept, as a fraction of the median step duration (ramps are shorter); default 0.3. */
  minimumDurationFraction?: number;
  /** Fewest steps on each side of the break; default 2 (EPA Region 8, 1999). */
  minimumPointsEachSide?: number;
}

type Step = StepRateAnalysis['steps'][number];

function checkInputs(time: ArrayLike<number>, pressure: ArrayLike<number>, rate: ArrayLike<number>, cycle: Cycle): void {
  if (time.length !== pressure.length || time.length !== rate.length) {
    throw new EngineError('bad-argument', `time, pressure and rate have ${time.length}, ${pressure.length} and ${rate.length} samples`, {}, 'equal lengths');
  }
  if (!Number.isInteger(cycle.pumpStart) || !Number.isInteger(cycle.pumpEnd) || cycle.pumpStart < 0 || cycle.pumpEnd < cycle.pumpStart || cycle.pumpEnd >= time.length) {
    throw new EngineError('out-of-range', `cycle ${cycle.index} pumping indices ${cycle.pumpStart}..${cycle.pumpEnd} do not fit ${time.length} samples`, {}, 'pumpStart <= pumpEnd < samples');
  }
  for (let i = cycle.pumpStart; i <= cycle.pumpEnd; i++) {
    if (!Number.isFinite(time[i]) || !Number.isFinite(pressure[i]) || !Number.isFinite(rate[i])) {
      throw new EngineError('bad-argument', `sample ${i} has a value that is not a finite number`, {}, 'finite time, pressure and rate');
    }
  }
}

/**
 * Steps of near-constant rate while pumping: a step grows while each rate stays within
 * max(relativeTolerance x step mean, absoluteTolerance) of the step's running mean; a
 * single-sample spike does not end it. Steps at (near) zero rate and steps shorter than
 * minimumDurationFraction x the median duration of the steps longer than a tenth of the
 * longest (the ramps between steps) are dropped.
 *
 * @param time s. @param pressure downhole Pa. @param rate m3/s. @param cycle pumping indices.
 * @returns steps in time order: mean rate m3/s, stabilised pressure Pa (mean over the last
 *   endFraction of the step), first and last sample index.
 * @throws EngineError 'out-of-range', 'bad-argument' as {@link stepRateAnalysis}.
 * @example rateSteps(time, p, q, cycle).length
 */
export function rateSteps(time: ArrayLike<number>, pressure: ArrayLike<number>, rate: ArrayLike<number>, cycle: Cycle, options: StepRateOptions = {}): Step[] {
  checkInputs(time, pressure, rate, cycle);
  const relative = options.relativeTolerance ?? 0.05;
  const endFraction = options.endFraction ?? 0.1;
  if (!(relative > 0) || !(endFraction > 0 && endFraction <= 1)) {
    throw new EngineError('bad-argument', 'step tolerances must be positive and endFraction in (0, 1]', {}, 'relativeTolerance > 0, 0 < endFraction <= 1');
  }
  let maxRate = 0;
  for (let i = cycle.pumpStart; i <= cycle.pumpEnd; i++) maxRate = Math.max(maxRate, rate[i]);
  if (!(maxRate > 0)) return [];
  const absolute = options.absoluteTolerance ?? 0.02 * maxRate;
  const raw: { start: number; end: number; sum: number; n: number }[] = [];
  let current = { start: cycle.pumpStart, end: cycle.pumpStart, sum: rate[cycle.pumpStart], n: 1 };
  const within = (value: number, mean: number) => Math.abs(value - mean) <= Math.max(relative * Math.abs(mean), absolute);
  for (let i = cycle.pumpStart + 1; i <= cycle.pumpEnd; i++) {
    const mean = current.sum / current.n;
    if (within(rate[i], mean)) {
      current.end = i;
      current.sum += rate[i];
      current.n++;
    } else if (i < cycle.pumpEnd && within(rate[i + 1], mean)) {
      current.end = i; // a one-sample spike: keep the step, leave the spike out of the mean
    } else {
      raw.push(current);
      current = { start: i, end: i, sum: rate[i], n: 1 };
    }
  }
  raw.push(current);
  const pumping = raw.filter((s) => s.sum / s.n > absolute && s.end > s.start);
  if (pumping.length === 0) return [];
  // Median duration of the real steps: ramps between steps are many and short, so they are
  // left out of the median (anything under a tenth of the longest step).
  const all = pumping.map((s) => time[s.end] - time[s.start]);
  const longest = Math.max(...all);
  const durations = all.filter((d) => d >= 0.1 * longest).sort((a, b) => a - b);
  const median = durations[Math.floor(durations.length / 2)];
  const shortest = (options.minimumDurationFraction ?? 0.3) * median;
  return pumping
    .filter((s) => time[s.end] - time[s.start] >= shortest && s.end - s.start + 1 >= 3)
    .map((s) => {
      const duration = time[s.end] - time[s.start];
      let first = s.end;
      while (first > s.start && time[s.end] - time[first - 1] <= endFraction * duration) first--;
      let sum = 0;
      for (let i = first; i <= s.end; i++) sum += pressure[i];
      return { rate: s.sum / s.n, pressure: sum / (s.end - first + 1), startIndex: s.start, endIndex: s.end };
    });
}

function lineOver(steps: Step[], from: number, to: number): LineFit {
  const q = steps.slice(from, to + 1).map((s) => s.rate);
  const p = steps.slice(from, to + 1).map((s) => s.pressure);
  const { slope, intercept, r2, residualSd, n } = fitLine(q, p);
  const start = Math.min(...steps.slice(from, to + 1).map((s) => s.startIndex));
  const end = Math.max(...steps.slice(from, to + 1).map((s) => s.endIndex));
  return { slope, intercept, r2, residualSd, n, start, end };
}

/**
 * Step-rate analysis of one pumping cycle: steps ({@link rateSteps}), then two straight
 * lines P = a + b q through the stabilised points ordered by rate, the break chosen to
 * minimise the total squared error with at least minimumPointsEachSide points on each side
 * (EPA Region 8, 1999), and their intersection q* = (a2 - a1)/(b1 - b2), P* = a1 + b1 q*.
 *
 * @param time elapsed time, s. @param pressure downhole pressure, Pa. @param rate pump
 *   rate, m3/s. @param cycle the cycle (its pumping part is analysed).
 * @returns steps always; matrixLine and fractureLine null with fewer than 2 x
 *   minimumPointsEachSide steps or when the rates of a side are all equal; extension null
 *   when there are no lines, the fracture line is not flatter than the matrix line
 *   (parallel or inverted), or the intersection falls outside the tested rates. LineFit
 *   start/end are the first and last sample indices of the steps each line uses.
 * @throws EngineError 'out-of-range' for cycle indices outside the record; 'bad-argument'
 *   for unequal lengths, non-finite samples or bad options.
 * @example stepRateAnalysis(time, p, q, cycle).extension?.pressure
 */
export function stepRateAnalysis(time: ArrayLike<number>, pressure: ArrayLike<number>, rate: ArrayLike<number>, cycle: Cycle, options: StepRateOptions = {}): StepRateAnalysis {
  const steps = rateSteps(time, pressure, rate, cycle, options);
  const each = options.minimumPointsEachSide ?? 2;
  if (!Number.isInteger(each) || each < 2) throw new EngineError('bad-argument', `minimumPointsEachSide ${each} is below 2`, {}, 'an integer >= 2');
  const empty: StepRateAnalysis = { steps, matrixLine: null, fractureLine: null, extension: null };
  if (steps.length < 2 * each) return empty;
  const ordered = [...steps].sort((a, b) => a.rate - b.rate);
  let best: { sse: number; matrix: LineFit; fracture: LineFit } | null = null;
  for (let k = each; k <= ordered.length - each; k++) {
    let matrix: LineFit;
    let fracture: LineFit;
    try {
      matrix = lineOver(ordered, 0, k - 1);
      fracture = lineOver(ordered, k, ordered.length - 1);
    } catch (e) {
      if (e instanceof EngineError && e.code === 'singular-matrix') continue; // equal rates on one side
      throw e;
    }
    const sse = matrix.residualSd ** 2 * Math.max(0, matrix.n - 2) + fracture.residualSd ** 2 * Math.max(0, fracture.n - 2);
    if (!best || sse < best.sse) best = { sse, matrix, fracture };
  }
  if (!best) return empty;
  const { matrix, fracture } = best;
  const result: StepRateAnalysis = { steps, matrixLine: matrix, fractureLine: fracture, extension: null };
  const difference = matrix.slope - fracture.slope;
  if (!(difference > 1e-9 * Math.max(Math.abs(matrix.slope), Math.abs(fracture.slope)))) return result;
  const q = (fracture.intercept - matrix.intercept) / difference;
  if (!(q >= ordered[0].rate && q <= ordered[ordered.length - 1].rate)) return result;
  result.extension = { rate: q, pressure: matrix.intercept + matrix.slope * q };
  return result;
}
