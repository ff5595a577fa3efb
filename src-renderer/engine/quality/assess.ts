/**
 * Quality assessment of one analysed test: every criterion that applies to its type
 * (criteria/index.ts), with the project's limits (limits.ts), and the letter grade
 * (grade.ts). Findings are values; nothing here throws for a poor record.
 *
 * For review by a qualified engineer; not a substitute for the operator's well-control
 * policy; defers to local regulations and licensed practice.
 */
import type { AnalysisContext, QualityResult } from '../result';
import { shminFromPicks } from '../stress/estimates';
import { QUALITY_CRITERIA } from './criteria/index';
import { gradeFromCriteria } from './grade';
import { resolveLimits } from './limits';

/**
 * Assess the quality of one analysed test.
 *
 * @param ctx analysis context (SI; downhole pressures in Pa).
 * @param limits project overrides of the default limits, by key (limits.ts).
 * @returns {grade A-E, criteria (ids in registry order, only those applying to ctx.type), explanation}.
 * @throws EngineError 'bad-argument' for an unknown limit key or a non-finite limit value.
 * @example assessQuality(ctx).grade // 'A'
 */
export function assessQuality(ctx: AnalysisContext, limits: Record<string, number> = {}): QualityResult {
  const values = resolveLimits(limits);
  const criteria = QUALITY_CRITERIA
    .filter((c) => c.appliesTo.includes(ctx.type))
    .map((c) => ({ id: c.id, severity: c.severity, ...c.evaluate(ctx, values) }));
  const shmin = shminFromPicks(ctx.cycles);
  const { grade, explanation } = gradeFromCriteria(ctx.type, criteria, shmin?.from ?? null);
  return { grade, criteria, explanation };
}
