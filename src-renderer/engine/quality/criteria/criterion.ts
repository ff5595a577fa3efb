/**
 * The shape of one quality criterion and small helpers shared by the criteria. Adding a
 * criterion is one file exporting a `QualityCriterion` plus one line in `index.ts`.
 *
 * Criteria grade records for review by a qualified engineer; they are not a substitute for
 * the operator's well-control policy and defer to local regulations and licensed practice.
 */
import type { TestType } from '../../record';
import type { AnalysisContext, CriterionResult, CycleAnalysis } from '../../result';
import type { LimitValues } from '../limits';

/** A criterion's finding before the registry adds its id and severity. */
export type CriterionFinding = Omit<CriterionResult, 'id' | 'severity'>;

export interface QualityCriterion {
  /** Stable id used in the command line's JSON (`quality.criteria[].id`). */
  id: string;
  /** Test types it applies to; it is absent from the result for the others. */
  appliesTo: readonly TestType[];
  severity: 'major' | 'minor';
  evaluate(ctx: AnalysisContext, limits: LimitValues): CriterionFinding;
}

/**
 * A finding that cannot be judged: pass null, value null, with what is missing.
 * @param message plain words naming what is missing. @param limit the limit that would apply, or null.
 * @param unit unit of the limit (CriterionResult.unit), or undefined.
 * @returns the finding. @throws nothing. @example notJudged('No shut-in was recorded.', 5e3 / 60, 'Pa/s')
 */
export function notJudged(message: string, limit: number | null = null, unit?: string): CriterionFinding {
  return unit === undefined ? { pass: null, value: null, limit, message } : { pass: null, value: null, limit, message, unit };
}

/**
 * The first cycle (index 1), else the earliest cycle, else null.
 * @param ctx analysis context. @returns the cycle analysis or null. @throws nothing.
 * @example firstCycle(ctx)?.loadingFit
 */
export function firstCycle(ctx: AnalysisContext): CycleAnalysis | null {
  if (ctx.cycles.length === 0) return null;
  return ctx.cycles.find((c) => c.cycle.index === 1) ?? [...ctx.cycles].sort((a, b) => a.cycle.index - b.cycle.index)[0];
}

/**
 * Pressure in MPa with two decimals, for messages.
 * @param pa pressure, Pa. @returns e.g. "34.00 MPa". @throws nothing. @example megapascals(34e6) // '34.00 MPa'
 */
export function megapascals(pa: number): string {
  return `${(pa / 1e6).toFixed(2)} MPa`;
}

/**
 * Percentage with one decimal, for messages.
 * @param fraction dimensionless. @returns e.g. "5.0 %". @throws nothing. @example percent(0.05) // '5.0 %'
 */
export function percent(fraction: number): string {
  return `${(fraction * 100).toFixed(1)} %`;
}

/**
 * Mean and sample standard deviation (n - 1) of values[start..end], inclusive.
 * @param values any unit. @param start first index. @param end last index (>= start for a result).
 * @returns {mean, sd, n}; mean NaN when the range is empty, sd 0 for one value. @throws nothing.
 * @example meanAndDeviation([1, 2, 3], 0, 2) // {mean: 2, sd: 1, n: 3}
 */
export function meanAndDeviation(values: ArrayLike<number>, start: number, end: number): { mean: number; sd: number; n: number } {
  let sum = 0;
  let n = 0;
  for (let i = start; i <= end; i++) { sum += values[i]; n++; }
  const mean = n > 0 ? sum / n : NaN;
  let ss = 0;
  for (let i = start; i <= end; i++) ss += (values[i] - mean) ** 2;
  return { mean, sd: n > 1 ? Math.sqrt(ss / (n - 1)) : 0, n };
}
