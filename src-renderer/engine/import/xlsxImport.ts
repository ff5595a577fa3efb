/**
 * Import of contractor workbooks (XLSX, read with exceljs): the sheet holding the table
 * (the one named in the options, else the first whose table has a pressure column), the
 * metadata cells above the table (key in one cell, value in the next), numeric cells, text
 * cells with decimal commas, and Excel date/time cells. Errors name sheet and A1 cell.
 */
import { EngineError, isEngineError, type SourceLocation } from '../errors';
import type { TestRecord } from '../record';
import { parseClockTime, parseIsoTimestamp, parseNumberText } from './cellValues';
import type { ColumnPlan, PlannedColumn } from './columnPlan';
import type { ImportOptions } from './importOptions';
import { buildTestRecord, type RawRole } from './recordBuilder';
import { planTableColumns, previewOfTable, readTableHead, type TableHead, type TablePreview } from './tableHead';
import { cellAddress, sheetCellOf, sheetCellText, type SheetCell } from './workbookCells';

/** A sheet as a grid of cells. */
interface SheetGrid {
  name: string;
  cells: SheetCell[][];
  text: string[][];
}

/** The structural part of exceljs the importer uses. */
interface WorkbookLike {
  xlsx: { load(data: ArrayBuffer): Promise<unknown> };
  worksheets: { name: string; rowCount: number; columnCount: number; getRow(r: number): { getCell(c: number): { value: unknown } } }[];
}

async function loadSheets(bytes: Uint8Array, fileName: string): Promise<SheetGrid[]> {
  const module = (await import('exceljs')) as unknown as { default?: { Workbook: new () => WorkbookLike }; Workbook?: new () => WorkbookLike };
  const Workbook = module.Workbook ?? module.default!.Workbook;
  const workbook = new Workbook();
  try {
    await workbook.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  } catch (e) {
    throw new EngineError('bad-workbook', `the workbook cannot be read (${e instanceof Error ? e.message : String(e)})`, { file: fileName }, 'an .xlsx workbook');
  }
  return workbook.worksheets.map((ws) => {
    const cells: SheetCell[][] = [];
    for (let r = 1; r <= ws.rowCount; r++) {
      const row = ws.getRow(r);
      const out: SheetCell[] = [];
      for (let c = 1; c <= ws.columnCount; c++) out.push(sheetCellOf(row.getCell(c).value));
      cells.push(out);
    }
    return { name: ws.name, cells, text: cells.map((row) => row.map(sheetCellText)) };
  });
}

function sheetLocator(fileName: string, sheet: string) {
  return (row: number, column: number): SourceLocation => ({ file: fileName, sheet, cell: cellAddress(row, column), line: row + 1, column: column + 1 });
}

/**
 * The sheet to read and its head and plan: the named one, else the first that plans. When
 * none does, the first sheet with a table and a column problem, else the most specific error
 * (a sheet's own error wins over another sheet having no table).
 */
function chooseSheet(sheets: SheetGrid[], fileName: string, options: ImportOptions): { sheet: SheetGrid; head: TableHead; plan: ColumnPlan | null; error?: EngineError } {
  const candidates = options.sheet ? sheets.filter((s) => s.name === options.sheet) : sheets;
  if (candidates.length === 0) {
    throw new EngineError('bad-workbook', `no sheet named "${options.sheet}"`, { file: fileName }, `one of ${sheets.map((s) => `"${s.name}"`).join(', ')}`);
  }
  let first: { sheet: SheetGrid; head: TableHead; plan: null; error: EngineError } | null = null;
  let firstError: unknown = null;
  for (const sheet of candidates) {
    const locate = sheetLocator(fileName, sheet.name);
    try {
      const head = readTableHead(sheet.text, 'xlsx', locate);
      try {
        return { sheet, head, plan: planTableColumns(head, sheet.text, options, locate) };
      } catch (e) {
        if (!isEngineError(e)) throw e;
        first ??= { sheet, head, plan: null, error: e };
      }
    } catch (e) {
      if (!isEngineError(e)) throw e;
      if (firstError === null || (isEngineError(firstError) && firstError.code === 'empty-table')) firstError = e;
    }
  }
  if (first) return first;
  throw firstError;
}

