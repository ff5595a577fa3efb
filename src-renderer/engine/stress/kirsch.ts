/**
 * Stresses at the wall of a vertical well and the breakdown and reopening relations
 * derived from them. Compression positive, all pressures and stresses in Pa at the
 * tested depth (METHODS.md "Wellbore wall and breakdown").
 *
 * These relations hold only for a crack that is short compared with the hole radius;
 * see detectability.ts for the record's own check of that condition. Results are for
 * review by a qualified engineer; they are not a substitute for the operator's
 * well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';

function requireFinite(values: Record<string, number>): void {
  for (const [name, value] of Object.entries(values)) {
    if (!Number.isFinite(value)) {
      throw new EngineError('bad-argument', `${name} is not a finite number (${value})`, {}, `a finite ${name} in Pa`);
    }
  }
}

/**
 * Minimum effective hoop stress at the wall of a vertical well, at the SHmax azimuth
 * (Kirsch 1898; Zoback 2007 ch. 6): sigma_tt,min = 3 Shmin - SHmax - 2 Pp - dP - sigma_dT,
 * with dP = Pw - Pp.
 *
 * @param input.shmin Pa; input.shmax Pa (>= shmin); input.porePressure Pa;
 *   input.wellPressure Pw, Pa; input.thermalStress sigma_dT, Pa (default 0; positive when cooling).
 * @returns effective hoop stress, Pa (negative is tensile).
 * @throws EngineError 'bad-argument' for non-finite inputs.
 * @example kirschMinimumHoopStress({shmin: 30e6, shmax: 40e6, porePressure: 20e6, wellPressure: 25e6}) // 5e6
 */
export function kirschMinimumHoopStress(input: {
  shmin: number; shmax: number; porePressure: number; wellPressure: number; thermalStress?: number;
}): number {
  const thermal = input.thermalStress ?? 0;
  requireFinite({ Shmin: input.shmin, SHmax: input.shmax, 'pore pressure': input.porePressure, 'well pressure': input.wellPressure, 'thermal stress': thermal });
  const dP = input.wellPressure - input.porePressure;
  return 3 * input.shmin - input.shmax - 2 * input.porePressure - dP - thermal;
}

/**
 * Breakdown pressure for a non-penetrating fluid: Pb = 3 Shmin - SHmax - Pp + T0
 * (Hubbert & Willis 1957, Trans. AIME 210:153-168), the well pressure at which the
 * Kirsch hoop stress reaches -T0.
 *
 * @param input.shmin Pa; input.shmax Pa; input.porePressure Pa; input.tensileStrength T0, Pa, >= 0.
 * @returns Pb, Pa.
 * @throws EngineError 'bad-argument' for non-finite inputs; 'out-of-range' for T0 < 0.
 * @example breakdownPressureNonPenetrating({shmin: 30e6, shmax: 40e6, porePressure: 20e6, tensileStrength: 5e6}) // 35e6
 */
export function breakdownPressureNonPenetrating(input: {
  shmin: number; shmax: number; porePressure: number; tensileStrength: number;
}): number {
  requireFinite({ Shmin: input.shmin, SHmax: input.shmax, 'pore pressure': input.porePressure, 'tensile strength': input.tensileStrength });
  if (input.tensileStrength < 0) throw new EngineError('out-of-range', `tensile strength ${input.tensileStrength} Pa is negative`, {}, 'T0 >= 0');
  return 3 * input.shmin - input.shmax - input.porePressure + input.tensileStrength;
}

/**
 * Reopening pressure of an existing wall fracture (T0 = 0): Pr = 3 Shmin - SHmax - Pp
 * (Bredehoeft et al. 1976, GSA Bull. 87:250-258).
 *
 * @param input.shmin Pa; input.shmax Pa; input.porePressure Pa.
 * @returns Pr, Pa.
 * @throws EngineError 'bad-argument' for non-finite inputs.
 * @example reopeningPressure({shmin: 30e6, shmax: 40e6, porePressure: 20e6}) // 30e6
 */
export function reopeningPressure(input: { shmin: number; shmax: number; porePressure: number }): number {
  requireFinite({ Shmin: input.shmin, SHmax: input.shmax, 'pore pressure': input.porePressure });
  return 3 * input.shmin - input.shmax - input.porePressure;
}

