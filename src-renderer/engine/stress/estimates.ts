/**
 * Stress estimates at the tested depth from one analysed test: Shmin from the best pick
 * by the hierarchy of METHODS.md ("Leak-off test events and which one estimates Shmin"),
 * Pp and Sv from metadata or stated default gradients, SHmax bounded by the frictional
 * limit (Zoback 2007 ch. 4) and, where a valid later cycle exists, from the reopening
 * relation (Bredehoeft et al. 1976) with the record's detectability check and cautions.
 *
 * Every value is for review by a qualified engineer; it is not a substitute for the
 * operator's well-control policy and defers to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { AnalysisContext, CycleAnalysis, Pick, PickKind, ShminKind, StressEstimates } from '../result';
import { fractureDetectability } from './detectability';
import { DEFAULT_FRICTION_COEFFICIENT, shmaxBoundsFromShmin } from './frictional';
import { shmaxFromReopening, tensileStrengthFromPicks } from './kirsch';

/** Default pore-pressure gradient, Pa/m: hydrostatic 10.0 kPa/m (common practice; between 9.79 fresh and 10.52 brine, METHODS.md). */
export const DEFAULT_PORE_PRESSURE_GRADIENT = 10.0e3;
/** Default overburden gradient, Pa/m: 1 psi/ft = 6894.757 Pa / 0.3048 m (common practice, METHODS.md). */
export const DEFAULT_OVERBURDEN_GRADIENT = 6894.757293168361 / 0.3048;

export interface StressEstimateOptions {
  /** Friction coefficient for the stress polygon, default 0.6. */
  frictionCoefficient?: number;
  /** Where metadata Pp and Sv came from: 'given' (command line / engineer, default) or 'file'. */
  metadataSource?: { porePressure?: 'given' | 'file'; verticalStress?: 'given' | 'file' };
  /** Assumed crack aperture (m) and height (m) for the detectability check. */
  crackAperture?: number;
  crackHeight?: number;
}

/** One rung of the Shmin hierarchy: which pick, which cycles, what it means, how to choose among cycles. */
interface ShminRung {
  kind: PickKind;
  cycles: 'later' | 'first' | 'any';
  meaning: ShminKind;
  choose: 'latest' | 'lowest' | 'highest' | 'earliest';
}

/**
 * The Shmin hierarchy, best first (METHODS.md; White et al. 2002; Zoback et al. 2003):
 * closure of a second or later cycle, closure of the first cycle, ISIP (a close upper
 * bound, reported as 'upper-bound'), propagation (upper bound), step-rate extension
 * (estimate; friction caveat), leak-off (estimate, low confidence), FIT maximum (lower bound).
 * Several upper bounds: the lowest is the tightest; several lower bounds: the highest.
 */
export const SHMIN_HIERARCHY: readonly ShminRung[] = [
  { kind: 'closure', cycles: 'later', meaning: 'estimate', choose: 'latest' },
  { kind: 'closure', cycles: 'first', meaning: 'estimate', choose: 'latest' },
  { kind: 'isip', cycles: 'any', meaning: 'upper-bound', choose: 'lowest' },
  { kind: 'propagation', cycles: 'any', meaning: 'upper-bound', choose: 'lowest' },
  { kind: 'extension', cycles: 'any', meaning: 'estimate', choose: 'latest' },
  { kind: 'leakOff', cycles: 'any', meaning: 'estimate', choose: 'earliest' },
  { kind: 'fitMaximum', cycles: 'any', meaning: 'lower-bound', choose: 'highest' },
];

function usablePick(pick: Pick | undefined): pick is Pick {
  return pick !== undefined && Number.isFinite(pick.pressure);
}

/**
 * Shmin from the best available pick by SHMIN_HIERARCHY.
 *
 * @param cycles analysed cycles with their picks (pressures downhole, Pa).
 * @returns {value Pa, kind, from, cycle} or null when no pick on the hierarchy exists.
 * @throws nothing.
 * @example shminFromPicks(ctx.cycles) // {value: 34e6, kind: 'estimate', from: 'closure', cycle: 2}
 */
