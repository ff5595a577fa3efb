/**
 * Published Shmin / fracture-gradient correlations, used as reference curves beside a
 * regional model (never in place of it): Breckels & van Eekelen (1982) and Eaton (1969).
 * Both were fitted in oilfield units (psi, ft); the SI wrappers convert exactly (psi and ft
 * from NIST SP 811 via units/unitDefinitions).
 */
import { EngineError } from '../errors';
import { FOOT, PSI } from '../units/unitDefinitions';

/** Depth, ft, where Breckels & van Eekelen switch from the power law to the straight line. */
export const BRECKELS_VAN_EEKELEN_BREAK_FT = 11_500;
/** Normal (hydrostatic) pore-pressure gradient of Breckels & van Eekelen, psi/ft (Pn = 0.465 D). */
export const BRECKELS_VAN_EEKELEN_NORMAL_GRADIENT = 0.465;

/**
 * Breckels & van Eekelen (1982), JPT 34, SPE 10336, US Gulf Coast, in psi and ft:
 * Sh = 0.197 D^1.145 for D <= 11,500 ft, Sh = 1.167 D - 4596 for D > 11,500 ft, plus
 * 0.46 (Pp - Pn) where overpressured (Pp > Pn = 0.465 D).
 * The two branches do not meet: at 11,500 ft the power law gives 8789.5 psi and the line
 * 8824.5 psi, a step of +35.0 psi (0.4 %) going deeper (computed from the published form).
 *
 * @param depthFt TVD, ft, in (0, 50000].
 * @param porePressurePsi pore pressure at D, psi; omitted means normally pressured.
 * @returns Shmin, psi.
 * @throws EngineError 'out-of-range' for a depth outside (0, 50000] ft or a negative / non-finite pore pressure.
 * @example breckelsVanEekelenPsi(10000) // 0.197 x 10000^1.145 = 7489.73 psi
 */
export function breckelsVanEekelenPsi(depthFt: number, porePressurePsi?: number): number {
  if (!(depthFt > 0 && depthFt <= 50_000)) {
    throw new EngineError('out-of-range', `depth ${depthFt} ft is outside (0, 50000]`, {}, 'a TVD in ft');
  }
  if (porePressurePsi !== undefined && !(porePressurePsi >= 0 && Number.isFinite(porePressurePsi))) {
    throw new EngineError('out-of-range', `pore pressure ${porePressurePsi} psi is not usable`, {}, 'a pore pressure >= 0 psi');
  }
  const base = depthFt <= BRECKELS_VAN_EEKELEN_BREAK_FT ? 0.197 * depthFt ** 1.145 : 1.167 * depthFt - 4596;
  if (porePressurePsi === undefined) return base;
  const normal = BRECKELS_VAN_EEKELEN_NORMAL_GRADIENT * depthFt;
  return porePressurePsi > normal ? base + 0.46 * (porePressurePsi - normal) : base;
}

/**
 * {@link breckelsVanEekelenPsi} in SI.
 *
 * @param tvd TVD, m, in (0, 15240]. @param porePressure Pa, optional.
 * @returns Shmin, Pa.
 * @throws EngineError 'out-of-range' as breckelsVanEekelenPsi.
 * @example breckelsVanEekelen(3048) // 7489.73 psi = 51.64e6 Pa
 */
export function breckelsVanEekelen(tvd: number, porePressure?: number): number {
  return breckelsVanEekelenPsi(tvd / FOOT, porePressure === undefined ? undefined : porePressure / PSI) * PSI;
}

/**
 * Eaton (1969), JPT, fracture gradient F = (S/D - P/D) nu/(1 - nu) + P/D, with S the
 * overburden, P the pore pressure, D the depth, nu Poisson's ratio. Any consistent gradient
 * units (psi/ft, Pa/m): the result is in the same unit.
 *
 * @param overburdenGradient S/D. @param poreGradient P/D (<= S/D for a meaningful result).
 * @param poissonRatio nu in [0, 0.5).
 * @returns F in the unit of the inputs.
 * @throws EngineError 'out-of-range' for nu outside [0, 0.5) or non-finite gradients.
 * @example eatonFractureGradient(1.0, 0.465, 0.25) // 0.6433 psi/ft
 */
export function eatonFractureGradient(overburdenGradient: number, poreGradient: number, poissonRatio: number): number {
  if (!(poissonRatio >= 0 && poissonRatio < 0.5)) {
    throw new EngineError('out-of-range', `Poisson's ratio ${poissonRatio} is outside [0, 0.5)`, {}, 'a Poisson ratio such as 0.25');
  }
  if (!Number.isFinite(overburdenGradient) || !Number.isFinite(poreGradient)) {
    throw new EngineError('out-of-range', 'overburden and pore gradients must be finite numbers', {}, 'gradients in consistent units');
  }
  return (overburdenGradient - poreGradient) * (poissonRatio / (1 - poissonRatio)) + poreGradient;
}

/**
 * Eaton (1969) as a stress at a depth: Shmin = (Sv - Pp) nu/(1 - nu) + Pp (the gradient
 * form times D).
 *
 * @param verticalStress Sv, Pa. @param porePressure Pp, Pa. @param poissonRatio nu in [0, 0.5).
 * @returns Shmin, Pa.
 * @throws EngineError 'out-of-range' as eatonFractureGradient.
 * @example eatonShmin(45e6, 20e6, 0.25) // 28.33e6
 */
export function eatonShmin(verticalStress: number, porePressure: number, poissonRatio: number): number {
  return eatonFractureGradient(verticalStress, porePressure, poissonRatio);
}
