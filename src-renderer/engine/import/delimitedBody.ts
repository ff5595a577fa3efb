/**
 * The data rows of a delimited table, read straight from bytes into Float64Arrays: one pass
 * to count lines (to size the arrays), one pass to split fields and parse numbers. No string
 * of the file and no row objects are built, so a 30 MB file costs little more than its arrays.
 */
import { EngineError } from '../errors';
import { latin1Text, parseDecimalBytes, POWERS_OF_TEN } from './byteNumbers';
import { parseClockTime, parseIsoTimestamp } from './cellValues';

/** How one column of the body is read. */
export interface BodyColumn {
  /** 0-based field index in the row. */
  field: number;
  kind: 'number' | 'clock' | 'iso';
  /** A blank cell is an error (pressure, time) rather than a gap (rate, volume). */
  required: boolean;
  /** Plain name for error messages ("pressure in psi"). */
  expected: string;
}

/** Table body read into columns, in the order of the BodyColumn list. */
export interface DelimitedBody {
  values: Float64Array[];
  rows: number;
  /** 1-based line number of a data row (blank lines skipped are accounted for). */
  lineOfRow(row: number): number;
}

const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;
const QUOTE = 34;
const MINUS = 45;
const ZERO = 48;

const KIND_NUMBER = 0;
const KIND_CLOCK = 1;
const KIND_ISO = 2;

/**
 * Counts the lines from `start` as the scanner splits them (LF, CRLF or a lone CR end a
 * line): an upper bound on the rows, so that the arrays never overflow.
 */
function countLines(bytes: Uint8Array, start: number): number {
  let lines = 1;
  for (let i = bytes.indexOf(LF, start); i >= 0; i = bytes.indexOf(LF, i + 1)) lines++;
  for (let i = bytes.indexOf(CR, start); i >= 0; i = bytes.indexOf(CR, i + 1)) if (bytes[i + 1] !== LF) lines++;
  return lines;
}

/** The settings the scanning loop needs, prepared once. */
interface ScanPlan {
  slotOfField: Int32Array;
  kinds: Uint8Array;
  required: Uint8Array;
  columns: readonly BodyColumn[];
  width: number;
  delimiter: number;
  decimalMark: number;
  fileName: string;
}

/**
 * Reads the body of a delimited table.
 *
 * @param bytes ASCII-compatible bytes of the file (see asciiCompatibleBytes)
 * @param start byte offset of the first data row
 * @param firstLine 1-based line number of that row
 * @param delimiter delimiter byte (44 ',', 59 ';', 9 tab; 32 space: runs of spaces and tabs)
 * @param decimalMark decimal mark byte (46 '.', 44 ',')
 * @param width number of fields of the header row
 * @param columns columns to read
 * @param fileName for errors
 * @returns arrays of raw values (units as written; clock and ISO times in seconds)
 * @throws EngineError 'ragged-row' (too few fields, or extra non-empty ones), 'non-numeric-cell'
 *   (text where a number is expected, or a blank required cell)
 * @example scanDelimitedBody(bytes, 40, 3, 44, 46, 4, [{field:0, kind:'number', required:true, expected:'time in s'}], 'a.csv')
 */
export function scanDelimitedBody(
  bytes: Uint8Array, start: number, firstLine: number, delimiter: number, decimalMark: number,
  width: number, columns: readonly BodyColumn[], fileName: string,
): DelimitedBody {
  const capacity = countLines(bytes, start);
  const values = columns.map(() => new Float64Array(capacity));
  const plan = makePlan(columns, width, delimiter, decimalMark, fileName);
  const anchors: number[] = [0, firstLine];
  const rows = scanRows(bytes, start, firstLine, plan, values, anchors);
  return {
    values: values.map((v) => v.subarray(0, rows)),
    rows,
    lineOfRow: (row) => lineFromAnchors(anchors, row),
  };
}

function makePlan(columns: readonly BodyColumn[], width: number, delimiter: number, decimalMark: number, fileName: string): ScanPlan {
  const slotOfField = new Int32Array(width + 1).fill(-1);
  const kinds = new Uint8Array(columns.length);
  const required = new Uint8Array(columns.length);
  columns.forEach((c, slot) => {
    slotOfField[c.field] = slot;
    kinds[slot] = c.kind === 'number' ? KIND_NUMBER : c.kind === 'clock' ? KIND_CLOCK : KIND_ISO;
    required[slot] = c.required ? 1 : 0;
  });
  return { slotOfField, kinds, required, columns, width, delimiter, decimalMark, fileName };
}

/** Line of a row from the (row, line) anchors written whenever blank lines were skipped. */
function lineFromAnchors(anchors: readonly number[], row: number): number {
  let k = 0;
  for (let j = 0; j < anchors.length; j += 2) if (anchors[j] <= row) k = j;
  return anchors[k + 1] + (row - anchors[k]);
}

