/**
 * Unit definitions: exact factors to SI built from the exact definitions of the
 * customary units (NIST SP 811, 2008, Appendix B.8; Unicode CLDR units.xml):
 * in = 0.0254 m, ft = 0.3048 m, lb = 0.45359237 kg, US gal = 231 in3, bbl = 42 US gal,
 * g_n = 9.80665 m/s2 (exact), lbf = lb x g_n, psi = lbf/in2.
 *
 * A value in a unit times `factor` gives the SI value (Pa, m, s, m3, m3/s, kg/m3, Pa/m, 1/Pa).
 */
import { STANDARD_GRAVITY } from './quantity';

/** Physical dimensions the engine converts. */
export type Dimension =
  | 'pressure'
  | 'length'
  | 'time'
  | 'rate'
  | 'volume'
  | 'density'
  | 'gradient'
  | 'compressibility';

export const DIMENSIONS: readonly Dimension[] = [
  'pressure', 'length', 'time', 'rate', 'volume', 'density', 'gradient', 'compressibility',
];

/** SI unit of each dimension, as the engine stores it. */
export const SI_UNIT: Readonly<Record<Dimension, string>> = {
  pressure: 'Pa', length: 'm', time: 's', rate: 'm3/s', volume: 'm3',
  density: 'kg/m3', gradient: 'Pa/m', compressibility: '1/Pa',
};

/** Inch, m (exact). */
export const INCH = 0.0254;
/** International foot, m (exact, 1959). */
export const FOOT = 0.3048;
/** Avoirdupois pound, kg (exact, 1959). */
export const POUND = 0.45359237;
/** Pound-force, N: lb x g_n. */
export const POUND_FORCE = POUND * STANDARD_GRAVITY;
/** psi = lbf/in2, Pa (6894.757293168...). */
export const PSI = POUND_FORCE / (INCH * INCH);
/** US gallon = 231 in3, m3 (0.003785411784 exactly). */
export const US_GALLON = 231 * INCH * INCH * INCH;
/** Petroleum barrel = 42 US gal, m3 (0.158987294928 exactly). */
export const BARREL = 42 * US_GALLON;
/** Cubic foot, m3. */
export const CUBIC_FOOT = FOOT * FOOT * FOOT;
/** Pound per US gallon, kg/m3 (119.826427...). */
export const POUND_PER_GALLON = POUND / US_GALLON;
/** Pound per cubic foot, kg/m3 (16.018463...). */
export const POUND_PER_CUBIC_FOOT = POUND / CUBIC_FOOT;
/** Standard atmosphere, Pa (exact, 10th CGPM). */
export const ATMOSPHERE = 101325;
/** Density of the specific-gravity reference (water at 4 degC, taken as 1000 kg/m3: common practice). */
export const SPECIFIC_GRAVITY_REFERENCE = 1000;

/** One unit: its canonical name, dimension and factor to SI. */
export interface UnitDefinition {
  name: string;
  dimension: Dimension;
  factor: number;
}

const g = STANDARD_GRAVITY;

/** Canonical units with their SI factor. Names are the engine's display spellings. */
export const UNIT_DEFINITIONS: readonly UnitDefinition[] = [
  // pressure
  { name: 'Pa', dimension: 'pressure', factor: 1 },
  { name: 'kPa', dimension: 'pressure', factor: 1e3 },
  { name: 'MPa', dimension: 'pressure', factor: 1e6 },
  { name: 'GPa', dimension: 'pressure', factor: 1e9 },
  { name: 'bar', dimension: 'pressure', factor: 1e5 },
  { name: 'psi', dimension: 'pressure', factor: PSI },
  { name: 'ksi', dimension: 'pressure', factor: 1000 * PSI },
  { name: 'atm', dimension: 'pressure', factor: ATMOSPHERE },
  { name: 'kgf/cm2', dimension: 'pressure', factor: g * 1e4 },
  // length
  { name: 'm', dimension: 'length', factor: 1 },
  { name: 'km', dimension: 'length', factor: 1e3 },
  { name: 'cm', dimension: 'length', factor: 1e-2 },
  { name: 'mm', dimension: 'length', factor: 1e-3 },
  { name: 'ft', dimension: 'length', factor: FOOT },
  { name: 'in', dimension: 'length', factor: INCH },
  // time
  { name: 's', dimension: 'time', factor: 1 },
  { name: 'ms', dimension: 'time', factor: 1e-3 },
  { name: 'min', dimension: 'time', factor: 60 },
  { name: 'h', dimension: 'time', factor: 3600 },
  { name: 'd', dimension: 'time', factor: 86400 },
  // rate
  { name: 'm3/s', dimension: 'rate', factor: 1 },
  { name: 'm3/min', dimension: 'rate', factor: 1 / 60 },
  { name: 'm3/h', dimension: 'rate', factor: 1 / 3600 },
  { name: 'L/s', dimension: 'rate', factor: 1e-3 },
  { name: 'L/min', dimension: 'rate', factor: 1e-3 / 60 },
  { name: 'bbl/min', dimension: 'rate', factor: BARREL / 60 },
  { name: 'bbl/h', dimension: 'rate', factor: BARREL / 3600 },
  { name: 'bbl/d', dimension: 'rate', factor: BARREL / 86400 },
  { name: 'gal/min', dimension: 'rate', factor: US_GALLON / 60 },
  // volume
  { name: 'm3', dimension: 'volume', factor: 1 },
  { name: 'L', dimension: 'volume', factor: 1e-3 },
  { name: 'bbl', dimension: 'volume', factor: BARREL },
  { name: 'gal', dimension: 'volume', factor: US_GALLON },
  { name: 'ft3', dimension: 'volume', factor: CUBIC_FOOT },
  // density
  { name: 'kg/m3', dimension: 'density', factor: 1 },
  { name: 'g/cm3', dimension: 'density', factor: 1000 },
  { name: 'sg', dimension: 'density', factor: SPECIFIC_GRAVITY_REFERENCE },
  { name: 'ppg', dimension: 'density', factor: POUND_PER_GALLON },
  { name: 'lb/ft3', dimension: 'density', factor: POUND_PER_CUBIC_FOOT },
  // gradient
  { name: 'Pa/m', dimension: 'gradient', factor: 1 },
  { name: 'kPa/m', dimension: 'gradient', factor: 1e3 },
  { name: 'MPa/km', dimension: 'gradient', factor: 1e3 },
  { name: 'MPa/m', dimension: 'gradient', factor: 1e6 },
  { name: 'bar/m', dimension: 'gradient', factor: 1e5 },
  { name: 'psi/ft', dimension: 'gradient', factor: PSI / FOOT },
  // compressibility
  { name: '1/Pa', dimension: 'compressibility', factor: 1 },
  { name: '1/kPa', dimension: 'compressibility', factor: 1e-3 },
  { name: '1/MPa', dimension: 'compressibility', factor: 1e-6 },
  { name: '1/GPa', dimension: 'compressibility', factor: 1e-9 },
  { name: '1/bar', dimension: 'compressibility', factor: 1e-5 },
  { name: '1/psi', dimension: 'compressibility', factor: 1 / PSI },
];
