import { fitLine } from '../../analysis/least-squares';
import type { QualityCriterion } from './criterion';
import { notJudged } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'Pa/s';

/**
 * Shut-in stability, on the longest shut-in of the record: it lasts at least
 * `shut-in-stability.minDuration` (600 s) and the downhole pressure decline over its
 * last `shut-in-stability.endWindow` seconds (least-squares slope of pressure against
 * time) is at most `shut-in-stability.maxEndDeclineRate` (5 kPa/min). Value: the end
 * decline rate, Pa/s. Common practice: shut-in recorded until the pressure stabilises.
 */
export const shutInStability: QualityCriterion = {
  id: 'shut-in-stability',
  appliesTo: ['fit', 'lot', 'xlot', 'srt', 'dfit'],
  severity: 'major',
  evaluate(ctx, limits) {
    const minDuration = limits['shut-in-stability.minDuration'];
    const maxRate = limits['shut-in-stability.maxEndDeclineRate'];
    const window = limits['shut-in-stability.endWindow'];
    let best: { start: number; end: number; duration: number; cycle: number } | null = null;
    for (const c of ctx.cycles) {
      const { pumpEnd, shutInEnd } = c.cycle;
      if (shutInEnd <= pumpEnd) continue;
      const duration = ctx.time[shutInEnd] - ctx.time[pumpEnd];
      if (!best || duration > best.duration) best = { start: pumpEnd + 1, end: shutInEnd, duration, cycle: c.cycle.index };
    }
    if (!best) return notJudged('No shut-in was recorded, so its stability cannot be judged.', maxRate, UNIT);
    const tEnd = ctx.time[best.end];
    let first = best.end;
    while (first > best.start && tEnd - ctx.time[first - 1] <= window) first--;
    if (best.end - first + 1 < 3) {
      first = Math.max(best.start, best.end - 2);
    }
    if (best.end - first + 1 < 3) return notJudged(`The shut-in of cycle ${best.cycle} has fewer than 3 samples, so its stability cannot be judged.`, maxRate, UNIT);
    const fit = fitLine(ctx.time, ctx.downholePressure, first, best.end);
    const decline = -fit.slope;
    const perMinute = (decline * 60) / 1e3;
    const limitPerMinute = (maxRate * 60) / 1e3;
    const minutes = best.duration / 60;
    const problems: string[] = [];
    if (best.duration < minDuration) problems.push(`it lasted ${minutes.toFixed(1)} min, shorter than ${(minDuration / 60).toFixed(0)} min`);
    if (decline > maxRate) problems.push(`the pressure was still falling ${perMinute.toFixed(1)} kPa/min at its end (limit ${limitPerMinute.toFixed(1)} kPa/min), as a leak or an unfinished decline would`);
    const pass = problems.length === 0;
    const message = pass
      ? `The shut-in of cycle ${best.cycle} lasted ${minutes.toFixed(1)} min and settled: ${perMinute.toFixed(1)} kPa/min at its end (limit ${limitPerMinute.toFixed(1)} kPa/min).`
      : `The shut-in of cycle ${best.cycle} is not stable: ${problems.join('; ')}.`;
    return { pass, value: decline, limit: maxRate, message, unit: UNIT };
  },
};
