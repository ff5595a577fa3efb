/**
 * The stress table in display units, ready to write: for each of Pp, Shmin (with its
 * band), SHmax bounds and Sv a pressure, a gradient (P / TVD) and an equivalent mud weight
 * (EMW = P / (g_n TVD); in oilfield units EMW [ppg] = P [psi] / (0.051948 TVD [ft]), the
 * exact factor being 4/77, METHODS.md). SI: MPa, kPa/m, sg, m; oilfield: psi, psi/ft, ppg, ft.
 */
import type { StressTableRow } from '../model/regional-model';
import { emwFromPressure } from '../units/mudWeight';
import { fromSI } from '../units/units';
import type { UnitSystem } from '../units/unitSystem';

/** One column of the exported table. */
export interface TableColumn {
  /** Stable id, e.g. "shmin.pressure". */
  id: string;
  /** Header text including the unit, e.g. "Shmin [MPa]". */
  header: string;
  /** Unit written in the header ('' for none). */
  unit: string;
  kind: 'depth' | 'pressure' | 'gradient' | 'emw' | 'ratio' | 'text';
  /** Decimals the values are rounded to (numbers only). */
  decimals: number;
}

/** The table as written: columns and rows of numbers, text or empty cells. */
export interface ExportTable {
  system: UnitSystem;
  columns: TableColumn[];
  rows: (number | string | null)[][];
}

/** Quantities of a row that get pressure, gradient and EMW columns, with their header names. */
export const TABLE_QUANTITIES: readonly { key: keyof StressTableRow; label: string }[] = [
  { key: 'pp', label: 'Pp' },
  { key: 'shmin', label: 'Shmin' },
  { key: 'shminLow', label: 'Shmin low' },
  { key: 'shminHigh', label: 'Shmin high' },
  { key: 'shmaxLow', label: 'SHmax low' },
  { key: 'shmaxHigh', label: 'SHmax high' },
  { key: 'sv', label: 'Sv' },
];

const UNITS: Record<UnitSystem, { depth: string; pressure: string; gradient: string; emw: string; decimals: Record<string, number> }> = {
  si: { depth: 'm', pressure: 'MPa', gradient: 'kPa/m', emw: 'sg', decimals: { depth: 1, pressure: 3, gradient: 3, emw: 3 } },
  oilfield: { depth: 'ft', pressure: 'psi', gradient: 'psi/ft', emw: 'ppg', decimals: { depth: 1, pressure: 1, gradient: 4, emw: 2 } },
};

/**
 * Display units of the table for a unit system.
 *
 * @param system 'si' or 'oilfield'.
 * @returns depth, pressure, gradient and EMW unit names.
 * @example tableUnits('oilfield').emw // 'ppg'
 */
export function tableUnits(system: UnitSystem): { depth: string; pressure: string; gradient: string; emw: string } {
  const u = UNITS[system];
  return { depth: u.depth, pressure: u.pressure, gradient: u.gradient, emw: u.emw };
}

/** Rounds to a number of decimals, keeping -0 out. */
export function roundTo(value: number, decimals: number): number {
  const f = 10 ** decimals;
  const r = Math.round(value * f) / f;
  return r === 0 ? 0 : r;
}

/**
 * Columns of the exported table: TVD, MD (when any row has one), then pressure, gradient
 * and EMW of each of {@link TABLE_QUANTITIES}, then the effective stress ratio, regime,
 * trend line and whether the row is extrapolated.
 *
 * @param system unit system. @param withMd include the MD column.
 * @returns the columns in order.
 * @example tableColumns('si', false)[1].header // 'Pp [MPa]'
 */
export function tableColumns(system: UnitSystem, withMd: boolean): TableColumn[] {
  const u = UNITS[system];
  const cols: TableColumn[] = [{ id: 'tvd', header: `TVD [${u.depth}]`, unit: u.depth, kind: 'depth', decimals: u.decimals.depth }];
  if (withMd) cols.push({ id: 'md', header: `MD [${u.depth}]`, unit: u.depth, kind: 'depth', decimals: u.decimals.depth });
  for (const kind of ['pressure', 'gradient', 'emw'] as const) {
    for (const q of TABLE_QUANTITIES) {
      const unit = u[kind];
      const label = kind === 'pressure' ? q.label : kind === 'gradient' ? `${q.label} gradient` : `${q.label} EMW`;
      cols.push({ id: `${q.key}.${kind}`, header: `${label} [${unit}]`, unit, kind, decimals: u.decimals[kind] });
    }
  }
  cols.push({ id: 'effectiveStressRatio', header: 'Effective stress ratio (Shmin-Pp)/(Sv-Pp)', unit: '', kind: 'ratio', decimals: 3 });
  cols.push({ id: 'regime', header: 'Faulting regime', unit: '', kind: 'text', decimals: 0 });
  cols.push({ id: 'segment', header: 'Trend line', unit: '', kind: 'text', decimals: 0 });
  cols.push({ id: 'extrapolated', header: 'Beyond tested depths', unit: '', kind: 'text', decimals: 0 });
  return cols;
}

function cell(row: StressTableRow, col: TableColumn, system: UnitSystem): number | string | null {
  const u = UNITS[system];
  if (col.id === 'tvd') return roundTo(fromSI(row.tvd, u.depth, 'length'), col.decimals);
  if (col.id === 'md') return row.md === null ? null : roundTo(fromSI(row.md, u.depth, 'length'), col.decimals);
  if (col.id === 'effectiveStressRatio') return row.effectiveStressRatio === null ? null : roundTo(row.effectiveStressRatio, 3);
  if (col.id === 'regime') return row.regime;
  if (col.id === 'segment') return row.segment;
  if (col.id === 'extrapolated') return row.shmin === null ? null : row.extrapolated ? 'yes' : 'no';
  const [key, kind] = col.id.split('.') as [keyof StressTableRow, TableColumn['kind']];
  const p = row[key] as number | null;
  if (p === null || p === undefined) return null;
  if (kind === 'pressure') return roundTo(fromSI(p, u.pressure, 'pressure'), col.decimals);
  if (!(row.tvd > 0)) return null;
  if (kind === 'gradient') return roundTo(fromSI(p / row.tvd, u.gradient, 'gradient'), col.decimals);
  return roundTo(fromSI(emwFromPressure(p, row.tvd), u.emw, 'density'), col.decimals);
}

/**
 * Converts stress-table rows (SI) to the exported table in a unit system, numbers rounded
 * to each column's decimals; gradient and EMW are empty at TVD 0, where they are undefined.
 *
 * @param rows from stressTable (SI). @param system 'si' or 'oilfield'.
 * @returns columns and cell rows.
 * @throws nothing for rows from stressTable.
 * @example exportTable(stressTable(model, { from: 500, to: 3000, step: 100 }), 'oilfield')
 */
export function exportTable(rows: StressTableRow[], system: UnitSystem): ExportTable {
  const columns = tableColumns(system, rows.some((r) => r.md !== null));
  return { system, columns, rows: rows.map((r) => columns.map((c) => cell(r, c, system))) };
}
