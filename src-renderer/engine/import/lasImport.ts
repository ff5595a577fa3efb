/**
 * LAS 1.2 / 2.0 (CWLS) import. A time-indexed file (index unit s/min/h or hh:mm:ss, or
 * mnemonic TIME/ETIM) with a pressure curve becomes a TestRecord; a depth-indexed file
 * becomes a DepthLog keeping every curve (densities, lengths and pressures converted to SI,
 * other curves as written).
 */
import { EngineError, isEngineError } from '../errors';
import type { ColumnMapping, DepthLog, TestMetadata, TestRecord } from '../record';
import { normaliseUnitName } from '../units/unitNames';
import { unitDimension, unitFactorToSI } from '../units/units';
import { readHeader } from './columnRoles';
import type { ImportOptions } from './importOptions';
import { readLasData, type LasData } from './lasData';
import { splitLasSections, wellItemValue, type LasItem, type LasSections } from './lasSections';
import { readMetadataEntries } from './metadataFields';
import { buildTestRecord, type RawRole } from './recordBuilder';
import { decodeText } from './textEncoding';

/** Result of reading a LAS file. */
export type LasImport = { kind: 'test'; record: TestRecord } | { kind: 'log'; log: DepthLog };

/** Header facts of a LAS file. */
interface LasHeader {
  version: number;
  wrap: boolean;
  nullValue: number | null;
  commaDelimited: boolean;
  warnings: string[];
}

function readLasHeader(sections: LasSections, fileName: string): LasHeader {
  const warnings = [...sections.warnings];
  const item = (list: LasItem[], m: string) => list.find((i) => i.mnemonic.toUpperCase() === m);
  const vers = item(sections.version, 'VERS');
  const version = vers ? parseFloat(vers.value) : NaN;
  if (!vers) warnings.push('no VERS line in ~V; LAS 2.0 assumed');
  const wrapItem = item(sections.version, 'WRAP');
  if (!wrapItem) warnings.push('no WRAP line in ~V; unwrapped data assumed');
  const nullItem = item(sections.well, 'NULL');
  const nullValue = nullItem ? parseFloat(nullItem.value.replace(',', '.')) : null;
  if (!nullItem) warnings.push('no NULL line in ~W; no null value');
  const dlm = item(sections.version, 'DLM');
  if (Number.isFinite(version) && version >= 3) {
    throw new EngineError('unsupported-format', `LAS version ${version} is not supported`, { file: fileName, line: vers!.line }, 'LAS 1.2 or 2.0');
  }
  return {
    version: Number.isFinite(version) ? version : 2,
    wrap: wrapItem ? /^Y/i.test(wrapItem.value) : false,
    nullValue: nullValue !== null && Number.isFinite(nullValue) ? nullValue : null,
    commaDelimited: dlm ? /comma/i.test(dlm.value) : false,
    warnings,
  };
}

/** Factor of a LAS depth unit to metres, including ".1IN" (tenths of an inch). */
function depthFactor(unit: string): number | null {
  if (/^\.1in$/i.test(unit)) return 0.00254;
  if (/^(м|метр|метер|метры|метров)$/i.test(unit)) return 1;
  const name = normaliseUnitName(unit);
  return name && unitDimension(name) === 'length' ? unitFactorToSI(name, 'length') : null;
}

function isTimeIndex(curve: LasItem): 'number' | 'clock' | null {
  if (/^hh:?mm:?ss$/i.test(curve.unit)) return 'clock';
  const dimension = unitDimension(curve.unit);
  if (dimension === 'time') return 'number';
  if (dimension !== null) return null;
  return /^(TIME|ETIM|ETIME|ELTIM|TIM)$/i.test(curve.mnemonic) ? 'number' : null;
}

/**
 * Reads a LAS 1.2 or 2.0 file.
 *
 * @param bytes file content (UTF-8, UTF-16 with or without BOM, Windows-1252)
 * @param fileName shown in errors
 * @param options for a time-indexed test: mapping, metadata, allowMissingRateAndVolume
 * @returns {kind:'test', record} or {kind:'log', log}
 * @throws EngineError 'bad-las' (not LAS, rows disagreeing with ~C, bad index), 'empty-table'
 *   (no data), 'unsupported-format' (LAS 3), 'unknown-unit' (depth index unit), 'bad-encoding',
 *   and for tests the errors of buildTestRecord
 * @example parseLasFile(bytes, 'sample_2.0.las').kind // 'log'
 */
