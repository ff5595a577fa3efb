/**
 * Pore-pressure measurements from a delimited file (CSV, semicolon or tab separated TXT):
 * a TVD column with its length unit and a pore-pressure column with a pressure unit (or a
 * gradient / equivalent mud weight, multiplied by TVD below the rig floor), optionally a
 * well and a source column, under an optional metadata block naming the well. The table
 * is read with the shared depth-table reader (engine/import/survey-import.ts).
 */
import { EngineError } from '../errors';
import { lengthFactorOfColumn, readDepthTable, tableNumber, type DepthTable, type DepthTableColumn } from '../import/survey-import';
import { STANDARD_GRAVITY } from '../units/quantity';
import { normaliseUnitName } from '../units/unitNames';
import { unitDimension, unitFactorToSI } from '../units/units';
import type { PorePressureMeasurement } from './pore-pressure';

/** One measurement as read, with the well and the file line it came from. */
export interface PorePressurePoint extends PorePressureMeasurement {
  /** Well named in the row's well column, else in the metadata block, else absent. */
  well?: string;
  line: number;
}

/** Header names (lower case, unit removed) of the columns; common practice spellings. */
export const PORE_PRESSURE_COLUMN_NAMES: Readonly<Record<'tvd' | 'pp' | 'well' | 'source', RegExp>> = {
  tvd: /^(tvd|true vertical depth|depth tvd|tvd depth|tvd rkb|tvd rt|tvdss|depth)$/,
  pp: /^(pp|pore pressure|formation pressure|reservoir pressure|pressure|pore pressure gradient|pp gradient|pp emw|pore pressure emw|emw)$/,
  well: /^(well|well name|wellbore|well id)$/,
  source: /^(source|method|tool|measurement|type)$/,
};

/** How the pressure column converts: a pressure, or a gradient / density times TVD. */
function pressureReader(column: DepthTableColumn, fileName: string): { kind: 'pressure' | 'gradient' | 'density'; factor: number } {
  const unit = column.unit ? normaliseUnitName(column.unit) : null;
  const dimension = unit ? unitDimension(unit) : null;
  if (unit && (dimension === 'pressure' || dimension === 'gradient' || dimension === 'density')) {
    return { kind: dimension, factor: unitFactorToSI(unit, dimension) };
  }
  throw new EngineError('unknown-unit', column.unit ? `pore-pressure column "${column.header}" has unit "${column.unit}", not a pressure, gradient or density` : `pore-pressure column "${column.header}" states no unit`,
    { file: fileName, line: column.line, column: column.index + 1 }, 'a unit in the header, e.g. "Pp (MPa)", "Pp (psi)", "Pp (kPa/m)" or "Pp (sg)"');
}

function wellOfMetadata(table: DepthTable): string | undefined {
  return table.metadata.find((m) => /^(well( name| id)?|wellbore( name)?)$/i.test(m.key.trim()))?.value;
}

/**
 * Reads pore-pressure measurements: TVD converted to m (NIST SP 811 factors), pressure to
 * Pa; a gradient is multiplied by TVD, a density (EMW) by g x TVD (g = 9.80665 m/s2).
 *
 * @param bytes file content (UTF-8, UTF-16, Windows-1252). @param fileName for errors.
 * @returns every row as a {@link PorePressurePoint}, in file order.
 * @throws EngineError 'empty-table' without TVD and pore-pressure headers or data;
 *   'unknown-unit' for a column without a usable unit; 'non-numeric-cell' naming line and
 *   column; 'out-of-range' for a TVD <= 0 or a negative pressure (line and column named).
 * @example parsePorePressureFile(bytes, 'pp.csv')[0] // {tvd: 1500, pressure: 1.6e7, line: 3}
 */
export function parsePorePressureFile(bytes: Uint8Array, fileName: string): PorePressurePoint[] {
  const table = readDepthTable(bytes, fileName, PORE_PRESSURE_COLUMN_NAMES, ['tvd', 'pp']);
  const tvd = table.columns.tvd!;
  const pp = table.columns.pp!;
  const length = lengthFactorOfColumn(tvd, undefined, { file: fileName, line: tvd.line, column: tvd.index + 1 });
  const reader = pressureReader(pp, fileName);
  const metadataWell = wellOfMetadata(table);
  return table.rows.map((row) => {
    const z = tableNumber(table, row, tvd, fileName, 'TVD') * length.factor;
    if (!(z > 0)) throw new EngineError('out-of-range', `TVD ${z} m is not below the rig floor`, { file: fileName, line: row.line, column: tvd.index + 1 }, 'a TVD > 0');
    const raw = tableNumber(table, row, pp, fileName, 'pore pressure') * reader.factor;
    const pressure = reader.kind === 'pressure' ? raw : reader.kind === 'gradient' ? raw * z : raw * STANDARD_GRAVITY * z;
    if (!(pressure >= 0)) throw new EngineError('out-of-range', `pore pressure ${pressure} Pa is negative`, { file: fileName, line: row.line, column: pp.index + 1 }, 'a pressure >= 0');
    const wellCell = table.columns.well ? (row.cells[table.columns.well.index] ?? '').trim() : '';
    const sourceCell = table.columns.source ? (row.cells[table.columns.source.index] ?? '').trim() : '';
    const well = wellCell || metadataWell;
    return { tvd: z, pressure, line: row.line, ...(well ? { well } : {}), ...(sourceCell ? { source: sourceCell } : { source: `${fileName} line ${row.line}` }) };
  });
}

/**
 * The measurements of one well: with a well name, the points of that well (and points
 * without a well); without one, every point when they name at most one well.
 *
 * @param points from {@link parsePorePressureFile}. @param well the well wanted, if any.
 * @param fileName for errors.
 * @returns the chosen points and the well they belong to (when known).
 * @throws EngineError 'bad-argument' when the file names several wells and none is chosen,
 *   or no point belongs to the chosen well.
 * @example pointsOfWell(points, 'HF-3', 'pp.csv').points.length
 */
export function pointsOfWell(points: readonly PorePressurePoint[], well: string | undefined, fileName: string): { points: PorePressurePoint[]; well?: string } {
  const wells = [...new Set(points.map((p) => p.well).filter((w): w is string => !!w))];
  if (well === undefined) {
    if (wells.length > 1) throw new EngineError('bad-argument', `the pore-pressure file names ${wells.length} wells (${wells.join(', ')})`, { file: fileName }, 'one well chosen (--well NAME)');
    return { points: [...points], ...(wells[0] ? { well: wells[0] } : {}) };
  }
  const chosen = points.filter((p) => !p.well || p.well === well);
  if (chosen.length === 0) throw new EngineError('bad-argument', `no pore-pressure point of well ${well}; the file names ${wells.join(', ')}`, { file: fileName }, 'a well named in the file');
  return { points: chosen, well };
}
