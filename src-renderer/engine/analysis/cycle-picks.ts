/**
 * Assembles the picks of every cycle for a test type: loading events from
 * loading-picks.ts, ISIP and closure from the shut-in decline (shut-in.ts), the SRT
 * extension from the step-rate analysis (step-rate.ts). Which picks apply to which type
 * follows METHODS.md ("Leak-off test events"): a pick that does not apply is absent.
 *
 *   fit   fitMaximum (and leakOff if the record shows one anyway); no ISIP or closure: no
 *         fracture was opened, so the shut-in decline says nothing about Shmin
 *   lot   leakOff, breakdown, propagation, isip, closure
 *   xlot  as lot in cycle 1; reopening, propagation, isip, closure in later cycles
 *   dfit  leakOff, breakdown, propagation, isip, closure
 *   srt   extension, isip, closure
 * A breakdown is looked for only until one cycle has broken down; a reopening is the
 * departure in a later cycle; when it is not below the earlier breakdown (or the earlier
 * peak when no cycle broke down) it is kept, with a warning, for the quality grading to judge.
 *
 * Shut-ins longer than 20,000 samples are thinned first (shut-in-input.ts), keeping the
 * early decline as recorded; pick sample indices refer to the record either way.
 *
 * Primary closure: the first available of 'g-dpdg-tangent', 'compliance', 'sqrt-time',
 * 'bilinear-dpdt' (the order of shut-in.ts), leaving out candidates marked `gradual`; every
 * candidate is kept with the spread.
 */
import type { TestType } from '../record';
import type { ClosureCandidate, Cycle, CycleAnalysis, Pick } from '../result';
import { LOADING_METHODS, pickAt, type LoadingFeatures } from './loading-picks';
import { CLOSURE_METHODS, closureCandidates, closureSpread, isipPick } from './shut-in';
import { reducedShutIn } from './shut-in-input';
import { stepRateAnalysis } from './step-rate';

/** Closure methods in order of preference for the cycle's primary closure pick (shut-in.ts order). */
export const CLOSURE_PREFERENCE: readonly string[] = CLOSURE_METHODS;

/** Inputs of {@link assembleCyclePicks}: SI arrays of the record and the per-cycle results. */
export interface CyclePickInput {
  type: TestType;
  time: Float64Array;
  /** Downhole pressure, Pa. */
  pressure: Float64Array;
  /** Pump rate, m3/s. */
  rate: Float64Array;
  cycles: Cycle[];
  features: LoadingFeatures[];
  /** Expected loading slope, Pa/m3, or null. */
  expectedSlope: number | null;
}

/**
 * The analysed cycles with their picks for the given test type.
 *
 * @param input type, record arrays (s, Pa, m3/s), cycles and their loading features
 *   (same order), expected slope (Pa/m3) or null.
 * @param warnings receives plain-language warnings (e.g. a reopening above the breakdown).
 * @returns one CycleAnalysis per cycle, in order.
 * @throws EngineError from the shut-in or step-rate methods for broken inputs only.
 * @example assembleCyclePicks({ type: 'xlot', time, pressure, rate, cycles, features, expectedSlope: null })[1].picks.reopening
 */
