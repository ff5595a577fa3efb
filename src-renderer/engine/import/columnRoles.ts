/**
 * Recognition of a column's role (time, pressure, rate, volume ...) and unit from its
 * header as contractors write it: "Pressure (psi)", "Time [s]", "Rate, bbl/min", "Vol_bbl",
 * "BHP psi", "SPP", "Q", "Cum. volume (m³)"; or from a second header row of units.
 */
import type { ColumnMapping } from '../record';
import { normaliseUnitName } from '../units/unitNames';
import { unitDimension } from '../units/units';

export type ColumnRole = ColumnMapping['role'];
/** Where a pressure column measures: from its name ("BHP" is downhole, "annulus" the annulus). */
export type PressureKind = 'surface' | 'downhole' | 'annulus' | 'unspecified';

/** What a header says about its column. */
export interface HeaderReading {
  role: ColumnRole;
  /** Canonical unit name, 'iso-8601' / 'hh:mm:ss' for timestamps, '' when not stated. */
  unit: string;
  unitStated: boolean;
  /** Name without the unit part. */
  name: string;
  pressureKind?: PressureKind;
}

const TIME_NAMES = /^(elapsed( time)?|time( elapsed)?|t|et|etim|etime|run ?time|test time|time since start|delta ?t|duration|time from start)$/;
const TIMESTAMP_NAMES = /^(date ?\/? ?time|date and time|datetime|time ?stamp|clock( time)?|time of day|tod|real time|local time|utc)$/;
const DOWNHOLE = /(bottom ?hole|downhole|down hole|\bbhp\b|\bdh\b|memory gauge|\bbh\b|at depth)/;
const ANNULUS = /(annulus|annular|\bann\b|casing pressure|\bcp\b)/;
const PRESSURE_NAMES = /(pressure|\bpress\b|\bpres\b|^p$|^p ?\d$|^p \w+$|\bspp\b|\bbhp\b|\bwhp\b|\bthp\b|\bsip\b)/;
const VOLUME_NAMES = /(volume|\bvol\b|^v$|cum(ulative)?\b|pumped|total pumped)/;
const RATE_NAMES = /(rate|^q$|flow|\bpump speed\b)/;
const DEPTH_NAMES = /(depth|^md$|^tvd$|^dept$)/;
const UNIT_FORM_TIMESTAMP = /^(hh:mm(:ss)?(\.s+)?|iso(-| )?8601|yyyy-mm-dd.*)$/i;

/**
 * Separates a header into name and unit: bracketed "(psi)", "[s]", "{m3}", a comma part
 * "Rate, bbl/min", or a last token "Vol_bbl" / "BHP psi" when that token is a known unit.
 *
 * @param header header cell text
 * @returns {name, unit} with unit '' when none is written
 * @example splitHeaderUnit('Pressure (psi)') // {name: 'Pressure', unit: 'psi'}
 */
export function splitHeaderUnit(header: string): { name: string; unit: string } {
  const text = header.trim();
  const bracket = /^(.*?)[\s_]*[([{]\s*([^)\]}]*?)\s*[)\]}]\s*$/.exec(text);
  if (bracket && bracket[1] !== '') return { name: bracket[1].trim(), unit: bracket[2] };
  const comma = /^(.*?)\s*,\s*([^,]+)$/.exec(text);
  if (comma && isUnitText(comma[2])) return { name: comma[1], unit: comma[2].trim() };
  const last = /^(.*?)[\s_/-]+([^\s_-]+)$/.exec(text);
  if (last && last[1] !== '' && isUnitText(last[2])) return { name: last[1], unit: last[2] };
  return { name: text, unit: '' };
}

function isUnitText(text: string): boolean {
  return normaliseUnitName(text) !== null || UNIT_FORM_TIMESTAMP.test(text.trim());
}

/** Lower case, separators to spaces, no dots: the form the name patterns test. */
function foldName(name: string): string {
  return name.toLowerCase().replace(/[_\-.]+/g, ' ').replace(/\s+/g, ' ').trim();
}