/**
 * SHmax from the reopening relation: SHmax = 3 Shmin - Pr - Pp (Bredehoeft et al. 1976).
 * Unreliable where the system compliance hides the reopening (Ito et al. 1999, from
 * memory); the caller must attach the detectability check.
 *
 * @param input.shmin Pa; input.reopening Pr, Pa; input.porePressure Pa.
 * @returns SHmax, Pa.
 * @throws EngineError 'bad-argument' for non-finite inputs.
 * @example shmaxFromReopening({shmin: 34e6, reopening: 34.8e6, porePressure: 20e6}) // 47.2e6
 */
export function shmaxFromReopening(input: { shmin: number; reopening: number; porePressure: number }): number {
  requireFinite({ Shmin: input.shmin, 'reopening pressure': input.reopening, 'pore pressure': input.porePressure });
  return 3 * input.shmin - input.reopening - input.porePressure;
}

/**
 * Tensile strength from the first-cycle breakdown and a later-cycle reopening:
 * T0 = Pb - Pr (Bredehoeft et al. 1976).
 *
 * @param breakdown Pb, Pa. @param reopening Pr, Pa.
 * @returns T0, Pa (negative when the reopening pick is above breakdown: an inconsistent record).
 * @throws EngineError 'bad-argument' for non-finite inputs.
 * @example tensileStrengthFromPicks(39.6e6, 34.8e6) // 4.8e6
 */
export function tensileStrengthFromPicks(breakdown: number, reopening: number): number {
  requireFinite({ 'breakdown pressure': breakdown, 'reopening pressure': reopening });
  return breakdown - reopening;
}

/**
 * Poroelastic coefficient eta = alpha (1 - 2 nu) / (2 (1 - nu)) of the penetrating-fluid
 * breakdown relation (Haimson & Fairhurst 1967, SPE J. 7(3); form from memory, METHODS.md).
 *
 * @param biotCoefficient alpha, 0..1. @param poissonRatio nu, 0 <= nu < 0.5.
 * @returns eta, 0..0.5.
 * @throws EngineError 'out-of-range' outside those ranges.
 * @example poroelasticCoefficient(1, 0.25) // 1/3
 */
export function poroelasticCoefficient(biotCoefficient: number, poissonRatio: number): number {
  if (!Number.isFinite(biotCoefficient) || biotCoefficient < 0 || biotCoefficient > 1) {
    throw new EngineError('out-of-range', `Biot coefficient ${biotCoefficient} is outside 0..1`, {}, 'a Biot coefficient from 0 to 1');
  }
  if (!Number.isFinite(poissonRatio) || poissonRatio < 0 || poissonRatio >= 0.5) {
    throw new EngineError('out-of-range', `Poisson's ratio ${poissonRatio} is outside [0, 0.5)`, {}, "a Poisson's ratio from 0 to below 0.5");
  }
  return (biotCoefficient * (1 - 2 * poissonRatio)) / (2 * (1 - poissonRatio));
}

/**
 * Breakdown pressure for a penetrating fluid (Haimson & Fairhurst 1967, SPE J. 7(3);
 * form as written in METHODS.md, from memory, not confirmed against the paper):
 * Pb = (3 Shmin - SHmax + T0 - 2 eta Pp) / (2 (1 - eta)).
 *
 * @param input.shmin Pa; input.shmax Pa; input.porePressure Pa; input.tensileStrength T0, Pa >= 0;
 *   input.biotCoefficient alpha 0..1 (default 1); input.poissonRatio nu 0..0.5 (default 0.25).
 * @returns Pb, Pa.
 * @throws EngineError 'bad-argument' / 'out-of-range' for bad inputs.
 * @example breakdownPressurePenetrating({shmin: 30e6, shmax: 40e6, porePressure: 20e6, tensileStrength: 5e6}) // 31.25e6
 */
export function breakdownPressurePenetrating(input: {
  shmin: number; shmax: number; porePressure: number; tensileStrength: number; biotCoefficient?: number; poissonRatio?: number;
}): number {
  requireFinite({ Shmin: input.shmin, SHmax: input.shmax, 'pore pressure': input.porePressure, 'tensile strength': input.tensileStrength });
  if (input.tensileStrength < 0) throw new EngineError('out-of-range', `tensile strength ${input.tensileStrength} Pa is negative`, {}, 'T0 >= 0');
  const eta = poroelasticCoefficient(input.biotCoefficient ?? 1, input.poissonRatio ?? 0.25);
  return (3 * input.shmin - input.shmax + input.tensileStrength - 2 * eta * input.porePressure) / (2 * (1 - eta));
}
