import type { QualityCriterion } from './criterion';
import { firstCycle } from './criterion';
import { medianSampleInterval } from './sample-interval';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 's';

/**
 * Sampling: median sample interval at most `sampling.maxInterval` (1 s) and at least
 * `sampling.minLoadingSamples` (20) samples in the first cycle's fitted loading part.
 * Value: the median interval, s. Common practice: sampling of a second or faster (METHODS.md).
 * An interval up to 2 % above the limit passes: files that write elapsed time in rounded
 * minutes (0.0167 min for 1 s) must not fail on the rounding.
 */
/** Relative allowance for rounded time stamps. */
const ROUNDING_ALLOWANCE = 0.02;

export const sampling: QualityCriterion = {
  id: 'sampling',
  appliesTo: ['fit', 'lot', 'xlot', 'srt', 'dfit'],
  severity: 'major',
  evaluate(ctx, limits) {
    const maxInterval = limits['sampling.maxInterval'];
    const minSamples = limits['sampling.minLoadingSamples'];
    const n = ctx.time.length;
    if (n < 2) return { pass: null, value: null, limit: maxInterval, message: 'The record has fewer than two samples.', unit: UNIT };
    const median = medianSampleInterval(ctx.time);
    const problems: string[] = [];
    if (median > maxInterval * (1 + ROUNDING_ALLOWANCE)) problems.push(`samples are ${median.toPrecision(3)} s apart (limit ${maxInterval} s), too sparse to resolve leak-off, breakdown and ISIP`);
    const fit = ctx.type === 'srt' ? null : firstCycle(ctx)?.loadingFit ?? null;
    if (fit && fit.n < minSamples) problems.push(`the loading line rests on ${fit.n} samples (at least ${minSamples} needed)`);
    const pass = problems.length === 0;
    const loadingNote = fit ? `, ${fit.n} samples on the loading line` : '';
    return {
      pass,
      value: median,
      limit: maxInterval,
      message: pass ? `Sampling is dense enough: ${median.toPrecision(3)} s between samples${loadingNote}.` : `Sampling is too sparse: ${problems.join('; ')}.`,
      unit: UNIT,
    };
  },
};
