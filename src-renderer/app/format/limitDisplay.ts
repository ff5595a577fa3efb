/**
 * Quality limits in the units an engineer thinks in. Limits are stored SI (fractions,
 * seconds, Pa/s); each limit's `display` (engine/quality/limits.ts) says how it is shown
 * and typed: fractions in %, R² as a plain number, ratios with ×, whole counts, seconds
 * in minutes or seconds, a pressure decline in kPa/min (SI) or psi/min (oilfield).
 * Pressure factors are the engine's (NIST SP 811 Appendix B.8).
 */
import type { LimitDisplay } from '../../engine/quality/limits';
import type { UnitSystem } from '../../engine/units/unitSystem';
import { unitFactorToSI } from '../../engine/units/units';

export type { LimitDisplay };

/** Pressure unit of the per-minute decline rate in each unit system. */
const RATE_PRESSURE_UNIT: Record<UnitSystem, 'kPa' | 'psi'> = { si: 'kPa', oilfield: 'psi' };

/** Unit written beside a limit, e.g. limitUnitLabel('pressure-rate', 'oilfield') === 'psi/min'. */
export function limitUnitLabel(display: LimitDisplay, system: UnitSystem): string {
  switch (display) {
    case 'percent': return '%';
    case 'ratio': return '×';
    case 'duration-min': return 'min';
    case 'duration-s': return 's';
    case 'pressure-rate': return `${RATE_PRESSURE_UNIT[system]}/min`;
    default: return '';
  }
}

/** Multiplier from the SI value to the shown value (shown = SI x factor). */
function displayFactor(display: LimitDisplay, system: UnitSystem): number {
  switch (display) {
    case 'percent': return 100;
    case 'duration-min': return 1 / 60;
    // Pa/s -> (unit)/min: x 60 s/min, / Pa per unit.
    case 'pressure-rate': return 60 / unitFactorToSI(RATE_PRESSURE_UNIT[system], 'pressure');
    default: return 1;
  }
}

/** An SI limit value in its display unit: limitToDisplay('percent', 'si', 0.1) === 10. */
export function limitToDisplay(display: LimitDisplay, system: UnitSystem, valueSI: number): number {
  return valueSI * displayFactor(display, system);
}

/** A value typed in the display unit, back to SI: limitFromDisplay('pressure-rate', 'si', 5) === 83.33… Pa/s. */
export function limitFromDisplay(display: LimitDisplay, system: UnitSystem, value: number): number {
  return value / displayFactor(display, system);
}

/** Decimals shown: R² always 4 and ratios always 2 (fixed); the others at most this many, trailing zeros dropped. */
function decimals(display: LimitDisplay, system: UnitSystem): number {
  switch (display) {
    case 'r2': return 4;
    case 'ratio': return 2;
    case 'count': return 0;
    case 'pressure-rate': return system === 'oilfield' ? 3 : 2;
    default: return 2;
  }
}

/** The number of a limit as shown and as put in its input (no unit): '10', '0.9950', '0.725'. */
export function formatLimitNumber(display: LimitDisplay, system: UnitSystem, valueSI: number | null | undefined): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return '–';
  const shown = limitToDisplay(display, system, valueSI);
  const digits = decimals(display, system);
  const rounded = Math.abs(shown) < 0.5 * 10 ** -digits ? 0 : shown;
  if (display === 'r2' || display === 'ratio') return rounded.toFixed(digits);
  return String(Number(rounded.toFixed(digits)));
}

/** A limit with its unit: '10 %', '5 kPa/min', '10 min', '0.50 ×', '0.9950', '20'. */
export function formatLimit(display: LimitDisplay, system: UnitSystem, valueSI: number | null | undefined): string {
  const text = formatLimitNumber(display, system, valueSI);
  const unit = limitUnitLabel(display, system);
  return unit && text !== '–' ? `${text}\u00a0${unit}` : text;
}

/** What the user typed: the SI value, or why it cannot be taken. */
export type LimitInput = { ok: true; valueSI: number } | { ok: false; message: string };

const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a limit typed in its display unit (decimal point or comma; the unit may be typed
 * after the number) and checks its range: percents 0-100, R² 0-1, counts whole numbers
 * of at least 1, ratios, durations and decline rates above zero.
 * parseLimitInput('percent', 'si', '12,5') -> { ok: true, valueSI: 0.125 }.
 */
export function parseLimitInput(display: LimitDisplay, system: UnitSystem, text: string): LimitInput {
  const unit = limitUnitLabel(display, system);
  let body = text.trim();
  const units = display === 'ratio' ? ['×', 'x'] : unit ? [unit] : [];
  for (const u of units) {
    if (body.toLowerCase().endsWith(u.toLowerCase())) { body = body.slice(0, body.length - u.length).trim(); break; }
  }
  if (body === '') return { ok: false, message: 'Type a number.' };
  if (!NUMBER.test(body)) return { ok: false, message: `"${text.trim()}" is not a number${unit ? ` in ${unit}` : ''}.` };
  const value = Number(body.replace(',', '.'));
  if (!Number.isFinite(value)) return { ok: false, message: 'The number is too large.' };
  switch (display) {
    case 'percent':
      if (value < 0 || value > 100) return { ok: false, message: 'A percentage between 0 and 100 %.' };
      break;
    case 'r2':
      if (value < 0 || value > 1) return { ok: false, message: 'R² lies between 0 and 1.' };
      break;
    case 'count':
      if (!Number.isInteger(value) || value < 1) return { ok: false, message: 'A whole number of at least 1.' };
      break;
    default:
      if (!(value > 0)) return { ok: false, message: `A value above 0${unit ? ` ${unit}` : ''}.` };
  }
  return { ok: true, valueSI: limitFromDisplay(display, system, value) };
}
