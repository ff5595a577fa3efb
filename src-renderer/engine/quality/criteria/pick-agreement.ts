import type { QualityCriterion } from './criterion';
import { megapascals, notJudged, percent } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'fraction';

/**
 * Pick agreement: spread (max - min) of the closure picks by different methods, over
 * their mean, at most `pick-agreement.maxSpreadFraction` (5 %), in the latest cycle that
 * has two or more closure candidates. ISRM Suggested Methods Part 3 (Haimson & Cornet
 * 2003): use several methods; their agreement is itself a quality signal.
 */
export const pickAgreement: QualityCriterion = {
  id: 'pick-agreement',
  appliesTo: ['lot', 'xlot', 'dfit'],
  severity: 'minor',
  evaluate(ctx, limits) {
    const limit = limits['pick-agreement.maxSpreadFraction'];
    const cycle = [...ctx.cycles]
      .filter((c) => c.closureCandidates.length >= 2)
      .sort((a, b) => b.cycle.index - a.cycle.index)[0];
    if (!cycle) return notJudged('Fewer than two closure methods found a pick, so their agreement cannot be judged.', limit, UNIT);
    const pressures = cycle.closureCandidates.map((c) => c.pressure);
    const lo = Math.min(...pressures);
    const hi = Math.max(...pressures);
    const mean = pressures.reduce((s, v) => s + v, 0) / pressures.length;
    const fraction = (hi - lo) / mean;
    const methods = cycle.closureCandidates.map((c) => `${c.method} ${megapascals(c.pressure)}`).join(', ');
    const pass = fraction <= limit;
    const message = pass
      ? `The ${pressures.length} closure picks of cycle ${cycle.cycle.index} agree within ${percent(fraction)} (limit ${percent(limit)}): ${methods}.`
      : `The closure picks of cycle ${cycle.cycle.index} disagree by ${percent(fraction)} (limit ${percent(limit)}): ${methods}; choose and justify one by hand.`;
    return { pass, value: fraction, limit, message, unit: UNIT };
  },
};
