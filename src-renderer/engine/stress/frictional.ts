/**
 * Frictional limits on stress magnitudes and the Anderson faulting regime: the
 * stress polygon of Zoback, Reservoir Geomechanics (2007), ch. 4, after Jaeger & Cook.
 * Compression positive, effective stress S - Pp (Biot coefficient 1), all in Pa at the
 * tested depth.
 *
 * Bounds are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { ShminKind } from '../result';

/** Friction coefficient used when none is given (Byerlee range 0.6-1.0; Zoback 2007 ch. 4). */
export const DEFAULT_FRICTION_COEFFICIENT = 0.6;

export type StressRegime = 'normal' | 'strike-slip' | 'reverse' | 'undetermined';

function requireFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) {
    throw new EngineError('bad-argument', `${name} is not a finite number (${value})`, {}, `a finite ${name} in Pa`);
  }
}

/**
 * Frictional limit factor q = [sqrt(mu^2 + 1) + mu]^2, the largest ratio of effective
 * principal stresses (S1 - Pp)/(S3 - Pp) that optimally oriented faults with friction mu
 * can sustain (Jaeger & Cook; Zoback 2007 ch. 4, eq. 4.45).
 *
 * @param frictionCoefficient mu, dimensionless, 0 < mu <= 2 (Byerlee 0.6-1.0).
 * @returns q, dimensionless (3.12 for 0.6, 3.69 for 0.7, 5.83 for 1.0).
 * @throws EngineError 'out-of-range' for mu outside (0, 2] or not finite.
 * @example frictionalLimitFactor(0.6) // 3.1194
 */
export function frictionalLimitFactor(frictionCoefficient: number): number {
  const mu = frictionCoefficient;
  if (!Number.isFinite(mu) || mu <= 0 || mu > 2) {
    throw new EngineError('out-of-range', `friction coefficient ${mu} is outside (0, 2]`, {}, 'a friction coefficient between 0 and 2');
  }
  const root = Math.sqrt(mu * mu + 1) + mu;
  return root * root;
}

/**
 * Lower bound on Shmin from normal faulting at the frictional limit:
 * Shmin >= Pp + (Sv - Pp)/q (Zoback 2007 ch. 4).
 *
 * @param verticalStress Sv, Pa, > Pp.
 * @param porePressure Pp, Pa, >= 0.
 * @param q frictional limit factor (frictionalLimitFactor), >= 1.
 * @returns Pa.
 * @throws EngineError 'bad-argument' for non-finite values or q < 1.
 * @example shminLowerBound(45e6, 20e6, 3.12) // 28.01e6
 */
export function shminLowerBound(verticalStress: number, porePressure: number, q: number): number {
  requireFinite('vertical stress', verticalStress);
  requireFinite('pore pressure', porePressure);
  if (!Number.isFinite(q) || q < 1) throw new EngineError('bad-argument', `frictional limit factor ${q} is below 1`, {}, 'q >= 1');
  return porePressure + (verticalStress - porePressure) / q;
}

/** SHmax bounds from the stress polygon. */
export interface ShmaxBounds {
  /** Lowest SHmax consistent with the data, Pa. */
  low: number;
  /** Highest SHmax faults at the frictional limit allow, Pa. */
  high: number;
  /** Frictional limit factor used. */
  q: number;
  /** Shmin lower bound Pp + (Sv - Pp)/q, Pa. */
  shminLowerBound: number;
  /** Plain-language notes on how the kind of Shmin value limits the bounds. */
  notes: string[];
}

