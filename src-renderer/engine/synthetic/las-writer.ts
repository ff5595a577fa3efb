/**
 * LAS 2.0 text (Canadian Well Logging Society, LAS Version 2.0 specification) for the
 * demo files: a time-indexed gauge export of a test record, and a depth-indexed log.
 * Sections ~V, ~W, ~C, ~P, ~A; unwrapped; one line per index step.
 */
import { EngineError } from '../errors';
import type { TestRecord } from '../record';
import { fromSI } from '../units/units';

const NULL_VALUE = -999.25;

function headerLine(mnemonic: string, unit: string, value: string, description: string): string {
  const left = `${mnemonic.padEnd(4)}.${unit}`.padEnd(16);
  return ` ${left} ${value.padEnd(30)} : ${description}`;
}

function versionSection(): string[] {
  return ['~VERSION INFORMATION', headerLine('VERS', '', '2.0', 'CWLS LOG ASCII STANDARD - VERSION 2.0'), headerLine('WRAP', '', 'NO', 'ONE LINE PER STEP')];
}

/**
 * A test record as a time-indexed LAS 2.0 file: curves TIME (s), PRES (kPa, gauge),
 * RATE (m3/min), VOL (m3); parameters TVD, MD, mud density, gauge position, test type.
 *
 * @param record SI record. @returns LAS text with LF line ends.
 * @throws EngineError 'empty-table' for a record without samples.
 * @example recordToLas(record).startsWith('~VERSION') // true
 */
export function recordToLas(record: TestRecord): string {
  const n = record.time.length;
  if (n === 0) throw new EngineError('empty-table', 'the record has no samples', {}, 'at least one sample');
  const m = record.metadata;
  const step = n > 1 ? record.time[1] - record.time[0] : 0;
  let uniform = true;
  for (let i = 2; i < n; i++) if (Math.abs(record.time[i] - record.time[i - 1] - step) > 1e-6) uniform = false;
  const lines = [
    ...versionSection(),
    '~WELL INFORMATION',
    headerLine('STRT', 'S', record.time[0].toFixed(3), 'START TIME'),
    headerLine('STOP', 'S', record.time[n - 1].toFixed(3), 'STOP TIME'),
    headerLine('STEP', 'S', (uniform ? step : 0).toFixed(3), 'STEP'),
    headerLine('NULL', '', NULL_VALUE.toFixed(2), 'NULL VALUE'),
    headerLine('COMP', '', m.contractor ?? '', 'COMPANY'),
    headerLine('WELL', '', m.well ?? '', 'WELL'),
    headerLine('FLD', '', m.field ?? '', 'FIELD'),
    headerLine('SRVC', '', m.contractor ?? '', 'SERVICE COMPANY'),
    headerLine('DATE', '', m.date ?? '', 'DATE'),
    '~CURVE INFORMATION',
    headerLine('TIME', 'S', '', 'ELAPSED TIME'),
    headerLine('PRES', 'KPA', '', `${(m.gaugePosition ?? 'surface').toUpperCase()} GAUGE PRESSURE`),
    headerLine('RATE', 'M3/MIN', '', 'PUMP RATE'),
    headerLine('VOL', 'M3', '', 'CUMULATIVE PUMPED VOLUME'),
    '~PARAMETER INFORMATION',
  ];
  if (m.depthTvd !== undefined) lines.push(headerLine('TVD', 'M', m.depthTvd.toFixed(1), 'TRUE VERTICAL DEPTH OF TEST'));
  if (m.depthMd !== undefined) lines.push(headerLine('MD', 'M', m.depthMd.toFixed(1), 'MEASURED DEPTH OF TEST'));
  if (m.mudDensity !== undefined) lines.push(headerLine('MUDD', 'KG/M3', m.mudDensity.toFixed(0), 'MUD DENSITY'));
  if (m.gaugePosition) lines.push(headerLine('GAUG', '', m.gaugePosition, 'GAUGE POSITION'));
  if (m.testType) lines.push(headerLine('TTYP', '', m.testType.toUpperCase(), 'TEST TYPE'));
  if (m.gaugeRange !== undefined) lines.push(headerLine('GRNG', 'KPA', (m.gaugeRange / 1e3).toFixed(1), 'GAUGE RANGE'));
  if (m.holeDiameter !== undefined) lines.push(headerLine('BS', 'MM', (m.holeDiameter * 1e3).toFixed(1), 'BIT SIZE'));
  if (m.systemVolume !== undefined) lines.push(headerLine('SVOL', 'M3', m.systemVolume.toFixed(2), 'SYSTEM VOLUME'));
  if (m.compressibility !== undefined) lines.push(headerLine('CMPR', '1/KPA', (m.compressibility * 1e3).toExponential(4), 'EFFECTIVE COMPRESSIBILITY'));
  lines.push('~A  TIME        PRES         RATE        VOL');
  for (let i = 0; i < n; i++) {
    lines.push([
      record.time[i].toFixed(1).padStart(9),
      fromSI(record.pressure[i], 'kPa', 'pressure').toFixed(1).padStart(12),
      fromSI(record.rate[i], 'm3/min', 'rate').toFixed(4).padStart(11),
      record.volume[i].toFixed(4).padStart(10),
    ].join(' '));
  }
  return lines.join('\n') + '\n';
}

/**
 * A depth-indexed bulk-density log as LAS 2.0: DEPT (m) and RHOB (g/cm3).
 *
 * @param log.depth m, increasing; log.density kg/m3, same length; log.well, log.company, log.field names.
 * @returns LAS text. @throws EngineError 'bad-argument' for unequal lengths or fewer than 2 depths.
 * @example densityLogToLas({depth: [0, 5], density: [2000, 2010], well: 'HF-6'})
 */
export function densityLogToLas(log: { depth: ArrayLike<number>; density: ArrayLike<number>; well: string; company?: string; field?: string; date?: string }): string {
  const n = log.depth.length;
  if (n < 2 || log.density.length !== n) throw new EngineError('bad-argument', 'depth and density need equal lengths of at least 2', {}, 'matching depth and density arrays');
  const step = log.depth[1] - log.depth[0];
  const lines = [
    ...versionSection(),
    '~WELL INFORMATION',
    headerLine('STRT', 'M', log.depth[0].toFixed(2), 'START DEPTH'),
    headerLine('STOP', 'M', log.depth[n - 1].toFixed(2), 'STOP DEPTH'),
    headerLine('STEP', 'M', step.toFixed(2), 'STEP'),
    headerLine('NULL', '', NULL_VALUE.toFixed(2), 'NULL VALUE'),
    headerLine('COMP', '', log.company ?? '', 'COMPANY'),
    headerLine('WELL', '', log.well, 'WELL'),
    headerLine('FLD', '', log.field ?? '', 'FIELD'),
    headerLine('DATE', '', log.date ?? '', 'DATE'),
    '~CURVE INFORMATION',
    headerLine('DEPT', 'M', '', 'TRUE VERTICAL DEPTH'),
    headerLine('RHOB', 'G/C3', '', 'BULK DENSITY'),
    '~PARAMETER INFORMATION',
    headerLine('DREF', '', 'TVD', 'DEPTH REFERENCE'),
    '~A  DEPT      RHOB',
  ];
  for (let i = 0; i < n; i++) {
    const rho = log.density[i];
    lines.push(`${log.depth[i].toFixed(2).padStart(9)} ${(Number.isFinite(rho) ? rho / 1000 : NULL_VALUE).toFixed(4).padStart(9)}`);
  }
  return lines.join('\n') + '\n';
}
