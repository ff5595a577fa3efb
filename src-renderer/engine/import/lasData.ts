/**
 * The ~A (ASCII data) section of a LAS file: one row per line (WRAP NO) or a row spread over
 * several lines (WRAP YES), whitespace-separated (or comma with DLM COMMA). Values equal to
 * the NULL value, and null words ("NaN", "(null)", "ERR", "-", "INF" ...), become NaN. A comma
 * inside a value is a decimal mark.
 */
import { EngineError } from '../errors';
import { parseClockTime } from './cellValues';
import type { LasSections } from './lasSections';

/** The data section read into one array per curve. */
export interface LasData {
  columns: Float64Array[];
  rows: number;
  /** Line of each row's first value. */
  lines: Int32Array;
  warnings: string[];
}

/** How the data section is laid out. */
export interface LasDataLayout {
  curveCount: number;
  wrap: boolean;
  nullValue: number | null;
  commaDelimited: boolean;
  /** The index (first curve) is a clock time "hh:mm:ss". */
  clockIndex: boolean;
  fileName: string;
}

const NUMBER = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Value of one data token: a number (point or comma decimal mark), else NaN.
 *
 * @param token the token
 * @param nullValue the file's NULL value (becomes NaN)
 * @returns the value or NaN
 * @example lasTokenValue('-999.25', -999.25) // NaN
 */
export function lasTokenValue(token: string, nullValue: number | null): number {
  if (!NUMBER.test(token)) return NaN;
  const v = Number(token.includes(',') ? token.replace(',', '.') : token);
  return nullValue !== null && v === nullValue ? NaN : v;
}

function tokensOf(text: string, comma: boolean): string[] {
  return comma ? text.split(',').map((t) => t.trim()) : text.split(/\s+/);
}

/**
 * Reads the data section.
 *
 * @param sections the split sections
 * @param layout curve count, wrap flag, NULL value, delimiter and index kind
 * @returns one array per curve (fewer when every row has fewer values than curves)
 * @throws EngineError 'bad-las' when rows disagree with the ~C section, or an index value
 *   is not a number
 * @example readLasData(sections, {curveCount: 8, wrap: false, nullValue: -999.25, commaDelimited: false, clockIndex: false, fileName: 'a.las'})
 */
export function readLasData(sections: LasSections, layout: LasDataLayout): LasData {
  const tokenRows = layout.wrap ? wrappedRows(sections, layout) : unwrappedRows(sections, layout);
  const width = tokenRows.width;
  const columns = Array.from({ length: width }, () => new Float64Array(tokenRows.rows.length));
  const lines = new Int32Array(tokenRows.rows.length);
  const warnings = [...tokenRows.warnings];
  let kept = 0;
  let textValues = 0;
  for (const { tokens, line } of tokenRows.rows) {
    const index = layout.clockIndex ? parseClockTime(tokens[0]) : lasTokenValue(tokens[0], layout.nullValue);
    if (Number.isNaN(index)) {
      if (!NUMBER.test(tokens[0]) && tokens[0] !== String(layout.nullValue)) {
        throw new EngineError('bad-las', `index value "${tokens[0]}" is not a number`, { file: layout.fileName, line, column: 1 }, 'a number in the index column');
      }
      warnings.push(`line ${line}: the index is the NULL value; row skipped`);
      continue;
    }
    columns[0][kept] = index;
    for (let c = 1; c < width; c++) {
      const v = lasTokenValue(tokens[c], layout.nullValue);
      if (Number.isNaN(v) && !NUMBER.test(tokens[c])) textValues++;
      columns[c][kept] = v;
    }
    lines[kept++] = line;
  }
  if (textValues > 0) warnings.push(`${textValues} non-numeric data value(s) read as missing (NaN)`);
  return { columns: columns.map((c) => c.subarray(0, kept)), rows: kept, lines: lines.subarray(0, kept), warnings };
}

interface TokenRows {
  rows: { tokens: string[]; line: number }[];
  width: number;
  warnings: string[];
}

function unwrappedRows(sections: LasSections, layout: LasDataLayout): TokenRows {
  const n = layout.curveCount;
  const rows = sections.dataLines.map((d) => ({ tokens: tokensOf(d.text, layout.commaDelimited), line: d.line }));
  if (rows.length === 0) return { rows, width: n, warnings: [] };
  const k = rows[0].tokens.length;
  const odd = rows.find((r) => r.tokens.length !== k);
  if (odd || k > n) {
    const bad = odd ?? rows[0];
    throw new EngineError('bad-las', `line has ${bad.tokens.length} values, the ~C section lists ${n} curves`, { file: layout.fileName, line: bad.line }, `${n} values per line (WRAP NO)`);
  }
  const warnings = k < n ? [`every data line has ${k} values for ${n} curves; the last ${n - k} curve(s) are dropped`] : [];
  return { rows, width: k, warnings };
}

function wrappedRows(sections: LasSections, layout: LasDataLayout): TokenRows {
  const n = layout.curveCount;
  const rows: TokenRows['rows'] = [];
  let current: string[] = [];
  let startLine = 0;
  let lastLine = 0;
  for (const d of sections.dataLines) {
    for (const token of tokensOf(d.text, layout.commaDelimited)) {
      if (current.length === 0) startLine = d.line;
      current.push(token);
      if (current.length === n) {
        rows.push({ tokens: current, line: startLine });
        current = [];
      }
    }
    lastLine = d.line;
  }
  if (current.length > 0) {
    throw new EngineError('bad-las', `the wrapped data ends with ${current.length} values of an incomplete row`, { file: layout.fileName, line: lastLine }, `a multiple of ${n} values (one per curve)`);
  }
  return { rows, width: n, warnings: [] };
}
