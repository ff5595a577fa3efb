/**
 * The choice of the time, pressure, rate and volume columns from the header readings, the
 * metadata's unit hints and a caller's forced mapping.
 */
import { EngineError, type SourceLocation } from '../errors';
import type { ColumnMapping, GaugePosition } from '../record';
import { readHeader, type HeaderReading } from './columnRoles';
import type { ColumnOverride } from './importOptions';
import type { UnitHints } from './metadataFields';

/** One chosen column. */
export interface PlannedColumn {
  index: number;
  unit: string;
  /** For time: how its cells read. */
  kind: 'number' | 'clock' | 'iso';
}

/** The columns an importer reads. */
export interface ColumnPlan {
  time: PlannedColumn;
  pressure: PlannedColumn;
  rate: PlannedColumn | null;
  volume: PlannedColumn | null;
  columns: ColumnMapping[];
  /** Gauge position the pressure column's name implies, if any. */
  gaugeFromColumn?: GaugePosition;
  warnings: string[];
}

/** What the planner needs to know about the table. */
export interface PlanInput {
  headers: readonly string[];
  unitsRow?: readonly string[];
  /** Kind of each column's first data cell ('iso', 'clock', 'number' or null). */
  firstCellKinds: readonly ('iso' | 'clock' | 'number' | null)[];
  hints: UnitHints;
  overrides?: readonly ColumnOverride[];
  gaugeFromMetadata?: GaugePosition;
  /** Location of a column's header cell, for errors. */
  headerLocation: (index: number) => SourceLocation;
  /** Whether the table had a header row at all. */
  hasHeader: boolean;
}

/**
 * Reads every header, applies overrides and picks the columns.
 *
 * @param input headers, units row, first-cell kinds, hints and overrides
 * @returns the plan
 * @throws EngineError 'no-time-column', 'no-pressure-column', 'unknown-unit' (a pressure,
 *   rate or volume column without a unit)
 * @example planColumns({headers: ['Time (s)', 'Pressure (psi)'], ...})
 */
export function planColumns(input: PlanInput): ColumnPlan {
  const readings = input.headers.map((h, i) => readHeader(h, input.unitsRow?.[i]));
  applyOverrides(readings, input.overrides ?? [], input.headers);
  const warnings: string[] = [];
  const timeIndex = chooseTime(readings, input);
  const pressureIndex = choosePressure(readings, input.gaugeFromMetadata);
  if (pressureIndex < 0) throw noColumn('no-pressure-column', 'no pressure column', input, 'a column named Pressure, P, SPP, BHP, Annulus pressure ... or a column mapping');
  const rateIndex = readings.findIndex((r) => r.role === 'rate');
  const volumeIndex = readings.findIndex((r) => r.role === 'volume');
  const chosen = new Set([timeIndex, pressureIndex, rateIndex, volumeIndex]);
  const columns = readings.map((r, i) => mappingOf(r, i, input.headers[i], chosen.has(i)));
  const time = plannedTime(readings[timeIndex], timeIndex, input, warnings);
  const plan: ColumnPlan = {
    time,
    pressure: plannedQuantity(readings[pressureIndex], pressureIndex, input.hints.pressure, 'pressure', input),
    rate: rateIndex < 0 ? null : plannedQuantity(readings[rateIndex], rateIndex, input.hints.rate, 'rate', input),
    volume: volumeIndex < 0 ? null : plannedQuantity(readings[volumeIndex], volumeIndex, input.hints.volume, 'volume', input),
    columns,
    warnings,
  };
  syncMappingUnits(plan);
  const kind = readings[pressureIndex].pressureKind;
  if (kind === 'downhole' || kind === 'surface') plan.gaugeFromColumn = kind;
  if (readings.filter((r) => r.role === 'pressure').length > 1) {
    warnings.push(`several pressure columns; "${input.headers[pressureIndex]}" is used`);
  }
  return plan;
}

function applyOverrides(readings: HeaderReading[], overrides: readonly ColumnOverride[], headers: readonly string[]): void {
  for (const o of overrides) {
    if (o.index < 0 || o.index >= readings.length) {
      throw new EngineError('bad-argument', `column mapping names column ${o.index + 1}, the table has ${readings.length}`, {}, `a column index 0-${readings.length - 1}`);
    }
    if (['time', 'pressure', 'rate', 'volume', 'timestamp'].includes(o.role)) {
      for (const r of readings) if (r.role === o.role) r.role = 'other';
    }
    const previous = readings[o.index];
    readings[o.index] = { ...previous, role: o.role, unit: o.unit ?? previous.unit, unitStated: true, name: headers[o.index] ?? '' };
  }
}

