import type { QualityCriterion } from './criterion';
import { meanAndDeviation, notJudged, percent } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'fraction';

/**
 * Rate stability: coefficient of variation (SD / mean) of the pump rate while pumping,
 * at most `rate-stability.maxCv` (10 %). Each cycle's pumping period is judged without
 * its first and last 10 % (ramps); for a step-rate test, the second half of each step.
 * The worst period counts. Common practice: constant low rate (METHODS.md).
 */
export const rateStability: QualityCriterion = {
  id: 'rate-stability',
  appliesTo: ['fit', 'lot', 'xlot', 'srt', 'dfit'],
  severity: 'minor',
  evaluate(ctx, limits) {
    const limit = limits['rate-stability.maxCv'];
    const windows: { start: number; end: number; label: string }[] = [];
    if (ctx.type === 'srt') {
      for (const c of ctx.cycles) {
        const steps = c.stepRate?.steps ?? [];
        steps.forEach((s, k) => {
          const start = Math.floor((s.startIndex + s.endIndex) / 2);
          windows.push({ start, end: s.endIndex, label: `step ${k + 1}` });
        });
      }
    } else {
      for (const c of ctx.cycles) {
        const { pumpStart, pumpEnd } = c.cycle;
        const trim = Math.floor((pumpEnd - pumpStart) * 0.1);
        windows.push({ start: pumpStart + trim, end: pumpEnd - trim, label: `cycle ${c.cycle.index}` });
      }
    }
    let worst: { cv: number; label: string } | null = null;
    for (const w of windows) {
      if (w.end - w.start + 1 < 5) continue;
      const { mean, sd } = meanAndDeviation(ctx.rate, w.start, w.end);
      if (!(mean > 0)) continue;
      const cv = sd / mean;
      if (!worst || cv > worst.cv) worst = { cv, label: w.label };
    }
    if (!worst) return notJudged(ctx.type === 'srt' ? 'No stabilised rate steps were found, so the rate cannot be judged.' : 'No pumping period with at least 5 samples was found, so the rate cannot be judged.', limit, UNIT);
    const pass = worst.cv <= limit;
    const message = pass
      ? `The pump rate was steady: largest variation ${percent(worst.cv)} of the mean (${worst.label}; limit ${percent(limit)}).`
      : `The pump rate was unsteady: it varied by ${percent(worst.cv)} of the mean in ${worst.label} (limit ${percent(limit)}), which bends the loading line and blurs the picks.`;
    return { pass, value: worst.cv, limit, message, unit: UNIT };
  },
};