/**
 * SHmax bounds from the stress polygon (Zoback 2007 ch. 4) for a given Shmin value.
 * With Shmin an estimate: SHmax >= Shmin and SHmax <= Pp + q (min(Shmin, Sv) - Pp)
 * (strike-slip limit when Shmin < Sv, reverse limit with Sv as S3 otherwise).
 * With Shmin an upper bound u: SHmax >= Pp + (Sv - Pp)/q (the least Shmin normal faults
 * allow) and SHmax <= Pp + q (min(u, Sv) - Pp). With Shmin a lower bound l (FIT):
 * SHmax >= l and SHmax <= Pp + q (Sv - Pp), the absolute limit with S3 <= Sv.
 *
 * @param shmin Shmin value, Pa (estimate or bound, see kind).
 * @param kind how the Shmin value bounds the true Shmin.
 * @param verticalStress Sv, Pa.
 * @param porePressure Pp, Pa, below Shmin and Sv for meaningful bounds.
 * @param frictionCoefficient mu, default 0.6.
 * @returns {low, high, q, shminLowerBound, notes}; low may exceed high when the inputs are inconsistent (a note says so).
 * @throws EngineError 'bad-argument' for non-finite values; 'out-of-range' for a bad mu.
 * @example shmaxBoundsFromShmin(34e6, 'estimate', 45.2e6, 20e6) // {low: 34e6, high: 63.67e6, ...}
 */
export function shmaxBoundsFromShmin(
  shmin: number,
  kind: ShminKind,
  verticalStress: number,
  porePressure: number,
  frictionCoefficient = DEFAULT_FRICTION_COEFFICIENT,
): ShmaxBounds {
  requireFinite('Shmin', shmin);
  requireFinite('vertical stress', verticalStress);
  requireFinite('pore pressure', porePressure);
  const q = frictionalLimitFactor(frictionCoefficient);
  const lowerShmin = shminLowerBound(verticalStress, porePressure, q);
  const notes: string[] = [];
  let low: number;
  let high: number;
  if (kind === 'estimate') {
    low = shmin;
    high = porePressure + q * (Math.min(shmin, verticalStress) - porePressure);
  } else if (kind === 'upper-bound') {
    low = lowerShmin;
    high = porePressure + q * (Math.min(shmin, verticalStress) - porePressure);
    notes.push('Shmin is only bounded from above, so the lower SHmax bound is the frictional lower bound on Shmin, not the measured value.');
  } else {
    low = shmin;
    high = porePressure + q * (verticalStress - porePressure);
    notes.push('Shmin is only bounded from below (no leak-off reached), so the upper SHmax bound is the absolute frictional limit Pp + q (Sv - Pp).');
  }
  if (shmin < lowerShmin && kind !== 'upper-bound') {
    notes.push(`Shmin is below the frictional lower bound Pp + (Sv - Pp)/q = ${(lowerShmin / 1e6).toFixed(2)} MPa: check Sv, Pp and the pick.`);
  }
  if (low > high) notes.push('The lower SHmax bound exceeds the upper one: Shmin, Sv and Pp are not consistent with frictional equilibrium.');
  return { low, high, q, shminLowerBound: lowerShmin, notes };
}

/**
 * Anderson faulting regime from Shmin, an SHmax range and Sv (Anderson 1951; Zoback 2007
 * ch. 4): normal Sv >= SHmax >= Shmin, strike-slip SHmax >= Sv >= Shmin, reverse
 * SHmax >= Shmin >= Sv. 'undetermined' when the SHmax range straddles Sv.
 *
 * @param shmin Pa.
 * @param shmaxLow Pa, <= shmaxHigh (pass the same value twice for a single SHmax).
 * @param shmaxHigh Pa.
 * @param verticalStress Sv, Pa.
 * @returns the regime.
 * @throws EngineError 'bad-argument' for non-finite values or shmaxLow > shmaxHigh.
 * @example classifyStressRegime(34e6, 47e6, 47e6, 45e6) // 'strike-slip'
 */
export function classifyStressRegime(shmin: number, shmaxLow: number, shmaxHigh: number, verticalStress: number): StressRegime {
  requireFinite('Shmin', shmin);
  requireFinite('SHmax low', shmaxLow);
  requireFinite('SHmax high', shmaxHigh);
  requireFinite('vertical stress', verticalStress);
  if (shmaxLow > shmaxHigh) {
    throw new EngineError('bad-argument', 'SHmax low is above SHmax high', {}, 'shmaxLow <= shmaxHigh');
  }
  if (shmin >= verticalStress) return 'reverse';
  if (shmaxHigh <= verticalStress) return 'normal';
  if (shmaxLow >= verticalStress) return 'strike-slip';
  return 'undetermined';
}
