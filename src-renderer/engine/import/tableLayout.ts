/**
 * Layout of a contractor table from its first rows: the delimiter and decimal mark, the
 * metadata block above the table, the header row, an optional units row, and the first data
 * row. Works on cell texts, so it serves delimited text and workbook sheets alike.
 */
import { isNumericText, timeTextKind } from './cellValues';
import { isUnitsRow } from './columnRoles';

/** Where the parts of a table are, as row indices into the rows examined. */
export interface TableLayout {
  /** Rows above the header: the metadata block. */
  metadataRows: number[];
  headerRow: number | null;
  unitsRow: number | null;
  dataStart: number;
  /** Number of columns of the table (header or first data row). */
  width: number;
}

/**
 * Splits one line into fields by a delimiter, honouring double quotes.
 *
 * @param line the line
 * @param delimiter ',', ';', '\t', or ' ' for runs of spaces and tabs
 * @returns the fields, trimmed
 * @example splitLine('a;"b;c";d', ';') // ['a', 'b;c', 'd']
 */
export function splitLine(line: string, delimiter: string): string[] {
  if (delimiter === ' ') return line.trim() === '' ? [''] : line.trim().split(/\s+/);
  const out: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (c === '"') {
      if (quoted && line[i + 1] === '"') {
        field += '"';
        i++;
      } else quoted = !quoted;
    } else if (c === delimiter && !quoted) {
      out.push(field.trim());
      field = '';
    } else field += c;
  }
  out.push(field.trim());
  return out;
}

/** Number of delimiter characters outside quotes. */
function countOutsideQuotes(line: string, delimiter: string): number {
  let count = 0;
  let quoted = false;
  for (const c of line) {
    if (c === '"') quoted = !quoted;
    else if (c === delimiter && !quoted) count++;
  }
  return count;
}

/**
 * Detects the delimiter from the table body at the end of the head: for tab, semicolon and
 * comma, the number of trailing non-blank lines holding the same count (at least one) as
 * the last line; the longest run wins, ties going to tab, then semicolon (a comma may be a
 * decimal mark), then comma. When none of them appears, runs of spaces (' ') if the last
 * lines hold the same number (two or more) of space-separated values.
 *
 * @param lines head lines, complete (blank lines allowed)
 * @returns the delimiter; ',' when none appears
 * @example detectDelimiter(['t;p', '0,5;1,2', '1,0;1,3']) // ';'
 */
export function detectDelimiter(lines: readonly string[]): TableDelimiter {
  const body = lines.filter((l) => l.trim() !== '').slice(-50);
  let best: TableDelimiter = ',';
  let bestRun = 0;
  for (const candidate of ['\t', ';', ','] as const) {
    const run = trailingRun(body, candidate);
    if (run > bestRun) {
      best = candidate;
      bestRun = run;
    }
  }
  if (bestRun === 0 && body.length > 0 && whitespaceTrailingRun(body) > 0) return ' ';
  return best;
}

/** Delimiters of contractor tables; ' ' stands for runs of spaces and tabs. */
export type TableDelimiter = ',' | ';' | '\t' | ' ';

function whitespaceTrailingRun(lines: readonly string[]): number {
  const count = (l: string) => l.trim().split(/\s+/).length;
  const target = count(lines[lines.length - 1]);
  if (target < 2) return 0;
  let run = 0;
  for (let i = lines.length - 1; i >= 0 && count(lines[i]) === target; i--) run++;
  return run;
}

/**
 * For space-separated tables, re-splits the header and units rows on runs of two or more
 * spaces (or tabs) when single spaces give more names than data columns ("Surface pressure"),
 * and the metadata rows above the header likewise ("Well      HF-3", "TVD: 2033 m").
 *
 * @param rows rows split on single space runs (modified in place)
 * @param lines the raw lines
 * @example respaceHeader(rows, lines)
 */
export function respaceHeader(rows: string[][], lines: readonly string[]): void {
  const layout = findTableLayout(rows);
  if (!layout || layout.headerRow === null) return;
  const width = rowWidth(rows[layout.dataStart]);
  for (const r of layout.metadataRows) rows[r] = lines[r].trim().split(/\s{2,}|\t/);
  for (const r of [layout.headerRow, layout.unitsRow]) {
    if (r === null || rowWidth(rows[r]) === width) continue;
    const wide = lines[r].trim().split(/\s{2,}|\t/);
    if (wide.length === width) rows[r] = wide.map((c) => c.trim());
  }
}