/**
 * Reads role and unit from a header and, when present, the cell below it in a units row.
 * A unit in the units row wins over none in the header. Without a recognised name the
 * unit's dimension decides (a column in "bbl/min" is a rate).
 *
 * @param header header text as written
 * @param unitCell text of the units row for this column, if the file has one
 * @returns the reading; role 'other' when nothing is recognised
 * @example readHeader('Annulus pressure [kPa]') // {role:'pressure', unit:'kPa', pressureKind:'annulus', ...}
 */
export function readHeader(header: string, unitCell?: string): HeaderReading {
  const split = splitHeaderUnit(header);
  const unitText = split.unit !== '' ? split.unit : (unitCell ?? '').trim().replace(/^[([{](.*)[)\]}]$/, '$1');
  const unit = canonicalColumnUnit(unitText);
  const name = foldName(split.name);
  const role = roleFromName(name) ?? roleFromUnit(unit);
  const reading: HeaderReading = { role, unit, unitStated: unit !== '', name: split.name };
  if (unitText !== '' && unit === '') reading.unit = unitText;
  if (unit !== '' && role !== 'other' && role !== 'depth' && role !== 'timestamp' && unitDimension(unit) !== role && roleFromUnit(unit) !== 'other') {
    reading.role = roleFromUnit(unit);
  }
  if (reading.role === 'pressure') reading.pressureKind = pressureKindFromName(name);
  if (role === 'time' && (unit === 'iso-8601' || unit === 'hh:mm:ss')) reading.role = 'timestamp';
  return reading;
}

function canonicalColumnUnit(text: string): string {
  if (text === '' || text === '-') return '';
  if (UNIT_FORM_TIMESTAMP.test(text)) return /^hh/i.test(text) ? 'hh:mm:ss' : 'iso-8601';
  return normaliseUnitName(text) ?? '';
}

function roleFromName(name: string): ColumnRole | null {
  if (/temp(erature)?\b|density|weight|depth/.test(name) && !/^(time|elapsed)/.test(name)) return DEPTH_NAMES.test(name) ? 'depth' : 'other';
  if (TIMESTAMP_NAMES.test(name) || name === 'date') return 'timestamp';
  if (TIME_NAMES.test(name)) return 'time';
  if (PRESSURE_NAMES.test(name)) return 'pressure';
  if (VOLUME_NAMES.test(name)) return 'volume';
  if (RATE_NAMES.test(name)) return 'rate';
  if (DEPTH_NAMES.test(name)) return 'depth';
  return null;
}

function roleFromUnit(unit: string): ColumnRole {
  const dimension = unit ? unitDimension(unit) : null;
  if (dimension === 'pressure' || dimension === 'time' || dimension === 'rate' || dimension === 'volume') return dimension;
  if (unit === 'iso-8601' || unit === 'hh:mm:ss') return 'timestamp';
  return 'other';
}

function pressureKindFromName(name: string): PressureKind {
  if (DOWNHOLE.test(name)) return 'downhole';
  if (ANNULUS.test(name)) return 'annulus';
  if (/(surface|spp|stand ?pipe|pump|drill ?pipe|\bdp\b|wellhead|whp|thp|tubing|injection)/.test(name)) return 'surface';
  return 'unspecified';
}

/**
 * Whether a row of cells is a row of units (a second header row): every non-empty cell
 * is a recognised unit or a bracketed unit, and at least one is.
 *
 * @param cells cell texts of the row
 * @returns true for a units row
 * @example isUnitsRow(['s', 'psi', 'bbl/min', 'bbl']) // true
 */
export function isUnitsRow(cells: readonly string[]): boolean {
  let units = 0;
  for (const raw of cells) {
    const cell = raw.trim().replace(/^[([{](.*)[)\]}]$/, '$1');
    if (cell === '' || cell === '-') continue;
    if (!isUnitText(cell)) return false;
    units++;
  }
  return units > 0;
}