/** Reads one column of the data rows into numbers in the written unit (times in seconds). */
function readSheetColumn(sheet: SheetGrid, rows: number[], column: PlannedColumn, required: boolean, expected: string, locate: (r: number, c: number) => SourceLocation): Float64Array {
  const out = new Float64Array(rows.length);
  for (let k = 0; k < rows.length; k++) {
    const cell = sheet.cells[rows[k]][column.index] ?? null;
    const v = sheetCellNumber(cell, column.kind);
    if (Number.isNaN(v) && (required || (cell !== null && String(cell).trim() !== ''))) {
      throw new EngineError('non-numeric-cell', cell === null || String(cell).trim() === '' ? 'blank cell' : `"${sheetCellText(cell)}" is not a number`, locate(rows[k], column.index), expected);
    }
    out[k] = v;
  }
  return out;
}

function sheetCellNumber(cell: SheetCell, kind: PlannedColumn['kind']): number {
  if (cell === null) return NaN;
  if (cell instanceof Date) {
    const s = cell.getTime() / 1000;
    return kind === 'clock' ? ((s % 86400) + 86400) % 86400 : s;
  }
  if (typeof cell === 'number') return kind === 'clock' ? cell * 86400 : cell;
  if (kind === 'iso') return parseIsoTimestamp(cell);
  if (kind === 'clock') return parseClockTime(cell);
  const comma = cell.includes(',') && !cell.includes('.');
  return parseNumberText(cell, comma ? ',' : '.');
}

/**
 * Whether the time column holds Excel times of day or durations without a date (exceljs
 * gives them as dates on Excel's day 0, 1899-12-30): they are read as clock times, so that
 * a test running past midnight keeps increasing.
 */
function timeOfDayCells(sheet: SheetGrid, rows: number[], column: PlannedColumn): boolean {
  const first = rows.length ? sheet.cells[rows[0]][column.index] : null;
  return first instanceof Date && first.getUTCFullYear() < 1901;
}

/**
 * Reads an XLSX workbook into the normalised SI record.
 *
 * @param bytes file content
 * @param fileName shown in errors
 * @param options mapping, type, metadata overrides, sheet name, allowMissingRateAndVolume
 * @returns the record
 * @throws EngineError 'bad-workbook' and the table errors of the delimited importer, each
 *   with sheet, cell (A1), line (row) and column numbers
 * @example await parseXlsxTest(bytes, 'hf3.xlsx')
 */
export async function parseXlsxTest(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): Promise<TestRecord> {
  const sheets = await loadSheets(bytes, fileName);
  const { sheet, head, plan, error } = chooseSheet(sheets, fileName, options);
  if (!plan) throw error!;
  const locate = sheetLocator(fileName, sheet.name);
  const rows: number[] = [];
  for (let r = head.layout.dataStart; r < sheet.text.length; r++) if (sheet.text[r].some((t) => t.trim() !== '')) rows.push(r);
  const time = timeOfDayCells(sheet, rows, plan.time) ? { ...plan.time, kind: 'clock' as const } : plan.time;
  const columnOf: Record<RawRole, PlannedColumn | null> = { time, pressure: plan.pressure, rate: plan.rate, volume: plan.volume };
  const read = (role: RawRole) => {
    const c = columnOf[role];
    return c ? readSheetColumn(sheet, rows, c, role === 'time' || role === 'pressure', `${role} in ${c.unit}`, locate) : null;
  };
  return buildTestRecord({
    fileName, format: 'xlsx', time: read('time')!, timeKind: time.kind, timeUnit: time.unit,
    pressure: read('pressure')!, pressureUnit: plan.pressure.unit,
    rate: read('rate'), rateUnit: plan.rate?.unit ?? '', volume: read('volume'), volumeUnit: plan.volume?.unit ?? '',
    columns: plan.columns, layout: head.signature, metadata: head.reading.metadata,
    warnings: [...head.reading.warnings, ...plan.warnings],
    locate: (row, role) => locate(row < 0 ? head.layout.headerRow ?? head.layout.dataStart : rows[row], columnOf[role]!.index),
    firstTimeText: rows.length ? sheet.text[rows[0]][plan.time.index] : undefined,
    sourceExtras: { sheet: sheet.name },
  }, options);
}

/**
 * Preview of a workbook for the import confirmation screen.
 *
 * @param bytes file content
 * @param fileName for errors
 * @param options sheet and mapping to try
 * @returns the preview of the chosen sheet
 * @throws EngineError 'bad-workbook', 'empty-table'
 * @example (await previewXlsx(bytes, 'hf3.xlsx')).sheet
 */
export async function previewXlsx(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): Promise<TablePreview> {
  const sheets = await loadSheets(bytes, fileName);
  const { sheet, head } = chooseSheet(sheets, fileName, options);
  const preview = previewOfTable(head, sheet.text, { fileName, format: 'xlsx' }, options, sheetLocator(fileName, sheet.name));
  return { ...preview, sheet: sheet.name };
}
