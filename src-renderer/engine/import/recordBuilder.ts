/**
 * Assembly of the normalised TestRecord from raw columns as read (units as written): unit
 * conversion to SI, time checks and shift to zero, pressure range check, gap filling,
 * derivation of the missing rate or volume, consistency warning, options applied.
 */
import { EngineError, type SourceLocation } from '../errors';
import type { ColumnMapping, RecordSource, TestMetadata, TestRecord } from '../record';
import { arrayToSI } from '../units/units';
import { unwindMidnight } from './cellValues';
import type { ImportOptions } from './importOptions';
import { firstPressureBelowVacuum } from './physicalRanges';
import { differenceHalfWidth, fillGaps, rateFromVolume, rateVolumeMismatch, volumeFromRate } from './rateVolume';

/** Role of a raw column, for locating errors. */
export type RawRole = 'time' | 'pressure' | 'rate' | 'volume';

/** Columns as read from a file, before conversion. */
export interface RawColumns {
  fileName: string;
  format: RecordSource['format'];
  time: Float64Array;
  /** 'number': elapsed in timeUnit; 'clock': seconds of day; 'iso': seconds since 1970. */
  timeKind: 'number' | 'clock' | 'iso';
  timeUnit: string;
  pressure: Float64Array;
  pressureUnit: string;
  rate: Float64Array | null;
  rateUnit: string;
  volume: Float64Array | null;
  volumeUnit: string;
  columns: ColumnMapping[];
  layout: string;
  metadata: TestMetadata;
  warnings: string[];
  /** Location of a data cell (row >= 0) or of the column's header (row -1). */
  locate(row: number, role: RawRole): SourceLocation;
  /** The first timestamp as written (ISO timestamps), kept as the record's start time. */
  firstTimeText?: string;
  /** Extra source fields (delimiter, decimal mark, sheet). */
  sourceExtras?: Partial<RecordSource>;
}

/**
 * Builds the SI record from raw columns.
 *
 * @param raw columns as read, with their units and a locator for errors
 * @param options caller's options (test type, metadata, gauge, allowMissingRateAndVolume)
 * @returns the record
 * @throws EngineError 'empty-table', 'time-not-increasing', 'out-of-range' (pressure below
 *   -1 bar), 'unknown-unit', 'no-rate-or-volume'
 * @example buildTestRecord(raw, {}).pressure[0]
 */
export function buildTestRecord(raw: RawColumns, options: ImportOptions = {}): TestRecord {
  if (raw.time.length === 0) {
    throw new EngineError('empty-table', 'the table has a header but no data rows', raw.locate(-1, 'time'), 'rows of numbers below the header');
  }
  const warnings = [...raw.warnings];
  const { time, startTime } = timeToSeconds(raw, warnings);
  const pressure = convertColumn(raw, raw.pressure, raw.pressureUnit, 'pressure');
  const low = firstPressureBelowVacuum(pressure);
  if (low >= 0) {
    throw new EngineError('out-of-range', `pressure ${(pressure[low] / 1e5).toPrecision(4)} bar is below vacuum`, raw.locate(low, 'pressure'), 'a gauge pressure above -1 bar');
  }
  const rate = raw.rate ? convertColumn(raw, raw.rate, raw.rateUnit, 'rate') : null;
  const volume = raw.volume ? convertColumn(raw, raw.volume, raw.volumeUnit, 'volume') : null;
  const flows = completeFlows(time, rate, volume, raw, options, warnings);
  const metadata = applyMetadataOptions(raw.metadata, options);
  const source: RecordSource = {
    fileName: raw.fileName, format: raw.format, layout: raw.layout, columns: raw.columns,
    derived: flows.derived, warnings, ...raw.sourceExtras,
  };
  if (startTime) source.startTime = startTime;
  return { time, pressure, rate: flows.rate, volume: flows.volume, metadata, source };
}

function convertColumn(raw: RawColumns, values: Float64Array, unit: string, role: RawRole): Float64Array {
  try {
    return arrayToSI(values, unit, role);
  } catch (e) {
    if (e instanceof EngineError) throw new EngineError(e.code, stripped(e), raw.locate(-1, role), e.expected);
    throw e;
  }
}

