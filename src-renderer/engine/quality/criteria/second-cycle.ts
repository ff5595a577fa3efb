import type { CycleAnalysis, Pick } from '../../result';
import type { QualityCriterion } from './criterion';
import { megapascals } from './criterion';

/** Unit of this criterion's value and limit (CriterionResult.unit). */
const UNIT = 'ratio';

/**
 * Highest allowed reopening / breakdown ratio, exclusive: the reopening must lie below the
 * first-cycle breakdown. A physical bound, not a tunable limit: with T0 = Pb - Pr
 * (Bredehoeft et al. 1976, METHODS.md) a reopening at or above breakdown would need a
 * tensile strength of zero or less, so the later cycle opened something else (a new
 * fracture, a leak, a packer or shoe bypass) and cannot confirm the first.
 */
export const MAX_REOPENING_TO_BREAKDOWN = 1;

/** Whether a pick has a finite pressure. */
function usable(pick: Pick | undefined): pick is Pick {
  return pick !== undefined && Number.isFinite(pick.pressure);
}

/** The reopening check: its ratio and its words, or null when no pair can be compared. */
function reopeningCheck(cycles: readonly CycleAnalysis[]): { ratio: number | null; problem: string | null; note: string } {
  const breakdown = cycles.find((c) => c.cycle.index === 1)?.picks.breakdown;
  // The earliest later cycle with a reopening: the one the SHmax relation uses (stress/estimates.ts).
  const reopeningCycle = cycles.find((c) => c.cycle.index >= 2 && usable(c.picks.reopening));
  const reopening = reopeningCycle?.picks.reopening;
  if (!usable(reopening)) return { ratio: null, problem: null, note: 'no reopening was picked in a later cycle, so it cannot be compared with the breakdown' };
  if (!usable(breakdown)) return { ratio: null, problem: null, note: `no first-cycle breakdown was picked to compare the reopening ${megapascals(reopening.pressure)} with` };
  const ratio = reopening.pressure / breakdown.pressure;
  const where = `the reopening ${megapascals(reopening.pressure)} (cycle ${reopeningCycle!.cycle.index}) is ${ratio.toFixed(3)} times the breakdown ${megapascals(breakdown.pressure)} (cycle 1)`;
  if (ratio < MAX_REOPENING_TO_BREAKDOWN) return { ratio, problem: null, note: `${where}, below the first-cycle breakdown` };
  if (breakdown.bound === 'lower') {
    // The gauge clipped at the breakdown: the true breakdown was higher, by an unknown amount.
    return { ratio: null, problem: null, note: `the reopening ${megapascals(reopening.pressure)} is not below the breakdown read at the clipped gauge ${megapascals(breakdown.pressure)}, a lower bound only, so the two cannot be compared` };
  }
  return { ratio, problem: `${where}, not below the first-cycle breakdown: the later cycle opened something else and does not confirm the first`, note: '' };
}

/**
 * Second cycle (XLOT): a valid later cycle exists. Checks: (1) at least two cycles; (2) every
 * later cycle has a shut-in of at least half `shut-in-stability.minDuration` (5 min), long
 * enough to pick its ISIP and closure; (3) the reopening of the earliest later cycle that has
 * one is below the first-cycle breakdown. Value: reopening / breakdown (ratio, limit 1, must be
 * below); null when there is no reopening / breakdown pair (or the breakdown is only a lower
 * bound of a clipped gauge and the ratio is not below 1), and then the shut-in checks decide.
 * Whether ISIP and closure repeat is the separate 'cycle-repeat' criterion.
 * Common practice: two or more cycles, reopening below breakdown (METHODS.md good practice;
 * Zoback et al. 2003); reopening relation Bredehoeft et al. (1976).
 */
export const secondCycle: QualityCriterion = {
  id: 'second-cycle',
  appliesTo: ['xlot'],
  // Major: a later cycle that is missing, unsettled or reopened above breakdown leaves no valid
  // repeat of the test: no later-cycle closure to estimate Shmin, no T0 and no SHmax.
  severity: 'major',
  evaluate(ctx, limits) {
    const limit = MAX_REOPENING_TO_BREAKDOWN;
    const minShutIn = limits['shut-in-stability.minDuration'] / 2;
    const cycles = [...ctx.cycles].sort((a, b) => a.cycle.index - b.cycle.index);
    if (cycles.length < 2) {
      return { pass: false, value: null, limit, message: 'Only one cycle was found: an extended leak-off test needs a later cycle, with a settled shut-in and a reopening below the breakdown, to confirm the first.', unit: UNIT };
    }
    const problems: string[] = [];
    const notes: string[] = [];
    for (const c of cycles.slice(1)) {
      const duration = c.cycle.shutInEnd > c.cycle.pumpEnd ? ctx.time[c.cycle.shutInEnd] - ctx.time[c.cycle.pumpEnd] : 0;
      const minutes = (duration / 60).toFixed(1);
      if (duration < minShutIn) problems.push(`cycle ${c.cycle.index} has no stable shut-in: ${minutes} min, at least ${(minShutIn / 60).toFixed(0)} min needed`);
      else notes.push(`cycle ${c.cycle.index} was shut in for ${minutes} min, long enough (at least ${(minShutIn / 60).toFixed(0)} min)`);
    }
    const reopening = reopeningCheck(cycles);
    if (reopening.problem) problems.push(reopening.problem);
    else notes.push(reopening.note);
    if (problems.length > 0) {
      const also = notes.length > 0 ? ` Other checks: ${notes.join('; ')}.` : '';
      return { pass: false, value: reopening.ratio, limit, message: `The later cycles are not a valid repeat: ${problems.join('; ')}.${also}`, unit: UNIT };
    }
    const message = reopening.ratio === null
      ? `The later cycles have settled shut-ins, but the reopening was not checked against the breakdown: ${notes.join('; ')}.`
      : `A valid later cycle exists: ${notes.join('; ')}.`;
    return { pass: true, value: reopening.ratio, limit, message, unit: UNIT };
  },
};