export function parseLasFile(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): LasImport {
  const sections = splitLasSections(decodeText(bytes, fileName), fileName);
  const header = readLasHeader(sections, fileName);
  const curves = sections.curves;
  if (curves.length === 0) throw new EngineError('bad-las', 'the ~C section lists no curves', { file: fileName }, 'a ~C section with at least the index curve');
  if (!sections.hasDataSection || sections.dataLines.length === 0) {
    throw new EngineError('empty-table', sections.hasDataSection ? 'the ~A section has no data' : 'the file has no ~A data section', { file: fileName }, 'rows of data after ~A');
  }
  const timeKind = isTimeIndex(curves[0]);
  const data = readLasData(sections, {
    curveCount: curves.length, wrap: header.wrap, nullValue: header.nullValue,
    commaDelimited: header.commaDelimited, clockIndex: timeKind === 'clock', fileName,
  });
  if (data.rows === 0) throw new EngineError('empty-table', 'every data row has a NULL index', { file: fileName }, 'rows of data after ~A');
  const warnings = [...header.warnings, ...data.warnings];
  if (timeKind) return { kind: 'test', record: lasTestRecord(sections, header, data, timeKind, fileName, warnings, options) };
  return { kind: 'log', log: lasDepthLog(sections, header, data, fileName, warnings) };
}

function lasDepthLog(sections: LasSections, header: LasHeader, data: LasData, fileName: string, warnings: string[]): DepthLog {
  const index = sections.curves[0];
  const unit = index.unit !== '' ? index.unit : sections.well.find((w) => /^STRT$/i.test(w.mnemonic))?.unit ?? '';
  const factor = depthFactor(unit);
  if (factor === null) {
    throw new EngineError('unknown-unit', `index curve ${index.mnemonic} has unit "${unit}", not a time or depth unit`, { file: fileName, line: index.line }, 'M, FT, F or a time unit (S, MIN, H)');
  }
  const depth = data.columns[0];
  for (let i = 0; i < depth.length; i++) depth[i] *= factor;
  const log: DepthLog = {
    depth, indexKind: depthIndexKind(index, sections),
    curves: {}, fileName, warnings,
  };
  for (let c = 1; c < data.columns.length; c++) addLogCurve(log, sections.curves[c], data.columns[c]);
  const well = sections.well.find((w) => /^WELL$/i.test(w.mnemonic));
  if (well && wellItemValue(well, header.version)) log.well = wellItemValue(well, header.version);
  if (header.nullValue !== null) log.nullValue = header.nullValue;
  return log;
}

/**
 * Whether the depth index is MD or TVD: a TVD mnemonic, or a DREF / depth-reference item
 * in ~P or ~W whose value says TVD, makes it TVD; DEPT, DEPTH or MD otherwise reads as MD.
 */
function depthIndexKind(index: LasItem, sections: LasSections): DepthLog['indexKind'] {
  if (/TVD/i.test(index.mnemonic)) return 'tvd';
  const reference = [...sections.parameters, ...sections.well].find((item) => /^(DREF|DEPTH_REF|DEPREF)$/i.test(item.mnemonic));
  if (reference && /\bTVD\b/i.test(reference.value)) return 'tvd';
  if (reference && /\bMD\b/i.test(reference.value)) return 'md';
  return /^(DEPT|DEPTH|MD)$/i.test(index.mnemonic) ? 'md' : 'unknown';
}

/** Adds a curve, converting recognised density, length, pressure and gradient units to SI. */
function addLogCurve(log: DepthLog, curve: LasItem, values: Float64Array): void {
  let name = curve.mnemonic || `CURVE${Object.keys(log.curves).length + 1}`;
  while (log.curves[name]) name = `${name}:2`;
  const canonical = normaliseUnitName(curve.unit);
  const dimension = canonical ? unitDimension(canonical) : null;
  const entry: DepthLog['curves'][string] = { unit: curve.unit, values, unitWritten: curve.unit };
  if (curve.description) entry.description = curve.description;
  if (canonical && (dimension === 'density' || dimension === 'length' || dimension === 'pressure' || dimension === 'gradient')) {
    const factor = unitFactorToSI(canonical, dimension);
    for (let i = 0; i < values.length; i++) values[i] *= factor;
    entry.unit = { density: 'kg/m3', length: 'm', pressure: 'Pa', gradient: 'Pa/m' }[dimension];
  }
  log.curves[name] = entry;
}

