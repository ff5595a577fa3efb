import type { QualityCriterion } from './criterion';
import { percent } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'fraction';

/**
 * Gauge range: the highest gauge reading stays below `gauge-range.maxFraction` (95 %) of
 * the gauge full-scale range, and no run of `gauge-range.maxFlatTopSamples` (5) or more
 * identical readings sits at the record maximum while pumping (clipping). Value: highest
 * reading over the range (null when no range is given). Common practice (METHODS.md).
 */
export const gaugeRange: QualityCriterion = {
  id: 'gauge-range',
  appliesTo: ['fit', 'lot', 'xlot', 'srt', 'dfit'],
  severity: 'major',
  evaluate(ctx, limits) {
    const maxFraction = limits['gauge-range.maxFraction'];
    const maxRun = limits['gauge-range.maxFlatTopSamples'];
    const p = ctx.gaugePressure;
    if (p.length === 0) return { pass: null, value: null, limit: maxFraction, message: 'The record has no pressure samples.', unit: UNIT };
    // one pass: the maximum so far and the longest pumping run at it (a new maximum
    // restarts the count, as no earlier sample can equal it)
    const rate = ctx.rate;
    let max = -Infinity;
    let longest = 0;
    let run = 0;
    for (let i = 0; i < p.length; i++) {
      const v = p[i];
      if (v > max) { max = v; longest = 0; run = 0; }
      if (v === max && rate[i] > 0) { run++; if (run > longest) longest = run; } else run = 0;
    }
    const clipped = longest >= maxRun;
    const range = ctx.metadata.gaugeRange;
    const fraction = range !== undefined && range > 0 ? max / range : null;
    const problems: string[] = [];
    if (clipped) problems.push(`${longest} identical readings at the maximum of ${(max / 1e6).toFixed(3)} MPa while pumping: the gauge clipped, so the true peak is unknown`);
    if (fraction !== null && fraction > maxFraction) problems.push(`the highest reading is ${percent(fraction)} of the gauge range (limit ${percent(maxFraction)})`);
    if (problems.length > 0) return { pass: false, value: fraction, limit: maxFraction, message: `The gauge range was reached: ${problems.join('; ')}.`, unit: UNIT };
    if (fraction === null) {
      return { pass: null, value: null, limit: maxFraction, message: 'No gauge range was given, so the margin to full scale is unknown (no flat top was found).', unit: UNIT };
    }
    return { pass: true, value: fraction, limit: maxFraction, message: `The highest reading is ${percent(fraction)} of the gauge range and shows no flat top.`, unit: UNIT };
  },
};
