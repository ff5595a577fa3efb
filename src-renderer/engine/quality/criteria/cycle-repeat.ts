import type { CycleAnalysis } from '../../result';
import type { QualityCriterion } from './criterion';
import { megapascals, notJudged, percent } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'fraction';

/** |a - b| over their mean (both positive pressures). */
function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / ((a + b) / 2);
}

/** The last two cycles that both have a pick of this kind. */
function lastTwo(cycles: readonly CycleAnalysis[], kind: 'isip' | 'closure'): [CycleAnalysis, CycleAnalysis] | null {
  const withPick = cycles.filter((c) => Number.isFinite(c.picks[kind]?.pressure)).sort((a, b) => a.cycle.index - b.cycle.index);
  if (withPick.length < 2) return null;
  return [withPick[withPick.length - 2], withPick[withPick.length - 1]];
}

/**
 * Cycle repeat (XLOT): ISIP and closure of the last two cycles that have them differ by at
 * most `cycle-repeat.maxRepeatDifference` (5 %) of their mean. Value: the larger of the two
 * relative differences (fraction); judged on whichever of ISIP and closure has a pair, not
 * judged (pass null) when neither has. Whether a valid later cycle exists at all is the
 * 'second-cycle' criterion. Common practice: ISIP and closure repeating over two or more
 * cycles (METHODS.md good practice; Zoback et al. 2003); agreement of picks as a quality
 * signal (ISRM SM Part 3, Haimson & Cornet 2003).
 */
export const cycleRepeat: QualityCriterion = {
  id: 'cycle-repeat',
  appliesTo: ['xlot'],
  // Minor: Shmin is still taken from the latest closure; cycles that do not repeat lower the
  // confidence in it (the fracture may still be growing, or a pick is off) without making the
  // test invalid, as pick-agreement does for disagreeing closure methods.
  severity: 'minor',
  evaluate(ctx, limits) {
    const limit = limits['cycle-repeat.maxRepeatDifference'];
    const problems: string[] = [];
    const notes: string[] = [];
    let worst: number | null = null;
    for (const kind of ['isip', 'closure'] as const) {
      const label = kind === 'isip' ? 'ISIP' : 'closure';
      const pair = lastTwo(ctx.cycles, kind);
      if (!pair) { notes.push(`fewer than two cycles have a${kind === 'isip' ? 'n' : ''} ${label} pick`); continue; }
      const a = pair[0].picks[kind]!.pressure;
      const b = pair[1].picks[kind]!.pressure;
      const d = relativeDifference(a, b);
      worst = worst === null ? d : Math.max(worst, d);
      const text = `${label} ${megapascals(a)} (cycle ${pair[0].cycle.index}) and ${megapascals(b)} (cycle ${pair[1].cycle.index}) differ by ${percent(d)}`;
      if (d > limit) problems.push(`${text}, more than ${percent(limit)}`);
      else notes.push(`${text} (limit ${percent(limit)})`);
    }
    if (worst === null) return notJudged(`ISIP and closure cannot be compared between cycles: ${notes.join('; ')}.`, limit, UNIT);
    if (problems.length > 0) {
      const also = notes.length > 0 ? ` Other checks: ${notes.join('; ')}.` : '';
      return { pass: false, value: worst, limit, message: `The cycles do not repeat: ${problems.join('; ')}; the fracture may still be growing, or a pick needs checking by hand.${also}`, unit: UNIT };
    }
    return { pass: true, value: worst, limit, message: `The cycles repeat: ${notes.join('; ')}.`, unit: UNIT };
  },
};