function lasTestRecord(sections: LasSections, header: LasHeader, data: LasData, timeKind: 'number' | 'clock', fileName: string, warnings: string[], options: ImportOptions): TestRecord {
  const curves = sections.curves.slice(0, data.columns.length);
  const readings = curves.map((c, i) => (i === 0 ? null : readHeader(c.description || c.mnemonic, c.unit)));
  for (const o of options.columns ?? []) if (o.index > 0 && o.index < readings.length) readings[o.index] = { role: o.role, unit: o.unit ?? curves[o.index].unit, unitStated: true, name: curves[o.index].mnemonic };
  const pick = (role: string) => readings.findIndex((r) => r !== null && (r.role === role || (role === 'pressure' && r.role === 'other' && unitDimension(r.unit) === 'pressure')));
  const found = { pressure: pick('pressure'), rate: pick('rate'), volume: pick('volume') };
  if (found.pressure < 0) {
    throw new EngineError('no-pressure-column', 'the time-indexed LAS file has no pressure curve', { file: fileName, line: curves[0].line }, 'a curve in psi, kPa, MPa or bar, or named pressure');
  }
  const columns: ColumnMapping[] = curves.map((c, i) => ({
    index: i, header: c.mnemonic, role: i === 0 ? (timeKind === 'clock' ? 'timestamp' : 'time') : roleOf(i, found), unit: c.unit, unitStated: c.unit !== '',
  }));
  const locate = (row: number, role: RawRole) => {
    const column = role === 'time' ? 0 : found[role];
    return row < 0 ? { file: fileName, line: curves[column]?.line } : { file: fileName, line: data.lines[row] };
  };
  const value = (i: number) => (i < 0 ? null : data.columns[i]);
  return buildTestRecord({
    fileName, format: 'las', time: data.columns[0], timeKind, timeUnit: curves[0].unit || 's',
    pressure: data.columns[found.pressure], pressureUnit: curves[found.pressure].unit,
    rate: value(found.rate), rateUnit: found.rate < 0 ? '' : curves[found.rate].unit,
    volume: value(found.volume), volumeUnit: found.volume < 0 ? '' : curves[found.volume].unit,
    columns, layout: `las|${curves.map((c) => `${c.mnemonic}.${c.unit}`.toLowerCase()).join('|')}`,
    metadata: lasMetadata(sections, header.version, warnings), warnings, locate,
  }, options);
}

function roleOf(i: number, found: Record<'pressure' | 'rate' | 'volume', number>): ColumnMapping['role'] {
  return i === found.pressure ? 'pressure' : i === found.rate ? 'rate' : i === found.volume ? 'volume' : 'other';
}

/** Well, field, contractor, date and formation from ~W; recognised parameters (mud weight, FORM ...) from ~P. */
function lasMetadata(sections: LasSections, version: number, warnings: string[]): TestMetadata {
  const entries = sections.parameters.map((p) => ({
    key: p.description || p.mnemonic, value: p.unit ? `${p.value} ${p.unit}` : p.value, location: { line: p.line },
  }));
  let metadata: TestMetadata = {};
  try {
    const reading = readMetadataEntries(entries);
    metadata = reading.metadata;
    warnings.push(...reading.warnings);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    warnings.push(`~P parameters not used: ${e.message}`);
  }
  const well = (m: string) => {
    const item = sections.well.find((w) => w.mnemonic.toUpperCase() === m);
    return item ? wellItemValue(item, version) : '';
  };
  if (well('WELL')) metadata.well = well('WELL');
  if (well('FLD')) metadata.field = well('FLD');
  if (well('SRVC')) metadata.contractor = well('SRVC');
  if (/^\d{4}-\d{2}-\d{2}/.test(well('DATE'))) metadata.date = well('DATE').slice(0, 10);
  // The tested formation: a FORM or FORMATION item in ~P (value) or ~W (LAS 1.2 writes it in the description place).
  const formationParameter = sections.parameters.find((p) => /^(FORM|FORMATION)$/i.test(p.mnemonic))?.value.trim();
  const formation = formationParameter || well('FORM') || well('FORMATION');
  if (formation) metadata.formation = formation;
  return metadata;
}
