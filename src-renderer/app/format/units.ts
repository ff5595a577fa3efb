/**
 * Number formatting for the screens. Values stay SI everywhere; screens convert only
 * when they show a number, with the engine's display systems (engine/units/unitSystem.ts).
 */
import { DISPLAY_UNITS, type UnitSystem } from '../../engine/units/unitSystem';
import { fromSI, toSI, type Dimension } from '../../engine/units/units';
import { emwFromPressure, gradientFromPressure } from '../../engine/units/mudWeight';

export type { UnitSystem };

/**
 * What the screens show, per quantity. 'emw' is the equivalent mud weight (a density); 'stiffness' dP/dV;
 * 'diameter' a hole or pipe diameter (a length shown in mm or in, not in the depth unit).
 */
export type DisplayQuantity = 'pressure' | 'depth' | 'time' | 'rate' | 'volume' | 'density' | 'gradient' | 'emw' | 'stiffness' | 'diameter';

const DIMENSION: Record<Exclude<DisplayQuantity, 'stiffness' | 'time'>, Dimension> = {
  pressure: 'pressure', depth: 'length', rate: 'rate', volume: 'volume', density: 'density', gradient: 'gradient', emw: 'density', diameter: 'length',
};

/** Unit of hole and pipe diameters: millimetres in SI, inches in oilfield (engine unit definitions 'mm' and 'in'). */
export const DIAMETER_UNIT: Readonly<Record<UnitSystem, string>> = { si: 'mm', oilfield: 'in' };

/** Decimals shown per quantity and system (app's choice, for readable tables). */
const DIGITS: Record<UnitSystem, Record<DisplayQuantity, number>> = {
  si: { pressure: 2, depth: 1, time: 1, rate: 3, volume: 3, density: 2, gradient: 2, emw: 2, stiffness: 1, diameter: 1 },
  oilfield: { pressure: 0, depth: 0, time: 1, rate: 2, volume: 2, density: 2, gradient: 3, emw: 2, stiffness: 0, diameter: 3 },
};

function unitOf(system: UnitSystem, quantity: DisplayQuantity): string {
  if (quantity === 'time') return 'min';
  if (quantity === 'stiffness') return `${DISPLAY_UNITS[system].pressure}/${DISPLAY_UNITS[system].volume}`;
  if (quantity === 'diameter') return DIAMETER_UNIT[system];
  return DISPLAY_UNITS[system][DIMENSION[quantity]];
}

/** Display unit label of a quantity in a system, e.g. unitLabel('oilfield', 'rate') === 'bbl/min'. */
export function unitLabel(system: UnitSystem, quantity: DisplayQuantity): string {
  return unitOf(system, quantity).replace(/m3/g, 'm³');
}

/** Converts an SI value to the display unit of `quantity`. */
export function toDisplay(system: UnitSystem, quantity: DisplayQuantity, valueSI: number): number {
  if (quantity === 'time') return valueSI / 60;
  if (quantity === 'stiffness') {
    const u = DISPLAY_UNITS[system];
    return fromSI(valueSI, u.pressure, 'pressure') * toSI(1, u.volume, 'volume');
  }
  return fromSI(valueSI, unitOf(system, quantity), DIMENSION[quantity]);
}

/** Converts a value typed in the display unit back to SI. */
export function fromDisplay(system: UnitSystem, quantity: DisplayQuantity, value: number): number {
  return value / toDisplay(system, quantity, 1);
}

/** Converter for a whole series (chart axes): SI -> display. */
export function displayScale(system: UnitSystem, quantity: DisplayQuantity): (valueSI: number) => number {
  const one = toDisplay(system, quantity, 1);
  return (v: number) => v * one;
}

/** Decimals the screens use for a quantity. */
export function displayDigits(system: UnitSystem, quantity: DisplayQuantity): number {
  return DIGITS[system][quantity];
}

/**
 * Formats an SI value for display, with its unit: formatQuantity('si', 'pressure', 3.2e7) === '32.00 MPa'.
 * Null, undefined and non-finite values show as an en dash.
 */
export function formatQuantity(system: UnitSystem, quantity: DisplayQuantity, valueSI: number | null | undefined,
  options: { unit?: boolean; digits?: number } = {}): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return '–';
  const text = formatNumber(toDisplay(system, quantity, valueSI), options.digits ?? DIGITS[system][quantity]);
  return options.unit === false ? text : `${text} ${unitLabel(system, quantity)}`;
}

/** Fixed decimals with thousands separators (1,234.5); a minus sign, never "-0". */
export function formatNumber(value: number, digits: number): string {
  if (!Number.isFinite(value)) return '–';
  const fixed = Math.abs(value) < 0.5 * 10 ** -digits ? 0 : value;
  return fixed.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

/** Equivalent mud density of a pressure at a TVD, kg/m3 (engine's emwFromPressure); null without a depth. */
export function equivalentMudDensity(pressurePa: number, tvdMetre: number | null | undefined): number | null {
  if (!(tvdMetre !== null && tvdMetre !== undefined && tvdMetre > 0) || !Number.isFinite(pressurePa)) return null;
  return emwFromPressure(pressurePa, tvdMetre);
}

/** Gradient of a pressure at a TVD, Pa/m; null without a depth. */
export function pressureGradient(pressurePa: number, tvdMetre: number | null | undefined): number | null {
  if (!(tvdMetre !== null && tvdMetre !== undefined && tvdMetre > 0) || !Number.isFinite(pressurePa)) return null;
  return gradientFromPressure(pressurePa, tvdMetre);
}

/** Formats with a number of significant digits (for values that span decades, e.g. detectable volumes). */
export function formatSignificant(system: UnitSystem, quantity: DisplayQuantity, valueSI: number | null | undefined, significant = 3): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return '–';
  const v = toDisplay(system, quantity, valueSI);
  const text = v === 0 ? '0' : Math.abs(v) >= 10 ** significant ? formatNumber(v, 0) : String(Number(v.toPrecision(significant)));
  return `${text} ${unitLabel(system, quantity)}`;
}

/** Unit of small volumes (a fracture the record could just see): litres in SI, US gallons in oilfield. */
const SMALL_VOLUME_UNIT: Record<UnitSystem, string> = { si: 'L', oilfield: 'gal' };

/**
 * A small volume, m3, in the system's small-volume unit (L or US gal, engine unit
 * definitions), with the digits of the analysis messages: formatSmallVolume('si', 4.71e-4) === '0.47 L'.
 */
export function formatSmallVolume(system: UnitSystem, valueSI: number | null | undefined): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return '–';
  const unit = SMALL_VOLUME_UNIT[system];
  const v = fromSI(valueSI, unit, 'volume');
  const a = Math.abs(v);
  // The digits the analysis uses in its own messages (whole from 100, one decimal from 10, two from 0.1, else 2 significant).
  const text = a === 0 ? '0' : a >= 100 ? v.toFixed(0) : a >= 10 ? v.toFixed(1) : a >= 0.1 ? v.toFixed(2) : v.toPrecision(2);
  return `${text} ${unit}`;
}
