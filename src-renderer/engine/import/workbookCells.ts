/**
 * Cells of a workbook sheet (read with exceljs) reduced to the values the importer needs:
 * numbers, text, dates (Excel serial dates as exceljs returns them) or blank; formulas give
 * their cached result, rich text its plain text.
 */

/** One cell's value. */
export type SheetCell = number | string | Date | null;

/** The exceljs cell value shapes the importer meets (structural, to avoid depending on its types). */
type ExcelValue = null | undefined | number | string | boolean | Date
  | { result?: unknown; formula?: string; sharedFormula?: string }
  | { richText: { text: string }[] }
  | { text: string; hyperlink?: string }
  | { error: string };

/**
 * Reduces an exceljs cell value to a SheetCell.
 *
 * @param value exceljs `cell.value`
 * @returns number, string, Date or null
 * @example sheetCellOf({ formula: 'A1*2', result: 4 }) // 4
 */
export function sheetCellOf(value: unknown): SheetCell {
  const v = value as ExcelValue;
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string' || v instanceof Date) return v;
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if ('richText' in v) return v.richText.map((t) => t.text).join('');
  if ('error' in v) return v.error;
  if ('result' in v || 'formula' in v || 'sharedFormula' in v) return sheetCellOf((v as { result?: unknown }).result);
  if ('text' in v) return v.text;
  return null;
}

/**
 * Text of a cell for layout detection: numbers as written by JavaScript, dates as ISO 8601
 * without zone.
 *
 * @param cell the cell
 * @returns its text ('' for blank)
 * @example sheetCellText(new Date(Date.UTC(2026, 10, 3, 14, 0))) // '2026-11-03T14:00:00.000'
 */
export function sheetCellText(cell: SheetCell): string {
  if (cell === null) return '';
  if (cell instanceof Date) return Number.isNaN(cell.getTime()) ? '' : cell.toISOString().replace('Z', '');
  return String(cell);
}

/**
 * A1-style address of a cell.
 *
 * @param row 0-based row index
 * @param column 0-based column index
 * @returns e.g. 'B7'
 * @example cellAddress(6, 1) // 'B7'
 */
export function cellAddress(row: number, column: number): string {
  let letters = '';
  let c = column + 1;
  while (c > 0) {
    const r = (c - 1) % 26;
    letters = String.fromCharCode(65 + r) + letters;
    c = Math.floor((c - 1) / 26);
  }
  return `${letters}${row + 1}`;
}
