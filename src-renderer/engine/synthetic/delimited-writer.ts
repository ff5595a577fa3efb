/**
 * Contractor-style delimited text from a record: the layouts the demo files and the
 * import tests use. Each writes a metadata block above the table, then the samples in
 * the layout's units (converted from SI with the engine's unit table, NIST SP 811 factors).
 *
 * Layouts:
 * - 'comma-psi-bbl': comma-separated, point decimals, metadata rows "Key (unit),value",
 *   one header row with units in brackets; elapsed s, psi, bbl/min, bbl.
 * - 'semicolon-kpa-m3': semicolon-separated, decimal comma, metadata rows "key;value;unit",
 *   a header row of names and a second row of units; elapsed min, kPa, m3/min, m3.
 * - 'tab-bar-litre': tab-separated, metadata rows "key<TAB>value<TAB>unit", ISO 8601
 *   timestamps, bar, L/min, L.
 *
 * Files written from these records carry invented data; any export says results are for
 * review by a qualified engineer and defer to the operator's well-control policy and local
 * regulations.
 */
import { EngineError } from '../errors';
import type { TestMetadata, TestRecord } from '../record';
import { fromSI } from '../units/units';

export type DelimitedLayout = 'comma-psi-bbl' | 'semicolon-kpa-m3' | 'tab-bar-litre';
export const DELIMITED_LAYOUTS: readonly DelimitedLayout[] = ['comma-psi-bbl', 'semicolon-kpa-m3', 'tab-bar-litre'];

export interface DelimitedOptions {
  /** Absolute start time, ISO 8601 (required by 'tab-bar-litre'; default 2026-01-01T00:00:00Z). */
  startTime?: string;
  /** A title line written first. */
  title?: string;
}

interface LayoutUnits {
  delimiter: string;
  decimalComma: boolean;
  pressure: string; rate: string; volume: string; time: string;
  length: string; density: string; compressibility: string;
}

const LAYOUTS: Readonly<Record<DelimitedLayout, LayoutUnits>> = {
  'comma-psi-bbl': { delimiter: ',', decimalComma: false, pressure: 'psi', rate: 'bbl/min', volume: 'bbl', time: 's', length: 'ft', density: 'ppg', compressibility: '1/psi' },
  'semicolon-kpa-m3': { delimiter: ';', decimalComma: true, pressure: 'kPa', rate: 'm3/min', volume: 'm3', time: 'min', length: 'm', density: 'sg', compressibility: '1/kPa' },
  'tab-bar-litre': { delimiter: '\t', decimalComma: false, pressure: 'bar', rate: 'L/min', volume: 'L', time: 'iso-8601', length: 'm', density: 'kg/m3', compressibility: '1/bar' },
};

function formatter(decimalComma: boolean): (value: number, digits: number) => string {
  return (value, digits) => {
    const text = Math.abs(value) > 0 && Math.abs(value) < 1e-3 && digits > 6 ? value.toExponential(4) : value.toFixed(digits);
    return decimalComma ? text.replace('.', ',') : text;
  };
}

type MetaRow = { key: string; value: string; unit?: string };

function metadataRows(meta: TestMetadata, u: LayoutUnits, fmt: (v: number, d: number) => string): MetaRow[] {
  const rows: MetaRow[] = [];
  const text = (key: string, value: string | undefined) => { if (value !== undefined) rows.push({ key, value }); };
  const number = (key: string, value: number | undefined, unit: string, dimension: Parameters<typeof fromSI>[2], digits: number) => {
    if (value !== undefined) rows.push({ key, value: fmt(fromSI(value, unit, dimension), digits), unit });
  };
  text('Well', meta.well);
  text('Field', meta.field);
  text('Contractor', meta.contractor);
  text('Test type', meta.testType?.toUpperCase());
  text('Date', meta.date);
  number('TVD', meta.depthTvd, u.length, 'length', 1);
  number('MD', meta.depthMd, u.length, 'length', 1);
  number('Casing shoe TVD', meta.casingShoeTvd, u.length, 'length', 1);
  number('Mud density', meta.mudDensity, u.density, 'density', u.density === 'kg/m3' ? 0 : 3);
  text('Mud type', meta.mudType);
  text('Gauge position', meta.gaugePosition);
  number('Gauge range', meta.gaugeRange, u.pressure, 'pressure', 1);
  number('Gauge resolution', meta.gaugeResolution, u.pressure, 'pressure', 3);
  number('Hole diameter', meta.holeDiameter, u.length === 'ft' ? 'in' : 'mm', 'length', u.length === 'ft' ? 3 : 1);
  number('Open hole length', meta.openHoleLength, u.length, 'length', 1);
  number('System volume', meta.systemVolume, u.volume, 'volume', 2);
  if (meta.compressibility !== undefined) {
    const v = fromSI(meta.compressibility, u.compressibility, 'compressibility');
    const t = v.toExponential(4);
    rows.push({ key: 'Compressibility', value: u.decimalComma ? t.replace('.', ',') : t, unit: u.compressibility });
  }
  for (const [k, v] of Object.entries(meta.extra ?? {})) rows.push({ key: k, value: v });
  return rows;
}

