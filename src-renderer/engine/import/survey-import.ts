/**
 * Directional survey files: a delimited table (CSV, semicolon or tab separated TXT, decimal
 * point or comma) with measured depth, inclination and azimuth columns under a metadata
 * block, or a depth-indexed LAS log with inclination and azimuth curves. Stations come out
 * in metres and degrees and are checked by the minimum-curvature validation of
 * analysis/survey.ts, with errors moved to the file's own line and column.
 *
 * The generic reader of depth tables here ({@link readDepthTable}) also serves other
 * depth-indexed tables (pore-pressure measurements).
 */
import { EngineError, isEngineError, type SourceLocation } from '../errors';
import { minimumCurvature, type SurveyStation } from '../analysis/survey';
import { normaliseUnitName } from '../units/unitNames';
import { unitDimension, unitFactorToSI } from '../units/units';
import { parseNumberText } from './cellValues';
import { isUnitsRow, splitHeaderUnit } from './columnRoles';
import { parseLasFile } from './lasImport';
import { splitLasSections } from './lasSections';
import { metadataEntryOfRow, type MetadataEntry } from './metadataEntries';
import { readMetadataEntries } from './metadataFields';
import { detectDecimalMark, detectDelimiter, respaceHeader, rowWidth, splitLine } from './tableLayout';
import { decodeText } from './textEncoding';

/** A survey as read from a file: stations in metres and degrees. */
export interface SurveyImport {
  /** Well name from the metadata block or the LAS ~W WELL item. */
  well?: string;
  /** Stations, MD in m increasing, inclination 0-180 degrees, azimuth degrees. */
  stations: SurveyStation[];
  /** MD unit as written in the file ('m', 'ft' ...). */
  depthUnit: string;
  /** Notes made while reading (skipped null rows, assumed units). */
  warnings: string[];
}

/** A column found by {@link readDepthTable}: its 0-based index, header line and unit text. */
export interface DepthTableColumn {
  index: number;
  header: string;
  /** Unit as written in the header or the units row ('' when none). */
  unit: string;
  line: number;
}

/** A delimited table read by role: columns found, data rows with their line numbers. */
export interface DepthTable {
  columns: Record<string, DepthTableColumn | undefined>;
  rows: { line: number; cells: string[] }[];
  decimalMark: '.' | ',';
  metadata: MetadataEntry[];
  headerLine: number;
}

/** Header names (lower case, unit removed) of the survey columns; common practice spellings. */
export const SURVEY_COLUMN_NAMES: Readonly<Record<'md' | 'inc' | 'azi', RegExp>> = {
  md: /^(md|measured depth|meas(ured)? depth|depth md|md depth|dept|depth|mdepth|md rkb|md rt)$/,
  inc: /^(inc|incl|inclination|inclin|angle|deviation|dev|devi|hole angle|drift)$/,
  azi: /^(az|azi|azim|azimuth|hazi|direction|dir|azimuth true|azimuth grid|azi true|azi grid|true azimuth|grid azimuth)$/,
};

const HEAD_LINES = 200;
/** Angle units as written (lower case, no dots or spaces): degrees with a north reference, radians, gons. */
const ANGLE_UNIT = /^((deg|degs|degree|degrees|dega|°|º|dd)(true|grid|tn|gn|t|g)?|rad|rads|radian|radians|grad|gon|gons)$/;

function foldName(name: string): string {
  return name.toLowerCase().replace(/[_\-.]+/g, ' ').replace(/\s+/g, ' ').trim();
}

/**
 * Reads a delimited table by column role: the text is decoded (UTF-8/16, Windows-1252),
 * the delimiter and decimal mark detected (engine/import/tableLayout), the header row is
 * the first row naming every required role; a units row below it is used when present;
 * rows above it are the metadata block.
 *
 * @param bytes file content. @param fileName for errors.
 * @param roles header-name patterns (tested on the lower-case name without its unit) by role.
 * @param required roles that must be present.
 * @returns the table with its columns, data rows (blank rows dropped) and metadata entries.
 * @throws EngineError 'bad-encoding'; 'empty-table' with no header naming the required roles or no data row.
 * @example readDepthTable(bytes, 'pp.csv', { tvd: /^tvd$/, pp: /^pp$/ }, ['tvd', 'pp']).rows.length
 */