/** Lines at the end with the same delimiter count as the last line (0 when it has none). */
function trailingRun(lines: readonly string[], delimiter: string): number {
  if (lines.length === 0) return 0;
  const target = countOutsideQuotes(lines[lines.length - 1], delimiter);
  if (target === 0) return 0;
  let run = 0;
  for (let i = lines.length - 1; i >= 0 && countOutsideQuotes(lines[i], delimiter) === target; i--) run++;
  return run;
}

/**
 * Detects the decimal mark: ',' when the delimiter is ';' or tab and the data cells hold
 * commas but no points; '.' otherwise.
 *
 * @param rows data rows, split into cells
 * @param delimiter the delimiter found
 * @returns '.' or ','
 * @example detectDecimalMark([['0,5', '12,3']], ';') // ','
 */
export function detectDecimalMark(rows: readonly string[][], delimiter: string): '.' | ',' {
  if (delimiter === ',') return '.';
  let commas = 0;
  let points = 0;
  for (const row of rows) {
    for (const cell of row) {
      if (!isNumericText(cell)) continue;
      if (cell.includes(',')) commas++;
      if (cell.includes('.')) points++;
    }
  }
  return commas > 0 && points === 0 ? ',' : '.';
}

/**
 * Width of a row: fields up to the last non-empty one.
 *
 * @param cells cell texts
 * @returns number of fields up to the last non-empty one
 * @example rowWidth(['a', 'b', '', '']) // 2
 */
export function rowWidth(cells: readonly string[]): number {
  let w = cells.length;
  while (w > 0 && cells[w - 1].trim() === '') w--;
  return w;
}

/** A data row: at least two cells, the first a number or time, and most cells numeric. */
function isDataRow(cells: readonly string[]): boolean {
  const width = rowWidth(cells);
  if (width < 2 || timeTextKind(cells[0]) === null) return false;
  let numeric = 0;
  let filled = 0;
  for (let i = 0; i < width; i++) {
    if (cells[i].trim() === '') continue;
    filled++;
    if (timeTextKind(cells[i]) !== null) numeric++;
  }
  return numeric * 2 >= filled;
}

/**
 * Finds the table in the first rows: the first run of data rows of equal width (up to four
 * rows, or to the end), the header row above it (and a units row between), and the
 * metadata rows above the header.
 *
 * @param rows head rows split into cells
 * @returns the layout, or null when no data rows are found
 * @example findTableLayout([['Well', 'HF-3'], ['t', 'p'], ['0', '1'], ['1', '2']]) // {headerRow: 1, dataStart: 2, ...}
 */
export function findTableLayout(rows: readonly string[][]): TableLayout | null {
  const dataStart = firstDataRun(rows);
  if (dataStart < 0) return null;
  let cursor = previousFilledRow(rows, dataStart - 1);
  let unitsRow: number | null = null;
  if (cursor >= 0 && isUnitsRow(rows[cursor]) && previousFilledRow(rows, cursor - 1) >= 0) {
    unitsRow = cursor;
    cursor = previousFilledRow(rows, cursor - 1);
  }
  const headerRow = cursor >= 0 && rowWidth(rows[cursor]) >= 2 ? cursor : null;
  const metadataEnd = headerRow ?? (unitsRow ?? dataStart);
  const metadataRows: number[] = [];
  for (let i = 0; i < metadataEnd; i++) if (rowWidth(rows[i]) > 0) metadataRows.push(i);
  const width = headerRow === null ? rowWidth(rows[dataStart]) : Math.max(rowWidth(rows[headerRow]), rowWidth(rows[dataStart]));
  return { metadataRows, headerRow, unitsRow, dataStart, width };
}

function previousFilledRow(rows: readonly string[][], from: number): number {
  let i = from;
  while (i >= 0 && rowWidth(rows[i]) === 0) i--;
  return i;
}

function firstDataRun(rows: readonly string[][]): number {
  for (let i = 0; i < rows.length; i++) {
    if (!isDataRow(rows[i])) continue;
    let run = 1;
    let j = i + 1;
    for (; j < rows.length && run < 4; j++) {
      if (rowWidth(rows[j]) === 0) continue;
      if (!isDataRow(rows[j])) break;
      run++;
    }
    if (run >= 4 || j >= rows.length) return i;
  }
  return -1;
}
