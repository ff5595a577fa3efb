/**
 * Conversion of values between written units and the engine's SI units.
 * Factors: unitDefinitions.ts (exact definitions, NIST SP 811 Appendix B.8).
 */
import { EngineError, type SourceLocation } from '../errors';
import { STANDARD_GRAVITY } from './quantity';
import { UNIT_DEFINITIONS, SI_UNIT, type Dimension, type UnitDefinition } from './unitDefinitions';
import { normaliseUnitName } from './unitNames';

export type { Dimension } from './unitDefinitions';
export { normaliseUnitName } from './unitNames';

const BY_NAME = new Map<string, UnitDefinition>(UNIT_DEFINITIONS.map((u) => [u.name, u]));

/**
 * Primary dimension of a unit as written ("sg" and "ppg" are densities; "psi/ft" a gradient).
 *
 * @param unit unit as written, any accepted spelling (see normaliseUnitName)
 * @returns the dimension, or null when the unit is not recognised
 * @example unitDimension('BPM') // 'rate'
 */
export function unitDimension(unit: string): Dimension | null {
  const name = normaliseUnitName(unit);
  return name ? BY_NAME.get(name)!.dimension : null;
}

/**
 * Factor that turns a value in `unit` into SI for `dimension`. Densities are accepted as
 * gradients: the hydrostatic gradient of a fluid of that density, rho x g_n (g_n = 9.80665
 * m/s2 exact, CODATA / NIST SP 811), so "1.25 sg" as a gradient is 12.258 kPa/m.
 *
 * @param unit unit as written
 * @param dimension dimension expected by the caller
 * @param location where the unit was read, for the error
 * @returns multiplier to SI (Pa, m, s, m3/s, m3, kg/m3, Pa/m, 1/Pa)
 * @throws EngineError 'unknown-unit' when the unit is unknown or of another dimension
 * @example unitFactorToSI('psi', 'pressure') // 6894.757293168361
 */
export function unitFactorToSI(unit: string, dimension: Dimension, location: SourceLocation = {}): number {
  const name = normaliseUnitName(unit);
  const def = name ? BY_NAME.get(name) : undefined;
  if (def && def.dimension === dimension) return def.factor;
  if (def && dimension === 'gradient' && def.dimension === 'density') return def.factor * STANDARD_GRAVITY;
  const found = def ? `a ${def.dimension} unit "${unit}"` : `unknown unit "${unit}"`;
  throw new EngineError('unknown-unit', `${found} where a ${dimension} was expected`, location,
    `a ${dimension} unit such as ${unitsOfDimension(dimension).slice(0, 6).join(', ')}`);
}

/**
 * Converts a value from a written unit to SI.
 *
 * @param value value in `unit`
 * @param unit unit as written (any accepted spelling)
 * @param dimension dimension of the value
 * @returns value in SI (Pa, m, s, m3/s, m3, kg/m3, Pa/m, 1/Pa)
 * @throws EngineError 'unknown-unit'
 * @example toSI(1, 'bbl', 'volume') // 0.158987294928
 */
export function toSI(value: number, unit: string, dimension: Dimension): number {
  return value * unitFactorToSI(unit, dimension);
}

/**
 * Converts an SI value to a written unit.
 *
 * @param valueSI value in SI for `dimension`
 * @param unit target unit (any accepted spelling)
 * @param dimension dimension of the value
 * @returns value in `unit`
 * @throws EngineError 'unknown-unit'
 * @example fromSI(6894.757293168361, 'psi', 'pressure') // 1
 */
export function fromSI(valueSI: number, unit: string, dimension: Dimension): number {
  return valueSI / unitFactorToSI(unit, dimension);
}

/**
 * Converts a whole array in place from a written unit to SI (import hot path).
 *
 * @param values samples in `unit`, overwritten with SI values
 * @param unit unit as written
 * @param dimension dimension of the samples
 * @throws EngineError 'unknown-unit'
 * @example arrayToSI(new Float64Array([1, 2]), 'kPa', 'pressure')
 */
export function arrayToSI(values: Float64Array, unit: string, dimension: Dimension): Float64Array {
  const factor = unitFactorToSI(unit, dimension);
  if (factor !== 1) for (let i = 0; i < values.length; i++) values[i] *= factor;
  return values;
}

/**
 * Canonical unit names of a dimension, SI first.
 *
 * @param dimension the dimension
 * @returns canonical names, e.g. ['Pa', 'kPa', 'MPa', ...] for pressure
 * @example unitsOfDimension('rate')[0] // 'm3/s'
 */
export function unitsOfDimension(dimension: Dimension): string[] {
  return [SI_UNIT[dimension], ...UNIT_DEFINITIONS.filter((u) => u.dimension === dimension && u.name !== SI_UNIT[dimension]).map((u) => u.name)];
}