export function readDepthTable(bytes: Uint8Array, fileName: string, roles: Readonly<Record<string, RegExp>>, required: readonly string[]): DepthTable {
  const lines = decodeText(bytes, fileName).split(/\r\n|\n|\r/);
  const delimiter = detectDelimiter(lines.slice(0, HEAD_LINES));
  const rows = lines.map((l) => splitLine(l, delimiter));
  if (delimiter === ' ') respaceHeader(rows, lines);
  let headerRow = -1;
  let columns: DepthTable['columns'] = {};
  for (let r = 0; r < Math.min(rows.length, HEAD_LINES) && headerRow < 0; r++) {
    const found: DepthTable['columns'] = {};
    rows[r].forEach((cell, index) => {
      const { name, unit } = splitHeaderUnit(cell);
      const folded = foldName(name);
      for (const [role, pattern] of Object.entries(roles)) {
        if (!found[role] && pattern.test(folded)) {
          found[role] = { index, header: cell, unit, line: r + 1 };
          break;
        }
      }
    });
    if (required.every((role) => found[role])) {
      headerRow = r;
      columns = found;
    }
  }
  if (headerRow < 0) {
    throw new EngineError('empty-table', `no header row naming the ${required.join(', ')} columns`, { file: fileName }, `a header row with ${required.join(', ')} columns`);
  }
  let dataStart = headerRow + 1;
  while (dataStart < rows.length && rowWidth(rows[dataStart]) === 0) dataStart++;
  if (dataStart < rows.length && isTableUnitsRow(rows[dataStart])) {
    const unitsRow = rows[dataStart];
    for (const column of Object.values(columns)) {
      if (column && column.unit === '') column.unit = (unitsRow[column.index] ?? '').trim().replace(/^[([{](.*)[)\]}]$/, '$1');
    }
    dataStart++;
  }
  const data: DepthTable['rows'] = [];
  for (let r = dataStart; r < rows.length; r++) if (rowWidth(rows[r]) > 0) data.push({ line: r + 1, cells: rows[r] });
  if (data.length === 0) throw new EngineError('empty-table', 'the table has no data rows', { file: fileName, line: headerRow + 1 }, 'rows of data below the header');
  const metadata: MetadataEntry[] = [];
  for (let r = 0; r < headerRow; r++) {
    const entry = metadataEntryOfRow(rows[r], { file: fileName, line: r + 1 });
    if (entry) metadata.push(entry);
  }
  return { columns, rows: data, decimalMark: detectDecimalMark(data.slice(0, 50).map((d) => d.cells), delimiter), metadata, headerLine: headerRow + 1 };
}

/** A units row: every filled cell a known unit or an angle unit, at least one filled (columnRoles' test widened to angles). */
function isTableUnitsRow(cells: readonly string[]): boolean {
  if (isUnitsRow(cells)) return true;
  const filled = cells.map((c) => c.trim().replace(/^[([{](.*)[)\]}]$/, '$1')).filter((c) => c !== '' && c !== '-');
  return filled.length > 0 && filled.every((c) => isUnitsRow([c]) || ANGLE_UNIT.test(c.toLowerCase().replace(/[.\s]/g, '')));
}

/**
 * A number from a table cell, or an EngineError naming file, line and column.
 *
 * @param table from {@link readDepthTable}. @param row one of its rows. @param column a found column.
 * @param fileName for the error. @param what plain words for the message ("measured depth").
 * @returns the number.
 * @throws EngineError 'non-numeric-cell' when the cell is not a number.
 * @example tableNumber(table, table.rows[0], table.columns.md!, 'a.csv', 'measured depth')
 */
