/**
 * Display unit systems for the app and exports: SI (MPa, m, m3, m3/min, sg, kPa/m) and
 * oilfield (psi, ft, bbl, bbl/min, ppg, psi/ft). The engine stays SI; these are used only
 * when a value is shown or written out.
 */
import type { Dimension } from './unitDefinitions';
import { fromSI, toSI } from './units';

export type UnitSystem = 'si' | 'oilfield';
export const UNIT_SYSTEMS: readonly UnitSystem[] = ['si', 'oilfield'];

/** Display unit of each dimension in each system. Densities and EMW use 'density'. */
export const DISPLAY_UNITS: Readonly<Record<UnitSystem, Readonly<Record<Dimension, string>>>> = {
  si: {
    pressure: 'MPa', length: 'm', time: 's', rate: 'm3/min', volume: 'm3',
    density: 'sg', gradient: 'kPa/m', compressibility: '1/Pa',
  },
  oilfield: {
    pressure: 'psi', length: 'ft', time: 's', rate: 'bbl/min', volume: 'bbl',
    density: 'ppg', gradient: 'psi/ft', compressibility: '1/psi',
  },
};

/**
 * Display unit of a dimension in a unit system.
 *
 * @param system 'si' or 'oilfield'
 * @param dimension the dimension shown
 * @returns canonical unit name, e.g. 'psi' for oilfield pressure
 * @example displayUnit('oilfield', 'rate') // 'bbl/min'
 */
export function displayUnit(system: UnitSystem, dimension: Dimension): string {
  return DISPLAY_UNITS[system][dimension];
}

/**
 * An SI value converted for display in a unit system.
 *
 * @param valueSI SI value (Pa, m, s, m3/s, m3, kg/m3, Pa/m, 1/Pa)
 * @param dimension its dimension
 * @param system target system
 * @returns {value, unit} in the display unit
 * @example toDisplay(1e6, 'pressure', 'si') // {value: 1, unit: 'MPa'}
 */
export function toDisplay(valueSI: number, dimension: Dimension, system: UnitSystem): { value: number; unit: string } {
  const unit = displayUnit(system, dimension);
  return { value: fromSI(valueSI, unit, dimension), unit };
}

/**
 * A displayed value converted back to SI (for values typed into the app).
 *
 * @param value value in the display unit of `system`
 * @param dimension its dimension
 * @param system the system it is shown in
 * @returns SI value
 * @example fromDisplay(1, 'pressure', 'oilfield') // 6894.757293168361
 */
export function fromDisplay(value: number, dimension: Dimension, system: UnitSystem): number {
  return toSI(value, displayUnit(system, dimension), dimension);
}