function noColumn(code: 'no-time-column' | 'no-pressure-column', message: string, input: PlanInput, expected: string): EngineError {
  const where = input.headerLocation(0);
  const header = input.hasHeader ? `${message} among "${input.headers.join('", "')}"` : `${message}: the table has no header row`;
  return new EngineError(code, header, { ...where, column: undefined, cell: undefined }, expected);
}

function chooseTime(readings: readonly HeaderReading[], input: PlanInput): number {
  const time = readings.findIndex((r) => r.role === 'time');
  if (time >= 0) return time;
  const timestamps = readings.map((r, i) => (r.role === 'timestamp' ? i : -1)).filter((i) => i >= 0);
  const usable = timestamps.find((i) => input.firstCellKinds[i] === 'iso' || input.firstCellKinds[i] === 'clock');
  if (usable !== undefined) return usable;
  throw noColumn('no-time-column', 'no time column', input, 'a column named Time, Elapsed time, Date/time, Timestamp ... or a column mapping');
}

function choosePressure(readings: readonly HeaderReading[], gauge?: GaugePosition): number {
  const order = gauge === 'surface' ? ['surface', 'unspecified', 'annulus', 'downhole']
    : gauge === 'downhole' ? ['downhole', 'unspecified', 'surface', 'annulus']
      : ['downhole', 'surface', 'unspecified', 'annulus'];
  for (const kind of order) {
    const i = readings.findIndex((r) => r.role === 'pressure' && (r.pressureKind ?? 'unspecified') === kind);
    if (i >= 0) return i;
  }
  return -1;
}

function plannedTime(r: HeaderReading, index: number, input: PlanInput, warnings: string[]): PlannedColumn {
  const cell = input.firstCellKinds[index];
  if (r.unit === 'iso-8601' || (cell === 'iso' && r.unit === '')) return { index, unit: 'iso-8601', kind: 'iso' };
  if (r.unit === 'hh:mm:ss' || (cell === 'clock' && r.unit === '')) return { index, unit: 'hh:mm:ss', kind: 'clock' };
  if (cell === 'iso' || cell === 'clock') return { index, unit: cell === 'iso' ? 'iso-8601' : 'hh:mm:ss', kind: cell };
  if (r.unit !== '') return { index, unit: r.unit, kind: 'number' };
  if (input.hints.time) return { index, unit: input.hints.time, kind: 'number' };
  warnings.push(`time column "${input.headers[index]}" has no unit; seconds assumed`);
  return { index, unit: 's', kind: 'number' };
}

function plannedQuantity(r: HeaderReading, index: number, hint: string | undefined, what: string, input: PlanInput): PlannedColumn {
  const unit = r.unit !== '' ? r.unit : hint;
  if (!unit) {
    throw new EngineError('unknown-unit', `${what} column "${input.headers[index]}" has no unit`, input.headerLocation(index),
      `a unit in the header, e.g. "${what === 'pressure' ? 'Pressure (psi)' : what === 'rate' ? 'Rate (bbl/min)' : 'Volume (m3)'}", a units row, or a column mapping`);
  }
  return { index, unit, kind: 'number' };
}

function mappingOf(r: HeaderReading, index: number, header: string, chosen: boolean): ColumnMapping {
  const role = chosen || r.role === 'depth' || r.role === 'timestamp' ? r.role : 'other';
  return { index, header, role, unit: r.unit, unitStated: r.unitStated };
}

/** Mappings carry the units actually used (hints or assumed seconds). */
function syncMappingUnits(plan: ColumnPlan): void {
  for (const [role, c] of [['time', plan.time], ['pressure', plan.pressure], ['rate', plan.rate], ['volume', plan.volume]] as const) {
    if (!c) continue;
    const m = plan.columns[c.index];
    if (m.unit !== c.unit) {
      m.unit = c.unit;
      m.unitStated = c.kind !== 'number' ? m.unitStated : false;
    }
    m.role = role === 'time' && c.kind !== 'number' ? 'timestamp' : role;
  }
}
