/**
 * Recognition of unit names as contractors and log files write them
 * ("PSI", "psig", "Mpa", "BPM", "m³/min", "s.g.", "lb/gal", "F" for feet in LAS ...).
 */
import { UNIT_DEFINITIONS } from './unitDefinitions';

/** Written forms (lower case, spaces and dots removed, superscripts folded) -> canonical name. */
const ALIASES: Readonly<Record<string, string>> = {
  // pressure (gauge and absolute spellings share the factor; the engine keeps the value as written)
  pa: 'Pa', pascal: 'Pa', pascals: 'Pa', kpa: 'kPa', kpag: 'kPa', kpaa: 'kPa', mpa: 'MPa', mpag: 'MPa',
  gpa: 'GPa', bar: 'bar', bars: 'bar', barg: 'bar', bara: 'bar', psi: 'psi', psig: 'psi', psia: 'psi',
  'lbf/in2': 'psi', 'lb/in2': 'psi', ksi: 'ksi', atm: 'atm', 'kgf/cm2': 'kgf/cm2', 'kg/cm2': 'kgf/cm2',
  // length
  m: 'm', meter: 'm', meters: 'm', metre: 'm', metres: 'm', km: 'km', cm: 'cm', mm: 'mm',
  ft: 'ft', f: 'ft', feet: 'ft', foot: 'ft', "'": 'ft', in: 'in', inch: 'in', inches: 'in', '"': 'in',
  // time
  s: 's', sec: 's', secs: 's', second: 's', seconds: 's', ms: 'ms', min: 'min', mins: 'min',
  minute: 'min', minutes: 'min', h: 'h', hr: 'h', hrs: 'h', hour: 'h', hours: 'h', d: 'd', day: 'd', days: 'd',
  // rate
  'm3/s': 'm3/s', 'm3/sec': 'm3/s', 'm3/min': 'm3/min', 'm3/h': 'm3/h', 'm3/hr': 'm3/h',
  'l/s': 'L/s', 'l/sec': 'L/s', 'l/min': 'L/min', lpm: 'L/min',
  'bbl/min': 'bbl/min', 'bbls/min': 'bbl/min', bpm: 'bbl/min', 'bbl/h': 'bbl/h', 'bbl/hr': 'bbl/h',
  'bbl/d': 'bbl/d', 'bbl/day': 'bbl/d', bpd: 'bbl/d',
  'gal/min': 'gal/min', 'usgal/min': 'gal/min', gpm: 'gal/min', usgpm: 'gal/min',
  // volume
  m3: 'm3', l: 'L', litre: 'L', litres: 'L', liter: 'L', liters: 'L', bbl: 'bbl', bbls: 'bbl',
  barrel: 'bbl', barrels: 'bbl', gal: 'gal', usgal: 'gal', gallon: 'gal', gallons: 'gal', ft3: 'ft3',
  // density
  'kg/m3': 'kg/m3', 'k/m3': 'kg/m3', 'kgm3': 'kg/m3', 'g/cm3': 'g/cm3', 'g/cc': 'g/cm3', gcc: 'g/cm3',
  'gm/cc': 'g/cm3', 'g/c3': 'g/cm3', 'g/ml': 'g/cm3', 'kg/l': 'g/cm3', 'kg/dm3': 'g/cm3',
  sg: 'sg', rd: 'sg', ppg: 'ppg', 'lb/gal': 'ppg', 'lbm/gal': 'ppg', 'lb/usgal': 'ppg', 'lbs/gal': 'ppg',
  'lb/ft3': 'lb/ft3', 'lbm/ft3': 'lb/ft3', pcf: 'lb/ft3',
  // gradient
  'pa/m': 'Pa/m', 'kpa/m': 'kPa/m', 'mpa/km': 'MPa/km', 'mpa/m': 'MPa/m', 'bar/m': 'bar/m',
  'psi/ft': 'psi/ft', 'psi/f': 'psi/ft',
  // compressibility
  '1/pa': '1/Pa', '/pa': '1/Pa', 'pa-1': '1/Pa', 'pa^-1': '1/Pa',
  '1/kpa': '1/kPa', '/kpa': '1/kPa', 'kpa-1': '1/kPa', 'kpa^-1': '1/kPa',
  '1/mpa': '1/MPa', '/mpa': '1/MPa', 'mpa-1': '1/MPa', 'mpa^-1': '1/MPa',
  '1/gpa': '1/GPa', '/gpa': '1/GPa', 'gpa-1': '1/GPa',
  '1/bar': '1/bar', '/bar': '1/bar', 'bar-1': '1/bar',
  '1/psi': '1/psi', '/psi': '1/psi', 'psi-1': '1/psi', 'psi^-1': '1/psi',
};

const CANONICAL = new Set(UNIT_DEFINITIONS.map((u) => u.name));

/**
 * Folds a written unit to its lookup key: lower case, no spaces, no dots, superscript
 * digits to plain digits, "per" to "/", enclosing brackets removed.
 */
function unitLookupKey(text: string): string {
  let key = text.trim().replace(/^[([{<]\s*(.*?)\s*[)\]}>]$/, '$1');
  key = key.toLowerCase().replace(/³/g, '3').replace(/²/g, '2').replace(/⁻¹/g, '-1').replace(/µ/g, 'u');
  key = key.replace(/\s+per\s+/g, '/').replace(/[\s.]+/g, '');
  return key;
}

/**
 * Canonical engine name of a unit as written, or null when it is not recognised.
 * Tolerates case, spaces, dots ("s.g."), superscripts ("m³/min"), brackets ("[psi]"),
 * gauge/absolute suffixes ("psig") and LAS spellings ("F", "K/M3", "G/C3").
 *
 * Source: spellings are common practice in contractor reports and CWLS LAS files.
 * @param text unit as written (any case)
 * @returns canonical name from UNIT_DEFINITIONS, e.g. "psi", "bbl/min", "sg"; null when unknown
 * @example normaliseUnitName('BPM') // 'bbl/min'
 */
export function normaliseUnitName(text: string): string | null {
  if (CANONICAL.has(text)) return text;
  const key = unitLookupKey(text);
  if (key === '') return null;
  return ALIASES[key] ?? null;
}