export function tableNumber(table: DepthTable, row: DepthTable['rows'][number], column: DepthTableColumn, fileName: string, what: string): number {
  const text = row.cells[column.index] ?? '';
  const value = parseNumberText(text, table.decimalMark);
  if (!Number.isFinite(value)) {
    throw new EngineError('non-numeric-cell', `${what} "${text}" is not a number`, { file: fileName, line: row.line, column: column.index + 1 }, `a number${table.decimalMark === ',' ? ' with a decimal comma' : ''}`);
  }
  return value;
}

/**
 * Factor to metres of a depth column's unit, from its header or units row, else the
 * metadata block's "Depth units" hint.
 *
 * @param column the column. @param hint unit from the metadata block, if any.
 * @param location where to point an error.
 * @returns the factor to m and the canonical unit name.
 * @throws EngineError 'unknown-unit' when no length unit is written or the unit is not a length.
 * @example lengthFactorOfColumn({ index: 0, header: 'MD (ft)', unit: 'ft', line: 6 }, undefined, {}) // {factor: 0.3048, unit: 'ft'}
 */
export function lengthFactorOfColumn(column: DepthTableColumn, hint: string | undefined, location: SourceLocation): { factor: number; unit: string } {
  const written = column.unit !== '' ? column.unit : hint ?? '';
  const unit = written ? normaliseUnitName(written) : null;
  if (!unit || unitDimension(unit) !== 'length') {
    throw new EngineError('unknown-unit', written ? `depth column "${column.header}" has unit "${written}", which is not a length` : `depth column "${column.header}" states no unit`, location, 'a length unit in the header, e.g. "MD (m)" or "MD (ft)"');
  }
  return { factor: unitFactorToSI(unit, 'length'), unit };
}

/** Factor to degrees of an angle unit as written ('' reads as degrees, the common practice). */
function angleFactor(unit: string, what: string, location: SourceLocation): number {
  const u = unit.trim().toLowerCase().replace(/[.\s]/g, '');
  if (u === '' || (ANGLE_UNIT.test(u) && !/^(rad|rads|radian|radians|grad|gon|gons)$/.test(u))) return 1;
  if (/^(rad|rads|radian|radians)$/.test(u)) return 180 / Math.PI;
  if (/^(grad|gon|gons)$/.test(u)) return 0.9;
  throw new EngineError('unknown-unit', `${what} has unit "${unit}", which is not an angle`, location, 'degrees (deg) or radians (rad)');
}

/** Runs the minimum-curvature validation and moves a 'bad-survey' error to the file position of the station. */
function validateStations(stations: SurveyStation[], fileName: string, position: (station: number, field: 'md' | 'inc' | 'azi') => SourceLocation): void {
  if (stations.length < 2) {
    throw new EngineError('too-few-points', `the survey has ${stations.length} station${stations.length === 1 ? '' : 's'}`, { file: fileName }, 'at least two survey stations');
  }
  try {
    minimumCurvature(stations);
  } catch (e) {
    if (!isEngineError(e) || e.code !== 'bad-survey' || e.location.line === undefined) throw e;
    const station = e.location.line - 1;
    const message = e.message.replace(/^line \d+: /, '').replace(/ \(expected [^)]*\)$/, '');
    const field = /inclination/.test(message) ? 'inc' : /azimuth/.test(message) ? 'azi' : 'md';
    throw new EngineError('bad-survey', message, position(station, field), e.expected);
  }
}

