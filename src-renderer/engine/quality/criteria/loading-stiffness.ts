import type { QualityCriterion } from './criterion';
import { firstCycle, notJudged } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'ratio';

/**
 * Loading stiffness: measured loading slope dP/dV over the expected 1/(c V) within
 * [`loading-stiffness.minRatio`, `loading-stiffness.maxRatio`] (0.5-1.5). Expected slope
 * from METHODS.md "System stiffness" (Bourgoyne et al. 1986, from memory); field slopes
 * softer (Altun et al. 2001). Not judged without system volume and compressibility.
 */
export const loadingStiffness: QualityCriterion = {
  id: 'loading-stiffness',
  appliesTo: ['fit', 'lot', 'xlot', 'dfit'],
  severity: 'minor',
  evaluate(ctx, limits) {
    const minRatio = limits['loading-stiffness.minRatio'];
    const maxRatio = limits['loading-stiffness.maxRatio'];
    const cycle = firstCycle(ctx);
    const fit = cycle?.loadingFit ?? null;
    if (!cycle || !fit) return notJudged('No linear loading part was found, so its stiffness cannot be compared.', minRatio, UNIT);
    let expected = cycle.expectedSlope;
    if (expected === null || !(expected > 0)) {
      const v = ctx.metadata.systemVolume;
      const c = ctx.metadata.compressibility;
      if (v === undefined && c === undefined) return notJudged('No system volume and no compressibility were given, so the expected loading slope 1/(c V) is unknown.', minRatio, UNIT);
      if (v === undefined) return notJudged('No system volume was given, so the expected loading slope 1/(c V) is unknown.', minRatio, UNIT);
      if (c === undefined) return notJudged('No compressibility was given, so the expected loading slope 1/(c V) is unknown.', minRatio, UNIT);
      expected = 1 / (c * v);
    }
    const ratio = fit.slope / expected;
    const measured = `${(fit.slope / 1e6).toFixed(2)} MPa/m3`;
    const want = `${(expected / 1e6).toFixed(2)} MPa/m3`;
    if (ratio < minRatio) {
      return { pass: false, value: ratio, limit: minRatio, message: `The loading slope ${measured} is ${ratio.toFixed(2)} times the expected ${want}, softer than ${minRatio}: air in the line, casing expansion or a wrong volume.`, unit: UNIT };
    }
    if (ratio > maxRatio) {
      return { pass: false, value: ratio, limit: maxRatio, message: `The loading slope ${measured} is ${ratio.toFixed(2)} times the expected ${want}, stiffer than ${maxRatio}: check the stated volume, compressibility and rate.`, unit: UNIT };
    }
    return { pass: true, value: ratio, limit: minRatio, message: `The loading slope ${measured} is ${ratio.toFixed(2)} times the expected ${want} (allowed ${minRatio}-${maxRatio}).`, unit: UNIT };
  },
};