export function assembleCyclePicks(input: CyclePickInput, warnings: string[] = []): CycleAnalysis[] {
  const { type, time, pressure, rate, cycles, features } = input;
  const out: CycleAnalysis[] = [];
  let earlierBreakdown: number | null = null;
  let earlierPeak = -Infinity;
  for (let c = 0; c < cycles.length; c++) {
    const cycle = cycles[c];
    const f = features[c];
    const picks: CycleAnalysis['picks'] = {};
    const later = c > 0;
    const breakdownAllowed = type !== 'srt' && type !== 'fit' && earlierBreakdown === null;
    const hasBreakdown = breakdownAllowed && f.breakdownIndex !== null;
    const departureBeforeBreakdown = f.departureIndex !== null && (!hasBreakdown || f.departureIndex < (f.breakdownIndex as number));

    if (type === 'fit') {
      picks.fitMaximum = pickAt('fitMaximum', f.peakIndex, time, pressure, LOADING_METHODS.fitMaximum);
      if (f.departureIndex !== null && f.departureIndex <= f.peakIndex) {
        picks.leakOff = pickAt('leakOff', f.departureIndex, time, pressure, LOADING_METHODS.leakOff);
      }
    } else if (type !== 'srt') {
      if (later && departureBeforeBreakdown) {
        const index = f.departureIndex as number;
        picks.reopening = pickAt('reopening', index, time, pressure, LOADING_METHODS.reopening);
        const ceiling = earlierBreakdown ?? earlierPeak;
        if (pressure[index] >= ceiling) {
          warnings.push(`cycle ${cycle.index} departs from its loading line at ${(pressure[index] / 1e6).toFixed(2)} MPa, not below the earlier ${earlierBreakdown !== null ? 'breakdown' : 'peak'} of ${(ceiling / 1e6).toFixed(2)} MPa: not a valid reopening`);
        }
      } else if (!later && departureBeforeBreakdown) {
        picks.leakOff = pickAt('leakOff', f.departureIndex as number, time, pressure, LOADING_METHODS.leakOff);
      }
      if (hasBreakdown) picks.breakdown = pickAt('breakdown', f.breakdownIndex as number, time, pressure, LOADING_METHODS.breakdown);
      if (f.plateau && (hasBreakdown || picks.leakOff || picks.reopening)) {
        const middle = (f.plateau.start + f.plateau.end) >>> 1;
        picks.propagation = pickAt('propagation', middle, time, pressure, LOADING_METHODS.propagation, f.plateau.pressure);
      }
    }

    let stepRate: CycleAnalysis['stepRate'];
    if (type === 'srt') {
      stepRate = stepRateAnalysis(time, pressure, rate, cycle);
      const extension = stepRate.extension;
      if (extension) picks.extension = extensionPick(extension, stepRate.steps, time);
    }

    let candidates: ClosureCandidate[] = [];
    let spread: number | null = null;
    if (cycle.shutInEnd > cycle.pumpEnd && type !== 'fit') {
      const reduced = reducedShutIn(time, pressure, cycle);
      const toRecord = (index: number): number => (reduced ? reduced.indexMap[index] : index);
      const isip = reduced ? isipPick(reduced.time, reduced.pressure, reduced.cycle) : isipPick(time, pressure, cycle);
      if (isip) picks.isip = { ...isip, sampleIndex: toRecord(isip.sampleIndex) };
      candidates = (reduced ? closureCandidates(reduced.time, reduced.pressure, reduced.cycle) : closureCandidates(time, pressure, cycle))
        .map((k) => ({ ...k, sampleIndex: toRecord(k.sampleIndex) }));
      spread = candidates.length >= 2 ? closureSpread(candidates) : null;
      const primary = primaryClosure(candidates);
      if (primary) picks.closure = { kind: 'closure', pressure: primary.pressure, time: primary.time, method: primary.method, sampleIndex: primary.sampleIndex };
    }

    if (picks.breakdown) earlierBreakdown = picks.breakdown.pressure;
    earlierPeak = Math.max(earlierPeak, pressure[f.peakIndex]);
    out.push({
      cycle,
      loadingFit: f.fit,
      expectedSlope: input.expectedSlope,
      picks,
      closureCandidates: candidates,
      closureSpread: spread,
      ...(stepRate ? { stepRate } : {}),
    });
  }
  return out;
}

/**
 * The preferred closure candidate by {@link CLOSURE_PREFERENCE}; methods not in the list
 * come after, in their given order. Candidates marked `gradual` (a method whose own model
 * does not hold, shut-in.ts) are never chosen: no closure pick beats a wrong one, and Shmin
 * then falls back along its hierarchy.
 * @param candidates closure picks of one cycle. @returns the primary one, or null when empty or all are marked gradual.
 * @example primaryClosure([{ method: 'sqrt-time', ... }, { method: 'g-dpdg-tangent', ... }]).method // 'g-dpdg-tangent'
 */
export function primaryClosure(candidates: readonly ClosureCandidate[]): ClosureCandidate | null {
  let best: ClosureCandidate | null = null;
  let bestRank = Infinity;
  for (const c of candidates) {
    if (c.gradual) continue;
    const found = CLOSURE_PREFERENCE.indexOf(c.method);
    const rank = found >= 0 ? found : CLOSURE_PREFERENCE.length;
    if (rank < bestRank) {
      best = c;
      bestRank = rank;
    }
  }
  return best;
}

/** Extension pick at the end of the step whose rate is nearest the break rate. */
function extensionPick(extension: { rate: number; pressure: number }, steps: { rate: number; endIndex: number }[], time: Float64Array): Pick {
  let nearest = steps[0];
  for (const s of steps) if (Math.abs(s.rate - extension.rate) < Math.abs(nearest.rate - extension.rate)) nearest = s;
  const index = nearest ? nearest.endIndex : 0;
  return { kind: 'extension', pressure: extension.pressure, time: time[index], method: 'step-rate-line-intersection', sampleIndex: index, rate: extension.rate };
}