function stripped(e: EngineError): string {
  return e.message.replace(/ \(expected [^)]*\)$/, '');
}

/** Time in s from the first sample, strictly increasing; the absolute start when known. */
function timeToSeconds(raw: RawColumns, warnings: string[]): { time: Float64Array; startTime?: string } {
  const time = raw.time;
  if (raw.timeKind === 'number') convertColumn(raw, time, raw.timeUnit, 'time');
  if (raw.timeKind === 'clock') unwindMidnight(time);
  for (let i = 1; i < time.length; i++) {
    if (!(time[i] > time[i - 1])) {
      throw new EngineError('time-not-increasing', `time ${time[i]} s does not increase after ${time[i - 1]} s`, raw.locate(i, 'time'), 'strictly increasing time');
    }
  }
  const t0 = time[0];
  let startTime: string | undefined;
  if (raw.timeKind === 'iso') startTime = raw.firstTimeText?.trim().replace(' ', 'T') || new Date(t0 * 1000).toISOString();
  if (raw.timeKind === 'clock' && raw.metadata.date) startTime = `${raw.metadata.date.slice(0, 10)}T${clockText(t0)}`;
  if (raw.timeKind === 'clock' && time[time.length - 1] >= 86400 && time[0] < 86400) warnings.push('clock time passes midnight; a day was added after it');
  if (t0 !== 0) {
    for (let i = 0; i < time.length; i++) time[i] -= t0;
    if (raw.timeKind === 'number') warnings.push(`time shifted by ${Number(t0.toPrecision(6))} s so that the first sample is at 0 s`);
  }
  return { time, startTime };
}

function clockText(seconds: number): string {
  const s = Math.floor(seconds) % 86400;
  const pad = (v: number) => String(v).padStart(2, '0');
  return `${pad(Math.floor(s / 3600))}:${pad(Math.floor(s / 60) % 60)}:${pad(s % 60)}`;
}

/** Rate and volume both present and gap-free, one derived from the other when missing. */
function completeFlows(time: Float64Array, rate: Float64Array | null, volume: Float64Array | null, raw: RawColumns, options: ImportOptions, warnings: string[]) {
  const q = rate && gapsFilled(time, rate, 'rate', warnings) ? rate : null;
  const v = volume && gapsFilled(time, volume, 'volume', warnings) ? volume : null;
  if (q && v) {
    const mismatch = rateVolumeMismatch(time, q, v);
    if (mismatch > 0.05) warnings.push(`the volume column and the integral of the rate column differ by ${(mismatch * 100).toFixed(1)} %`);
    return { rate: q, volume: v, derived: { rate: false, volume: false } };
  }
  if (q) return { rate: q, volume: volumeFromRate(time, q), derived: { rate: false, volume: true } };
  if (v) return { rate: rateFromVolume(time, v, differenceHalfWidth(time)), volume: v, derived: { rate: true, volume: false } };
  if (!options.allowMissingRateAndVolume) {
    throw new EngineError('no-rate-or-volume', 'the file has neither a rate nor a volume column', { file: raw.fileName }, 'a pump rate or cumulative volume column (or allowMissingRateAndVolume for a pressure-only record)');
  }
  warnings.push('no rate or volume in the file; both are NaN');
  return { rate: new Float64Array(time.length).fill(NaN), volume: new Float64Array(time.length).fill(NaN), derived: { rate: true, volume: true } };
}

function gapsFilled(time: Float64Array, values: Float64Array, what: string, warnings: string[]): boolean {
  const filled = fillGaps(time, values);
  if (filled < 0) {
    warnings.push(`the ${what} column is blank; it is ignored`);
    return false;
  }
  if (filled > 0) warnings.push(`${filled} blank ${what} cell(s) filled by linear interpolation`);
  return true;
}

/** The file's metadata with the caller's values on top. */
function applyMetadataOptions(metadata: TestMetadata, options: ImportOptions): TestMetadata {
  const merged: TestMetadata = { ...metadata };
  for (const [key, value] of Object.entries(options.metadata ?? {})) {
    if (value !== undefined) (merged as Record<string, unknown>)[key] = value;
  }
  if (options.testType) merged.testType = options.testType;
  if (options.gaugePosition) merged.gaugePosition = options.gaugePosition;
  return merged;
}