/** The scanning loop; returns the number of rows stored. */
function scanRows(bytes: Uint8Array, start: number, firstLine: number, plan: ScanPlan, values: Float64Array[], anchors: number[]): number {
  const n = bytes.length;
  const { slotOfField, kinds, width, delimiter, decimalMark } = plan;
  // a space delimiter stands for runs of spaces and tabs (aligned text tables)
  const collapse = delimiter === SPACE;
  let pos = start;
  let line = firstLine;
  let row = 0;
  let pendingAnchor = false;
  while (pos < n) {
    const blankEnd = endOfBlankLine(bytes, pos, delimiter);
    if (blankEnd >= 0) {
      pos = blankEnd;
      pendingAnchor = true;
      line++;
      continue;
    }
    let field = 0;
    let lastNonEmpty = -1;
    let atEnd = false;
    if (collapse) while (bytes[pos] === SPACE || bytes[pos] === TAB) pos++;
    while (!atEnd) {
      const fieldStart = pos;
      const slot = field < width ? slotOfField[field] : -1;
      // fast path: a plain decimal ("-12.5") is parsed while the field is scanned
      let simple = slot >= 0 && kinds[slot] === KIND_NUMBER;
      let mantissa = 0;
      let digits = 0;
      let fraction = 0;
      let seenMark = false;
      let negative = false;
      let trailing = false;
      let filled = false;
      let b = pos < n ? bytes[pos] : LF;
      if (b === QUOTE) {
        simple = false;
        pos++;
        while (pos < n && bytes[pos] !== QUOTE) {
          if (bytes[pos] !== SPACE) filled = true;
          pos++;
        }
        pos++;
        b = pos < n ? bytes[pos] : LF;
      }
      while (b !== delimiter && b !== LF && b !== CR && !(collapse && b === TAB)) {
        if (b !== SPACE && b !== TAB) filled = true;
        if (simple) {
          const d = b - ZERO;
          if (d >= 0 && d <= 9 && !trailing) {
            mantissa = mantissa * 10 + d;
            digits++;
            if (seenMark) fraction++;
          } else if (b === SPACE || b === TAB) {
            if (digits > 0 || seenMark || negative) trailing = true;
          } else if (b === decimalMark && !seenMark && !trailing) seenMark = true;
          else if (b === MINUS && digits === 0 && !seenMark && !negative) negative = true;
          else simple = false;
        }
        pos++;
        b = pos < n ? bytes[pos] : LF;
      }
      const fieldEnd = pos < n ? pos : n;
      if (filled) lastNonEmpty = field;
      if (slot >= 0) {
        if (simple && digits > 0 && digits <= 15) {
          const magnitude = fraction === 0 ? mantissa : mantissa / POWERS_OF_TEN[fraction];
          values[slot][row] = negative ? -magnitude : magnitude;
        } else {
          values[slot][row] = readCell(bytes, fieldStart, fieldEnd, kinds[slot], plan, slot, line, field);
        }
      }
      field++;
      if (collapse && (b === SPACE || b === TAB)) {
        while (pos < n && (bytes[pos] === SPACE || bytes[pos] === TAB)) pos++;
        b = pos < n ? bytes[pos] : LF;
        if (b !== LF && b !== CR) continue;
      }
      if (b === delimiter && !collapse) {
        pos++;
      } else {
        atEnd = true;
        pos++;
        if (b === CR && pos < n && bytes[pos] === LF) pos++;
      }
    }
    if (lastNonEmpty < 0) {
      pendingAnchor = true;
    } else {
      checkRowWidth(field, lastNonEmpty, plan, line);
      if (pendingAnchor) {
        anchors.push(row, line);
        pendingAnchor = false;
      }
      row++;
    }
    line++;
  }
  return row;
}

/** When the line at `pos` holds only spaces, tabs and delimiters: the offset after it; else -1. */
function endOfBlankLine(bytes: Uint8Array, pos: number, delimiter: number): number {
  const n = bytes.length;
  let i = pos;
  while (i < n) {
    const b = bytes[i];
    if (b === LF) return i + 1;
    if (b === CR) return i + 1 < n && bytes[i + 1] === LF ? i + 2 : i + 1;
    if (b !== SPACE && b !== TAB && b !== delimiter) return -1;
    i++;
  }
  return n;
}

function isBlank(bytes: Uint8Array, s: number, e: number): boolean {
  for (let i = s; i < e; i++) {
    const b = bytes[i];
    if (b !== SPACE && b !== TAB && b !== QUOTE) return false;
  }
  return true;
}

/** Reads one cell; blank optional cells give NaN (a gap to fill later). */
function readCell(bytes: Uint8Array, s: number, e: number, kind: number, plan: ScanPlan, slot: number, line: number, field: number): number {
  let value: number;
  if (kind === KIND_NUMBER) value = parseDecimalBytes(bytes, s, e, plan.decimalMark);
  else value = kind === KIND_CLOCK ? parseClockTime(latin1Text(bytes, s, e)) : parseIsoTimestamp(latin1Text(bytes, s, e));
  if (value === value) return value;
  const blank = isBlank(bytes, s, e);
  if (blank && plan.required[slot] === 0) return NaN;
  const column = plan.columns[slot];
  const what = blank ? 'blank cell' : `"${latin1Text(bytes, s, Math.min(e, s + 40)).trim()}" is not a number`;
  throw new EngineError('non-numeric-cell', what, { file: plan.fileName, line, column: field + 1 }, column.expected);
}

function checkRowWidth(fields: number, lastNonEmpty: number, plan: ScanPlan, line: number): void {
  if (fields < plan.width) {
    throw new EngineError('ragged-row', `row has ${fields} fields, the header has ${plan.width}`, { file: plan.fileName, line, column: fields + 1 }, `${plan.width} fields`);
  }
  if (lastNonEmpty >= plan.width) {
    throw new EngineError('ragged-row', `row has a value beyond the ${plan.width} header columns`, { file: plan.fileName, line, column: lastNonEmpty + 1 }, `${plan.width} fields`);
  }
}
