/**
 * SHmax along the depth axis of the regional model: the stress-polygon bounds at every
 * depth (frictional limit, Zoback 2007 ch. 4, via stress/frictional), and the
 * reopening-relation estimates of accepted multi-cycle tests as separate points, each
 * with its cautions (Bredehoeft et al. 1976 relation; late-pick caution after Ito et al.
 * 1999; the record's own detectability check, METHODS.md). Pa throughout.
 */
import { EngineError } from '../errors';
import {
  DEFAULT_FRICTION_COEFFICIENT,
  classifyStressRegime,
  shmaxBoundsFromShmin,
  type StressRegime,
} from '../stress/frictional';

/** Caution attached to every SHmax from the reopening relation (METHODS.md, "Limits of the reopening route"). */
export const REOPENING_CAUTION =
  'SHmax from the reopening relation (SHmax = 3 Shmin - Pr - Pp) is unreliable when the reopening pick is late: ' +
  'a fracture takes fluid before the pressure curve departs visibly from its loading line, more so with a large, ' +
  'compliant pressurised volume (Ito et al. 1999). Treat it as indicative only.';

/** SHmax bounds and faulting regime at one depth. */
export interface ShmaxBoundsAtDepth {
  /** Pa. */
  low: number;
  high: number;
  /** Least Shmin frictional equilibrium allows, Pp + (Sv - Pp)/q, Pa. */
  shminLowerBound: number;
  regime: StressRegime;
  /** Plain-language description of what the regime can be, e.g. "normal or strike-slip". */
  regimeText: string;
  notes: string[];
}

/**
 * SHmax bounds from the stress polygon at a depth where Shmin is estimated:
 * Shmin <= SHmax <= Pp + q (min(Shmin, Sv) - Pp), q = [sqrt(mu^2 + 1) + mu]^2
 * (Zoback 2007 ch. 4), and the Anderson regime where the bounds tell it.
 *
 * @param shmin Shmin estimate, Pa. @param verticalStress Sv, Pa. @param porePressure Pp, Pa.
 * @param frictionCoefficient mu in (0, 2], default 0.6.
 * @returns bounds, regime and notes (inconsistent inputs are notes, not errors).
 * @throws EngineError 'bad-argument' for non-finite values; 'out-of-range' for a bad mu.
 * @example shmaxBoundsAtDepth(34e6, 45.2e6, 20e6).high // 63.67e6
 */
export function shmaxBoundsAtDepth(
  shmin: number,
  verticalStress: number,
  porePressure: number,
  frictionCoefficient = DEFAULT_FRICTION_COEFFICIENT,
): ShmaxBoundsAtDepth {
  const b = shmaxBoundsFromShmin(shmin, 'estimate', verticalStress, porePressure, frictionCoefficient);
  const notes = [...b.notes];
  let regime: StressRegime = 'undetermined';
  let regimeText = 'not determined (bounds inconsistent)';
  if (b.low <= b.high) {
    regime = classifyStressRegime(shmin, b.low, b.high, verticalStress);
    regimeText = regime === 'undetermined'
      ? (shmin < verticalStress ? 'normal or strike-slip' : 'not determined')
      : regime;
  }
  return { low: b.low, high: b.high, shminLowerBound: b.shminLowerBound, regime, regimeText, notes };
}

/** An SHmax value from the reopening relation of one test, shown as a point. */
export interface ReopeningPoint {
  testId: string;
  well: string;
  tvd: number;
  /** SHmax = 3 Shmin - Pr - Pp, Pa. */
  shmax: number;
  /** Regime if this SHmax held, given Shmin and Sv at the depth. */
  regime: StressRegime;
  /** Whether the value lies inside the polygon bounds at its depth. */
  insideBounds: boolean;
  cautions: string[];
}

/**
 * A reopening-relation SHmax as a model point, with {@link REOPENING_CAUTION} and the
 * test's own cautions (detectability) attached, the regime it implies and whether it
 * lies inside the frictional bounds.
 *
 * @param input testId, well, tvd (m), shmax (Pa), the test's cautions.
 * @param shmin Shmin at that depth, Pa (the test's or the trend's). @param verticalStress Sv, Pa.
 * @param porePressure Pp, Pa. @param frictionCoefficient mu, default 0.6.
 * @returns the point.
 * @throws EngineError 'bad-argument' for a non-finite SHmax or depth.
 * @example reopeningPoint({ testId: 't1', well: 'HF-2', tvd: 2033, shmax: 41e6, cautions: [] }, 33.6e6, 45e6, 20e6)
 */
export function reopeningPoint(
  input: { testId: string; well: string; tvd: number; shmax: number; cautions: string[] },
  shmin: number,
  verticalStress: number,
  porePressure: number,
  frictionCoefficient = DEFAULT_FRICTION_COEFFICIENT,
): ReopeningPoint {
  if (!Number.isFinite(input.shmax) || !Number.isFinite(input.tvd)) {
    throw new EngineError('bad-argument', `test ${input.testId}: SHmax ${input.shmax} Pa at ${input.tvd} m is not usable`, {}, 'finite SHmax and TVD');
  }
  const bounds = shmaxBoundsFromShmin(shmin, 'estimate', verticalStress, porePressure, frictionCoefficient);
  const cautions = [REOPENING_CAUTION, ...input.cautions.filter((c) => c !== REOPENING_CAUTION)];
  const insideBounds = input.shmax >= bounds.low && input.shmax <= bounds.high;
  if (!insideBounds) cautions.push('This SHmax lies outside the frictional bounds at its depth.');
  return {
    testId: input.testId,
    well: input.well,
    tvd: input.tvd,
    shmax: input.shmax,
    regime: classifyStressRegime(shmin, input.shmax, input.shmax, verticalStress),
    insideBounds,
    cautions,
  };
}