export function shminFromPicks(cycles: readonly CycleAnalysis[]): StressEstimates['shmin'] {
  for (const rung of SHMIN_HIERARCHY) {
    const candidates: { pick: Pick; cycle: number }[] = [];
    for (const c of cycles) {
      const n = c.cycle.index;
      if (rung.cycles === 'later' && n < 2) continue;
      if (rung.cycles === 'first' && n !== 1) continue;
      const pick = c.picks[rung.kind];
      if (usablePick(pick)) candidates.push({ pick, cycle: n });
    }
    if (candidates.length === 0) continue;
    let chosen = candidates[0];
    for (const cand of candidates) {
      if (rung.choose === 'latest' && cand.cycle > chosen.cycle) chosen = cand;
      if (rung.choose === 'earliest' && cand.cycle < chosen.cycle) chosen = cand;
      if (rung.choose === 'lowest' && cand.pick.pressure < chosen.pick.pressure) chosen = cand;
      if (rung.choose === 'highest' && cand.pick.pressure > chosen.pick.pressure) chosen = cand;
    }
    return { value: chosen.pick.pressure, kind: rung.meaning, from: rung.kind, cycle: chosen.cycle };
  }
  return null;
}

function referenceValue(
  given: number | undefined,
  source: 'given' | 'file' | undefined,
  depth: number | undefined,
  gradient: number,
  name: string,
): StressEstimates['pp'] {
  if (given !== undefined && Number.isFinite(given)) return { value: given, source: source ?? 'given' };
  if (depth === undefined || !Number.isFinite(depth) || depth <= 0) {
    throw new EngineError('bad-metadata', `no ${name} and no TVD to apply the default gradient to`, {}, `the ${name} at test depth or the TVD of the test`);
  }
  return { value: gradient * depth, source: 'default-gradient', gradient };
}

const RELIABILITY_CAUTION =
  'Low confidence: a freshly opened fracture takes fluid before the pressure curve departs visibly from its loading line, ' +
  'because the compressibility of the whole pressurised volume hides its small volume; the reopening pick is therefore late ' +
  '(too high), which makes SHmax from the reopening relation too low (Ito et al. 1999, IJRMMS 36(6), from memory).';

/**
 * Stress estimates for one analysed test.
 *
 * Shmin: shminFromPicks. Pp and Sv: metadata porePressure / verticalStress when present,
 * else 10.0 kPa/m and 1 psi/ft times TVD (source 'default-gradient', gradient stated).
 * SHmax: frictional-limit bounds always (mu default 0.6); a value from SHmax = 3 Shmin - Pr - Pp
 * only with a Shmin estimate and a reopening pick in cycle 2 or later that lies below the
 * first-cycle breakdown; always with the detectability check and cautions.
 * T0 = Pb - Pr when both picks exist and Pr < Pb.
 *
 * @param ctx analysis context (pressures downhole, Pa; TVD in metadata, m).
 * @param options frictionCoefficient (0 < mu <= 2), metadata source tags, crack geometry.
 * @returns StressEstimates (shmin and shmax null when no pick estimates Shmin).
 * @throws EngineError 'bad-metadata' when Pp or Sv is unknown and no TVD is given;
 *   'out-of-range' for a bad friction coefficient.
 * @example estimateStresses(ctx).shmin // {value: 34e6, kind: 'estimate', from: 'closure', cycle: 2}
 */