/**
 * Write a record as contractor-style delimited text in one of the layouts.
 *
 * @param record SI record (gauge pressure Pa, rate m3/s, volume m3, time s).
 * @param layout one of DELIMITED_LAYOUTS.
 * @param options startTime ISO 8601 (tab layout) and an optional title line.
 * @returns the file text, lines ending in CRLF for the semicolon layout, LF otherwise.
 * @throws EngineError 'bad-argument' for an unknown layout or a bad start time.
 * @example recordToDelimited(record, 'comma-psi-bbl').split('\n')[0] // 'Well,HF-1'
 */
export function recordToDelimited(record: TestRecord, layout: DelimitedLayout, options: DelimitedOptions = {}): string {
  const u = LAYOUTS[layout];
  if (!u) throw new EngineError('bad-argument', `unknown layout "${String(layout)}"`, {}, DELIMITED_LAYOUTS.join(', '));
  const fmt = formatter(u.decimalComma);
  const d = u.delimiter;
  const lines: string[] = [];
  if (options.title) lines.push(options.title);
  for (const row of metadataRows(record.metadata, u, fmt)) {
    if (layout === 'comma-psi-bbl') lines.push(`${row.key}${row.unit ? ` (${row.unit})` : ''}${d}${row.value}`);
    else lines.push([row.key, row.value, ...(row.unit ? [row.unit] : [])].join(d));
  }
  lines.push('');
  const n = record.time.length;
  if (layout === 'comma-psi-bbl') {
    lines.push(['Elapsed Time (s)', 'Pressure (psi)', 'Rate (bbl/min)', 'Volume (bbl)'].join(d));
    for (let i = 0; i < n; i++) {
      lines.push([
        fmt(record.time[i], 1),
        fmt(fromSI(record.pressure[i], 'psi', 'pressure'), 2),
        fmt(fromSI(record.rate[i], 'bbl/min', 'rate'), 3),
        fmt(fromSI(record.volume[i], 'bbl', 'volume'), 3),
      ].join(d));
    }
  } else if (layout === 'semicolon-kpa-m3') {
    lines.push(['Time', 'Pressure', 'Rate', 'Volume'].join(d));
    lines.push(['min', 'kPa', 'm3/min', 'm3'].join(d));
    for (let i = 0; i < n; i++) {
      lines.push([
        fmt(record.time[i] / 60, 5),
        fmt(fromSI(record.pressure[i], 'kPa', 'pressure'), 1),
        fmt(fromSI(record.rate[i], 'm3/min', 'rate'), 4),
        fmt(record.volume[i], 4),
      ].join(d));
    }
  } else {
    const startText = options.startTime ?? '2026-01-01T00:00:00Z';
    const start = Date.parse(startText);
    if (!Number.isFinite(start)) throw new EngineError('bad-argument', `start time "${startText}" is not ISO 8601`, {}, 'an ISO 8601 date-time');
    lines.push(['Timestamp', 'Pressure [bar]', 'Flow [L/min]', 'Volume [L]'].join(d));
    for (let i = 0; i < n; i++) {
      lines.push([
        new Date(start + Math.round(record.time[i] * 1000)).toISOString(),
        fmt(fromSI(record.pressure[i], 'bar', 'pressure'), 3),
        fmt(fromSI(record.rate[i], 'L/min', 'rate'), 1),
        fmt(fromSI(record.volume[i], 'L', 'volume'), 1),
      ].join(d));
    }
  }
  const eol = layout === 'semicolon-kpa-m3' ? '\r\n' : '\n';
  return lines.join(eol) + eol;
}