/** Whether the bytes start like a LAS file (~V section first). */
function looksLikeLas(bytes: Uint8Array, fileName: string): boolean {
  if (/\.las$/i.test(fileName)) return true;
  const head = decodeText(bytes.subarray(0, 4096), fileName).replace(/^\s*(#[^\n]*\n\s*)*/, '');
  return /^~V/i.test(head);
}

function parseDelimitedSurvey(bytes: Uint8Array, fileName: string): SurveyImport {
  const table = readDepthTable(bytes, fileName, SURVEY_COLUMN_NAMES, ['md', 'inc', 'azi']);
  const warnings: string[] = [];
  let well: string | undefined;
  let depthHint: string | undefined;
  try {
    const reading = readMetadataEntries(table.metadata);
    well = reading.metadata.well;
    depthHint = reading.unitHints.depth;
  } catch (e) {
    if (!isEngineError(e)) throw e;
    warnings.push(`metadata block not fully read: ${e.message}`);
    well = table.metadata.find((m) => /^(well( name| id)?|wellbore( name)?)$/i.test(m.key.trim()))?.value;
  }
  const md = table.columns.md!;
  const inc = table.columns.inc!;
  const azi = table.columns.azi!;
  const headerAt = (c: DepthTableColumn) => ({ file: fileName, line: c.line, column: c.index + 1 });
  const length = lengthFactorOfColumn(md, depthHint, headerAt(md));
  const incFactor = angleFactor(inc.unit, `inclination column "${inc.header}"`, headerAt(inc));
  const aziFactor = angleFactor(azi.unit, `azimuth column "${azi.header}"`, headerAt(azi));
  if (inc.unit === '' || azi.unit === '') warnings.push('angle columns without a unit read as degrees (common practice)');
  const stations = table.rows.map((row) => ({
    md: tableNumber(table, row, md, fileName, 'measured depth') * length.factor,
    inc: tableNumber(table, row, inc, fileName, 'inclination') * incFactor,
    azi: tableNumber(table, row, azi, fileName, 'azimuth') * aziFactor,
  }));
  validateStations(stations, fileName, (i, field) => ({ file: fileName, line: table.rows[i].line, column: table.columns[field]!.index + 1 }));
  return { ...(well ? { well } : {}), stations, depthUnit: length.unit, warnings };
}

const LAS_INC = /^(INC|INCL|INCLINATION|DEVI|DEV|HDEV|ANGLE)$/i;
const LAS_AZI = /^(AZI|AZIM|AZ|HAZI|AZIMUTH|DAZI|AZTR|AZIT)$/i;

function parseLasSurvey(bytes: Uint8Array, fileName: string): SurveyImport {
  const parsed = parseLasFile(bytes, fileName);
  if (parsed.kind !== 'log') throw new EngineError('bad-survey', 'the LAS file is indexed by time, not by measured depth', { file: fileName }, 'a depth-indexed LAS log with inclination and azimuth curves');
  const log = parsed.log;
  if (log.indexKind === 'tvd') throw new EngineError('bad-survey', 'the LAS log is indexed by TVD; a survey is indexed by measured depth', { file: fileName }, 'an MD (DEPT) index');
  const names = Object.keys(log.curves);
  const incName = names.find((n) => LAS_INC.test(n));
  const aziName = names.find((n) => LAS_AZI.test(n));
  if (!incName || !aziName) {
    throw new EngineError('bad-survey', `no ${incName ? 'azimuth' : 'inclination'} curve in the log; curves are ${names.join(', ') || 'none'}`, { file: fileName }, 'INC and AZI curves');
  }
  const sections = splitLasSections(decodeText(bytes, fileName), fileName);
  const curveLine = (name: string) => sections.curves.find((c) => c.mnemonic === name)?.line;
  const lineOf = (i: number) => (sections.dataLines.length === log.depth.length ? sections.dataLines[i].line : undefined);
  const inc = log.curves[incName];
  const azi = log.curves[aziName];
  const incFactor = angleFactor(inc.unitWritten ?? inc.unit, `curve ${incName}`, { file: fileName, line: curveLine(incName) });
  const aziFactor = angleFactor(azi.unitWritten ?? azi.unit, `curve ${aziName}`, { file: fileName, line: curveLine(aziName) });
  const stations: SurveyStation[] = [];
  const rowOf: number[] = [];
  let skipped = 0;
  for (let i = 0; i < log.depth.length; i++) {
    const a = inc.values[i];
    const b = azi.values[i];
    if (!Number.isFinite(a) || !Number.isFinite(b) || a === log.nullValue || b === log.nullValue) {
      skipped++;
      continue;
    }
    stations.push({ md: log.depth[i], inc: a * incFactor, azi: b * aziFactor });
    rowOf.push(i);
  }
  const warnings = [...(log.warnings ?? [])];
  if (skipped) warnings.push(`${skipped} rows with a null inclination or azimuth skipped`);
  const columnOf = { md: 1, inc: names.indexOf(incName) + 2, azi: names.indexOf(aziName) + 2 };
  validateStations(stations, fileName, (i, field) => ({ file: fileName, line: lineOf(rowOf[i]), column: columnOf[field] }));
  const index = sections.curves[0];
  return { ...(log.well ? { well: log.well } : {}), stations, depthUnit: normaliseUnitName(index?.unit ?? '') ?? (index?.unit || 'm'), warnings };
}

/**
 * Reads a directional survey file: CSV/TXT (comma, semicolon, tab or space separated,
 * decimal point or comma, headers such as "MD (m)", "Inclination (deg)", "Azimuth (deg)"
 * or a units row, MD in m or ft, a metadata block naming the well) or LAS (depth-indexed,
 * INC and AZI curves). MD is converted to metres (NIST SP 811 foot = 0.3048 m); angles
 * without a unit are degrees (common practice). Stations are checked by the minimum
 * curvature validation (analysis/survey.ts).
 *
 * @param bytes file content (UTF-8, UTF-16, Windows-1252). @param fileName for errors and the LAS test.
 * @returns the well name when stated, the stations (m, degrees), the MD unit written and warnings.
 * @throws EngineError 'bad-survey' (MD not increasing, inclination outside 0-180, direction
 *   reversal, no angle curves) naming file, line and column; 'non-numeric-cell';
 *   'unknown-unit' (MD without a length unit, angle in an unknown unit); 'empty-table' (no
 *   header with MD, inclination and azimuth); 'too-few-points' (fewer than two stations);
 *   'bad-las' / 'bad-encoding' from the LAS and text readers.
 * @example parseSurveyFile(bytes, 'HF-3_survey.csv').stations[1] // {md: 30, inc: 0, azi: 0}
 */
export function parseSurveyFile(bytes: Uint8Array, fileName: string): SurveyImport {
  return looksLikeLas(bytes, fileName) ? parseLasSurvey(bytes, fileName) : parseDelimitedSurvey(bytes, fileName);
}

/** The first 64 KiB of a text file, cut after a line end (UTF-16 LE keeps its zero byte). */
function headOfText(bytes: Uint8Array): Uint8Array {
  const limit = 65536;
  if (bytes.length <= limit) return bytes;
  let i = limit - 1;
  while (i > 0 && bytes[i] !== 0x0a) i--;
  if (i === 0) return bytes.subarray(0, limit);
  return bytes.subarray(0, bytes[i + 1] === 0 ? i + 2 : i + 1);
}

/**
 * Whether a file holds a survey: a LAS depth log with inclination and azimuth curves, or a
 * table whose header names MD, inclination and azimuth. Nothing else is checked (the
 * stations may still be bad: {@link parseSurveyFile} tells).
 *
 * @param bytes file content. @param fileName its name.
 * @returns true when the file is laid out as a survey.
 * @example isSurveyFile(bytes, 'HF-3_survey.csv') // true
 */
export function isSurveyFile(bytes: Uint8Array, fileName: string): boolean {
  try {
    if (looksLikeLas(bytes, fileName)) {
      const sections = splitLasSections(decodeText(bytes, fileName), fileName);
      return sections.curves.some((c) => LAS_INC.test(c.mnemonic)) && sections.curves.some((c) => LAS_AZI.test(c.mnemonic));
    }
    readDepthTable(headOfText(bytes), fileName, SURVEY_COLUMN_NAMES, ['md', 'inc', 'azi']);
    return true;
  } catch {
    return false;
  }
}