export function estimateStresses(ctx: AnalysisContext, options: StressEstimateOptions = {}): StressEstimates {
  const mu = options.frictionCoefficient ?? DEFAULT_FRICTION_COEFFICIENT;
  const meta = ctx.metadata;
  const pp = referenceValue(meta.porePressure, options.metadataSource?.porePressure, meta.depthTvd, DEFAULT_PORE_PRESSURE_GRADIENT, 'pore pressure');
  const sv = referenceValue(meta.verticalStress, options.metadataSource?.verticalStress, meta.depthTvd, DEFAULT_OVERBURDEN_GRADIENT, 'vertical stress');
  const shmin = shminFromPicks(ctx.cycles);
  const firstCycle = ctx.cycles.find((c) => c.cycle.index === 1);
  const breakdown = firstCycle?.picks.breakdown;
  const reopeningCycle = ctx.cycles
    .filter((c) => c.cycle.index >= 2 && usablePick(c.picks.reopening))
    .sort((a, b) => a.cycle.index - b.cycle.index)[0];
  const reopening = reopeningCycle?.picks.reopening;

  let tensileStrength: number | null = null;
  const cautions: string[] = [];
  if (usablePick(breakdown) && usablePick(reopening)) {
    const t0 = tensileStrengthFromPicks(breakdown.pressure, reopening.pressure);
    if (t0 >= 0) tensileStrength = t0;
    else cautions.push('The reopening pick is above the first-cycle breakdown: the later cycle is not valid, so neither T0 nor SHmax is derived from it.');
  }

  if (shmin === null) {
    return { shmin: null, shmax: null, sv, pp, frictionCoefficient: mu, tensileStrength };
  }

  const bounds = shmaxBoundsFromShmin(shmin.value, shmin.kind, sv.value, pp.value, mu);
  cautions.push(...bounds.notes);
  let value: number | null = null;
  let method = `frictional-limit (mu ${mu})`;
  let detectability = null;
  if (reopeningCycle && usablePick(reopening)) {
    const fit = reopeningCycle.loadingFit ?? firstCycle?.loadingFit ?? null;
    detectability = fit
      ? fractureDetectability({
        loadingFit: fit,
        gaugeResolution: meta.gaugeResolution,
        holeDiameter: meta.holeDiameter,
        openHoleLength: meta.openHoleLength,
        aperture: options.crackAperture,
        height: options.crackHeight,
      })
      : null;
    const validCycle = !usablePick(breakdown) || reopening.pressure < breakdown.pressure;
    if (shmin.kind !== 'estimate') {
      cautions.push(`No SHmax from the reopening relation: Shmin is only a${shmin.kind === 'upper-bound' ? 'n upper' : ' lower'} bound (from ${shmin.from}).`);
    } else if (validCycle) {
      value = shmaxFromReopening({ shmin: shmin.value, reopening: reopening.pressure, porePressure: pp.value });
      method = `reopening-relation (cycle ${reopeningCycle.cycle.index}) with frictional-limit bounds (mu ${mu})`;
      cautions.push(RELIABILITY_CAUTION);
      if (detectability) cautions.push(detectability.message);
      else cautions.push('The detectability of the reopening could not be computed (no loading fit): treat SHmax from the reopening relation as unverified.');
      if (value < bounds.low || value > bounds.high) {
        cautions.push(`SHmax from the reopening relation (${(value / 1e6).toFixed(2)} MPa) lies outside the frictional bounds ${(bounds.low / 1e6).toFixed(2)}-${(bounds.high / 1e6).toFixed(2)} MPa.`);
      }
    }
  } else {
    cautions.push('No reopening pick in a second or later cycle: SHmax is bounded by the frictional limit only.');
  }
  if (shmin.from === 'extension') cautions.push('Shmin from the step-rate extension pressure includes near-well friction and may sit above the closure stress (common practice).');
  if (shmin.from === 'leakOff') cautions.push('Shmin from the leak-off point is a low-confidence estimate: the leak-off can reflect the wall stress concentration and filtration, not the far-field stress (White et al. 2002).');
  if (shmin.from === 'isip' || shmin.from === 'propagation') cautions.push(`Shmin from the ${shmin.from === 'isip' ? 'ISIP' : 'propagation pressure'} is an upper bound; the closure stress is lower.`);
  return {
    shmin,
    shmax: { value, low: bounds.low, high: bounds.high, method, cautions, detectability },
    sv,
    pp,
    frictionCoefficient: mu,
    tensileStrength,
  };
}
