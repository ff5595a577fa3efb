import type { ImportOutcome, SavedMapping } from '../../archive/api';
import type { ColumnMapping, TestMetadata, TestType } from '../../engine/record';
import type { UnitSystem } from '../../engine/units/unitSystem';
import { displayDigits, fromDisplay, toDisplay, type DisplayQuantity } from '../format/units';

/** The metadata fields the confirmation lets the engineer correct, with their display quantity. */
export const EDITABLE_METADATA: { key: keyof TestMetadata; label: string; quantity?: DisplayQuantity }[] = [
  { key: 'field', label: 'Field' },
  { key: 'well', label: 'Well' },
  { key: 'contractor', label: 'Contractor' },
  { key: 'date', label: 'Test date' },
  { key: 'depthTvd', label: 'Test depth TVD', quantity: 'depth' },
  { key: 'depthMd', label: 'Test depth MD', quantity: 'depth' },
  { key: 'mudDensity', label: 'Mud density', quantity: 'density' },
  { key: 'casingShoeTvd', label: 'Casing shoe TVD', quantity: 'depth' },
  { key: 'holeDiameter', label: 'Hole diameter', quantity: 'diameter' },
];

/** Text values the engineer typed over the file's metadata (display units); '' means "as the file says". */
export type MetadataEdits = Partial<Record<keyof TestMetadata, string>>;

/** The value shown in a metadata box: the file's value in display units. */
export function metadataText(metadata: TestMetadata, key: keyof TestMetadata, quantity: DisplayQuantity | undefined, units: UnitSystem): string {
  const v = metadata[key];
  if (v === undefined || v === null) return '';
  if (quantity && typeof v === 'number') {
    // Shown to one decimal more than the screens use (small values to 4 significant digits);
    // an untouched field keeps the file's exact value, so this rounding is display only.
    const d = toDisplay(units, quantity, v);
    return String(Math.abs(d) < 1 ? Number(d.toPrecision(4)) : Number(d.toFixed(displayDigits(units, quantity) + 1)));
  }
  return String(v);
}

/**
 * Turns the typed edits into SI metadata overrides for the archive. Numbers accept a
 * decimal point or comma. Returns the problems in plain words for fields that are not numbers.
 */
export function metadataOverrides(edits: MetadataEdits, units: UnitSystem, testType: TestType | ''):
  { overrides: Partial<TestMetadata>; problems: string[] } {
  const overrides: Partial<TestMetadata> = {};
  const problems: string[] = [];
  for (const f of EDITABLE_METADATA) {
    const text = edits[f.key];
    if (text === undefined || text.trim() === '') continue;
    if (f.quantity) {
      const n = Number(text.trim().replace(',', '.'));
      if (!Number.isFinite(n) || n <= 0) { problems.push(`${f.label}: "${text}" is not a positive number.`); continue; }
      (overrides as Record<string, unknown>)[f.key] = fromDisplay(units, f.quantity, n);
    } else {
      (overrides as Record<string, unknown>)[f.key] = text.trim();
    }
  }
  if (testType) overrides.testType = testType;
  return { overrides, problems };
}

/** Column overrides for the engine's importer from the confirmed mapping (engine/import/importOptions.ts). */
export function columnOverrides(columns: readonly ColumnMapping[]): { index: number; role: ColumnMapping['role']; unit?: string }[] {
  return columns.map((c) => ({ index: c.index, role: c.role, unit: c.unit || undefined }));
}

/** Whether the engineer changed the detected mapping (role or unit of any column). */
export function mappingChanged(detected: readonly ColumnMapping[], confirmed: readonly ColumnMapping[]): boolean {
  if (detected.length !== confirmed.length) return true;
  return detected.some((d, i) => d.role !== confirmed[i].role || d.unit.trim() !== confirmed[i].unit.trim());
}

/** A saved mapping applies to a file when its layout signature matches and each column index exists. */
export function applySavedMapping(detected: readonly ColumnMapping[], saved: SavedMapping | null): ColumnMapping[] {
  if (!saved) return detected.map((c) => ({ ...c }));
  return detected.map((c) => {
    const s = saved.columns.find((x) => x.index === c.index);
    return s ? { ...c, role: s.role, unit: s.unit, unitStated: c.unitStated } : { ...c };
  });
}

export interface BatchSummary {
  entered: number;
  duplicates: number;
  failed: number;
  failures: { fileName: string; where: string; message: string; code: string }[];
}

/** Counts a batch's outcomes and lists each failure with where it happened (file, line, column). */
export function summariseOutcomes(outcomes: readonly ImportOutcome[]): BatchSummary {
  const s: BatchSummary = { entered: 0, duplicates: 0, failed: 0, failures: [] };
  for (const o of outcomes) {
    if (o.status === 'imported') s.entered++;
    else if (o.status === 'duplicate') s.duplicates++;
    else {
      s.failed++;
      const parts = [o.fileName];
      if (o.error?.line !== undefined) parts.push(`line ${o.error.line}`);
      if (o.error?.column !== undefined) parts.push(`column ${o.error.column}`);
      s.failures.push({ fileName: o.fileName, where: parts.join(', '), message: withoutPlace(o.error?.message ?? 'unknown failure', o.fileName), code: o.error?.code ?? 'unknown' });
    }
  }
  return s;
}

/** The message without a leading "file, line n, column m: " (the summary shows the place in its own column). */
export function withoutPlace(message: string, fileName: string): string {
  if (!message.startsWith(fileName)) return message;
  const i = message.indexOf(': ');
  return i >= 0 ? message.slice(i + 2) : message;
}
