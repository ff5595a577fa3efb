/**
 * The head of a contractor table (metadata block, header, units row, first data rows) read
 * into metadata and a column plan. Shared by the delimited-text and workbook importers.
 */
import { EngineError, isEngineError, type SourceLocation } from '../errors';
import type { ColumnMapping, RecordSource } from '../record';
import { timeTextKind } from './cellValues';
import { readHeader } from './columnRoles';
import { planColumns, type ColumnPlan } from './columnPlan';
import type { ImportOptions } from './importOptions';
import { metadataEntryOfRow } from './metadataEntries';
import { readMetadataEntries, type MetadataReading } from './metadataFields';
import { findTableLayout, rowWidth, type TableLayout } from './tableLayout';

/** Head of a table, read. */
export interface TableHead {
  layout: TableLayout;
  headers: string[];
  unitsRow?: string[];
  reading: MetadataReading;
  /** Layout signature: format, header names and units, to remember a mapping per contractor layout. */
  signature: string;
}

/**
 * Finds the table in the head rows and reads its metadata block.
 *
 * @param rows head rows split into cells
 * @param format source format, part of the signature
 * @param locate location of a cell (row and column indices into `rows`)
 * @returns the head
 * @throws EngineError 'empty-table' when there is no data row; metadata errors (see readMetadataEntries)
 * @example readTableHead([['t (s)', 'p (psi)'], ['0', '1']], 'delimited', (r, c) => ({line: r + 1, column: c + 1}))
 */
export function readTableHead(rows: readonly string[][], format: RecordSource['format'], locate: (row: number, column: number) => SourceLocation): TableHead {
  const layout = findTableLayout(rows);
  if (!layout) {
    const blank = rows.every((r) => rowWidth(r) === 0);
    throw new EngineError('empty-table', blank ? 'the file is empty' : 'no table of numbers found', locate(0, 0), 'a header row followed by rows of numbers');
  }
  const entries = layout.metadataRows
    .map((r) => metadataEntryOfRow(rows[r], locate(r, 0)))
    .filter((e) => e !== null);
  const reading = readMetadataEntries(entries);
  const headers = padded(layout.headerRow === null ? [] : rows[layout.headerRow], layout.width)
    .map((h, i) => (h === '' && layout.headerRow === null ? `column ${i + 1}` : h));
  const unitsRow = layout.unitsRow === null ? undefined : padded(rows[layout.unitsRow], layout.width);
  const signature = `${format}|${headers.map((h) => h.trim().toLowerCase()).join('|')}${unitsRow ? `#${unitsRow.join('|')}` : ''}`;
  return { layout, headers, unitsRow, reading, signature };
}

function padded(cells: readonly string[], width: number): string[] {
  const out = cells.slice(0, width).map((c) => c.trim());
  while (out.length < width) out.push('');
  return out;
}

/**
 * Plans the columns of a read head; the metadata's gauge position is completed from the
 * pressure column's name ("BHP" means downhole) unless the metadata or options say.
 *
 * @param head the read head
 * @param rows the head rows (for the first data row's cell kinds)
 * @param options caller's forced mapping and gauge
 * @param locate location of a cell
 * @returns the plan
 * @throws EngineError from planColumns
 * @example planTableColumns(head, rows, {}, locate).pressure.unit // 'psi'
 */
export function planTableColumns(head: TableHead, rows: readonly string[][], options: ImportOptions, locate: (row: number, column: number) => SourceLocation): ColumnPlan {
  const first = rows[head.layout.dataStart];
  const metadata = head.reading.metadata;
  const plan = planColumns({
    headers: head.headers,
    unitsRow: head.unitsRow,
    firstCellKinds: head.headers.map((_, i) => timeTextKind(first[i] ?? '')),
    hints: head.reading.unitHints,
    overrides: options.columns,
    gaugeFromMetadata: options.gaugePosition ?? metadata.gaugePosition,
    headerLocation: (i) => locate(head.layout.headerRow ?? head.layout.dataStart, i),
    hasHeader: head.layout.headerRow !== null,
  });
  if (!metadata.gaugePosition && plan.gaugeFromColumn === 'downhole') metadata.gaugePosition = 'downhole';
  return plan;
}

/** What the import confirmation screen shows before anything is converted. */
export interface TablePreview {
  fileName: string;
  format: RecordSource['format'];
  /** Header cells as written (generated "column n" when the table has none). */
  header: string[];
  unitsRow?: string[];
  /** Detected (or planned) role and unit of every column. */
  columns: ColumnMapping[];
  metadata: MetadataReading['metadata'];
  /** First data rows as text (up to 20). */
  rows: string[][];
  layout: string;
  warnings: string[];
  delimiter?: string;
  decimalMark?: '.' | ',';
  sheet?: string;
  /** Why the file would not import as it stands (e.g. no pressure column), for the mapping screen. */
  problem?: Record<string, unknown>;
}

/**
 * A preview of a table from its head: columns with roles and units (the plan's when it
 * succeeds, the header readings otherwise, with the problem), metadata and first rows.
 *
 * @param head the read head
 * @param rows head rows
 * @param base file name and format
 * @param options caller's mapping
 * @param locate location of a cell
 * @returns the preview
 * @example previewOfTable(head, rows, {fileName: 'a.csv', format: 'delimited'}, {}, locate).columns
 */
export function previewOfTable(head: TableHead, rows: readonly string[][], base: Pick<TablePreview, 'fileName' | 'format'>, options: ImportOptions, locate: (row: number, column: number) => SourceLocation): TablePreview {
  const dataRows = rows.slice(head.layout.dataStart).filter((r) => rowWidth(r) > 0).slice(0, 20).map((r) => padded(r, head.layout.width));
  const preview: TablePreview = {
    ...base, header: head.headers, unitsRow: head.unitsRow, columns: [], metadata: head.reading.metadata,
    rows: dataRows, layout: head.signature, warnings: [...head.reading.warnings],
  };
  try {
    const plan = planTableColumns(head, rows, options, locate);
    preview.columns = plan.columns;
    preview.warnings.push(...plan.warnings);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    preview.problem = e.toJSON();
    preview.columns = head.headers.map((h, i) => {
      const r = readHeader(h, head.unitsRow?.[i]);
      return { index: i, header: h, role: r.role, unit: r.unit, unitStated: r.unitStated };
    });
  }
  return preview;
}
