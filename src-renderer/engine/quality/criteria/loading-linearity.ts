import type { QualityCriterion } from './criterion';
import { firstCycle, notJudged } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'r2';

/**
 * Loading linearity: R2 of the first cycle's linear loading fit (pressure against
 * volume) at least `loading-linearity.minR2` (0.995). Straight loading line is good
 * practice (METHODS.md; White et al. 2002). Not judged without a loading fit.
 */
export const loadingLinearity: QualityCriterion = {
  id: 'loading-linearity',
  appliesTo: ['fit', 'lot', 'xlot', 'dfit'],
  severity: 'major',
  evaluate(ctx, limits) {
    const limit = limits['loading-linearity.minR2'];
    const cycle = firstCycle(ctx);
    const fit = cycle?.loadingFit ?? null;
    if (!cycle || !fit) return notJudged('No linear loading part was found, so its straightness cannot be judged.', limit, UNIT);
    const pass = fit.r2 >= limit;
    const message = pass
      ? `The loading line of cycle ${cycle.cycle.index} is straight: R2 ${fit.r2.toFixed(4)} over ${fit.n} samples (limit ${limit}).`
      : `The loading line of cycle ${cycle.cycle.index} is not straight enough: R2 ${fit.r2.toFixed(4)} is below ${limit}; ` +
        'look for air in the line, an unsteady rate or leak-off starting early.';
    return { pass, value: fit.r2, limit, message, unit: UNIT };
  },
};
