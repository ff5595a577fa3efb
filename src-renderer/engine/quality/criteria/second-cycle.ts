import type { CycleAnalysis } from '../../result';
import type { QualityCriterion } from './criterion';
import { megapascals, percent } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'fraction';

function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / ((a + b) / 2);
}

/** The last two cycles that both have a pick of this kind. */
function lastTwo(cycles: readonly CycleAnalysis[], kind: 'isip' | 'closure'): [CycleAnalysis, CycleAnalysis] | null {
  const withPick = cycles.filter((c) => c.picks[kind] !== undefined).sort((a, b) => a.cycle.index - b.cycle.index);
  if (withPick.length < 2) return null;
  return [withPick[withPick.length - 2], withPick[withPick.length - 1]];
}

/**
 * Second cycle (XLOT): a second cycle exists; its reopening is below the first-cycle
 * breakdown; ISIP and closure of the last two cycles that have them repeat within
 * `second-cycle.maxRepeatDifference` (5 %) of their mean; each later cycle has a shut-in
 * of at least half `shut-in-stability.minDuration`. Value: the larger ISIP / closure
 * difference. Common practice (METHODS.md good practice; Zoback et al. 2003).
 */
export const secondCycle: QualityCriterion = {
  id: 'second-cycle',
  appliesTo: ['xlot'],
  severity: 'major',
  evaluate(ctx, limits) {
    const limit = limits['second-cycle.maxRepeatDifference'];
    const minShutIn = limits['shut-in-stability.minDuration'] / 2;
    const cycles = [...ctx.cycles].sort((a, b) => a.cycle.index - b.cycle.index);
    if (cycles.length < 2) {
      return { pass: false, value: null, limit, message: 'Only one cycle was found: an extended leak-off test needs a second cycle to confirm ISIP and closure.', unit: UNIT };
    }
    const problems: string[] = [];
    const notes: string[] = [];
    const breakdown = cycles[0].picks.breakdown;
    const reopening = cycles.slice(1).find((c) => c.picks.reopening)?.picks.reopening;
    if (breakdown && reopening) {
      if (reopening.pressure >= breakdown.pressure) problems.push(`the reopening ${megapascals(reopening.pressure)} is not below the first-cycle breakdown ${megapascals(breakdown.pressure)}`);
      else notes.push(`reopening ${megapascals(reopening.pressure)} below breakdown ${megapascals(breakdown.pressure)}`);
    } else {
      notes.push(reopening ? 'no first-cycle breakdown to compare the reopening with' : 'no reopening was picked in a later cycle');
    }
    for (const c of cycles.slice(1)) {
      const duration = ctx.time[c.cycle.shutInEnd] - ctx.time[c.cycle.pumpEnd];
      if (c.cycle.shutInEnd <= c.cycle.pumpEnd || duration < minShutIn) {
        problems.push(`cycle ${c.cycle.index} has no stable shut-in (${(Math.max(0, duration) / 60).toFixed(1)} min, at least ${(minShutIn / 60).toFixed(0)} min needed)`);
      }
    }
    let worst: number | null = null;
    for (const kind of ['isip', 'closure'] as const) {
      const pair = lastTwo(cycles, kind);
      const label = kind === 'isip' ? 'ISIP' : 'closure';
      if (!pair) { notes.push(`fewer than two cycles have a${kind === 'isip' ? 'n' : ''} ${label}`); continue; }
      const a = pair[0].picks[kind]!.pressure;
      const b = pair[1].picks[kind]!.pressure;
      const d = relativeDifference(a, b);
      worst = worst === null ? d : Math.max(worst, d);
      const text = `${label} ${megapascals(a)} (cycle ${pair[0].cycle.index}) and ${megapascals(b)} (cycle ${pair[1].cycle.index}) differ by ${percent(d)}`;
      if (d > limit) problems.push(`${text}, more than ${percent(limit)}`);
      else notes.push(text);
    }
    if (problems.length > 0) {
      return { pass: false, value: worst, limit, message: `The later cycles do not confirm the first: ${problems.join('; ')}.`, unit: UNIT };
    }
    if (worst === null && !(breakdown && reopening)) {
      return { pass: null, value: null, limit, message: `The later cycles cannot be compared: ${notes.join('; ')}.`, unit: UNIT };
    }
    return { pass: true, value: worst, limit, message: `The later cycles repeat: ${notes.join('; ')}.`, unit: UNIT };
  },
};
