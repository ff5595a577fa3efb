/**
 * Equivalent mud weight (EMW) and hydrostatic gradient relations: p = rho x g_n x TVD
 * (hydrostatics; g_n = 9.80665 m/s2 exact, CODATA / NIST SP 811). In oilfield units this is
 * p[psi] = (4/77) x MW[ppg] x TVD[ft], the exact form of the "0.052" field constant.
 */
import { EngineError } from '../errors';
import { STANDARD_GRAVITY, kgPerCubicMetre, pascal, pascalPerMetre } from './quantity';
import type { KilogramPerCubicMetre, Pascal, PascalPerMetre } from './quantity';

function requirePositiveDepth(tvdM: number, what: string): void {
  if (!(tvdM > 0) || !Number.isFinite(tvdM)) {
    throw new EngineError('bad-argument', `${what} needs a true vertical depth above 0 m, got ${tvdM}`, {}, 'a TVD in metres > 0');
  }
}

/**
 * Equivalent mud weight of a pressure at a depth: the density whose hydrostatic column
 * gives that pressure, rho = p / (g_n x TVD).
 *
 * @param pressurePa pressure at the depth, Pa (downhole, or surface + hydrostatic)
 * @param tvdM true vertical depth, m, > 0
 * @returns density, kg/m3
 * @throws EngineError 'bad-argument' when tvdM is not > 0
 * @example emwFromPressure(20e6, 1500) // 1359.6 kg/m3 (1.36 sg)
 */
export function emwFromPressure(pressurePa: number, tvdM: number): KilogramPerCubicMetre {
  requirePositiveDepth(tvdM, 'Equivalent mud weight');
  return kgPerCubicMetre(pressurePa / (STANDARD_GRAVITY * tvdM));
}

/**
 * Hydrostatic pressure of a fluid column, p = rho x g_n x TVD.
 *
 * @param densityKgM3 fluid density, kg/m3
 * @param tvdM column height (true vertical), m, >= 0
 * @returns pressure, Pa
 * @example hydrostaticPressure(1000, 10) // 98066.5 Pa
 */
export function hydrostaticPressure(densityKgM3: number, tvdM: number): Pascal {
  return pascal(densityKgM3 * STANDARD_GRAVITY * tvdM);
}

/**
 * Pressure gradient of a fluid of the given density, rho x g_n.
 *
 * @param densityKgM3 density, kg/m3
 * @returns gradient, Pa/m
 * @example gradientFromDensity(1000) // 9806.65 Pa/m
 */
export function gradientFromDensity(densityKgM3: number): PascalPerMetre {
  return pascalPerMetre(densityKgM3 * STANDARD_GRAVITY);
}

/**
 * Density equivalent to a pressure gradient, gradient / g_n.
 *
 * @param gradientPaPerM gradient, Pa/m
 * @returns density, kg/m3
 * @example densityFromGradient(9806.65) // 1000
 */
export function densityFromGradient(gradientPaPerM: number): KilogramPerCubicMetre {
  return kgPerCubicMetre(gradientPaPerM / STANDARD_GRAVITY);
}

/**
 * Average gradient of a pressure over a depth, p / TVD.
 *
 * @param pressurePa pressure, Pa
 * @param tvdM true vertical depth, m, > 0
 * @returns gradient, Pa/m
 * @throws EngineError 'bad-argument' when tvdM is not > 0
 * @example gradientFromPressure(15e6, 1000) // 15000 Pa/m (15 kPa/m)
 */
export function gradientFromPressure(pressurePa: number, tvdM: number): PascalPerMetre {
  requirePositiveDepth(tvdM, 'A pressure gradient');
  return pascalPerMetre(pressurePa / tvdM);
}

/**
 * Pressure at a depth from a gradient, gradient x TVD.
 *
 * @param gradientPaPerM gradient, Pa/m
 * @param tvdM true vertical depth, m, >= 0
 * @returns pressure, Pa
 * @example pressureFromGradient(10200, 2000) // 20.4e6 Pa
 */
export function pressureFromGradient(gradientPaPerM: number, tvdM: number): Pascal {
  return pascal(gradientPaPerM * tvdM);
}
