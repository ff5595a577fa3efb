/**
 * The data rows of a delimited table, read straight from bytes into Float64Arrays: one pass
 * to count lines (to size the arrays, lineCount.ts), one pass to split fields and parse
 * numbers. No string of the file and no row objects are built, so a 30 MB file costs little
 * more than its arrays. The usual cell, a plain decimal ending at the delimiter, is read by
 * a tight digit loop; any other cell is rescanned by the general path from its start.
 */
import { EngineError } from '../errors';
import { POWERS_OF_TEN } from './byteNumbers';
import { KIND_CLOCK, KIND_ISO, KIND_NUMBER, scanGeneralField, type ScanPlan } from './delimitedCell';
import { countTextLines } from './lineCount';

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
const MINUS = 45;
const ZERO = 48;

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
  const capacity = countTextLines(bytes, start);
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
  // per field: the array a plain decimal goes to (null: not a number column or not read)
  const numberTarget: (Float64Array | null)[] = [];
  for (let f = 0; f < width; f++) numberTarget.push(slotOfField[f] >= 0 && kinds[slotOfField[f]] === KIND_NUMBER ? values[slotOfField[f]] : null);
  // a space delimiter stands for runs of spaces and tabs (aligned text tables)
  const collapse = delimiter === SPACE;
  let pos = start;
  let line = firstLine;
  let row = 0;
  let pendingAnchor = false;
  const scratch = { filled: false };
  while (pos < n) {
    const lead = bytes[pos];
    const blankEnd = (lead >= ZERO && lead <= ZERO + 9) || lead === MINUS ? -1 : endOfBlankLine(bytes, pos, delimiter);
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
      const slot = field < width ? slotOfField[field] : -1;
      const target = field < width ? numberTarget[field] : null;
      let b = LF;
      let done = false;
      if (target !== null) {
        // fastest path: [-]digits[.digits] straight up to the field's end, the usual cell
        let p = pos;
        let c = p < n ? bytes[p] : LF;
        const negative = c === MINUS;
        if (negative) c = ++p < n ? bytes[p] : LF;
        let mantissa = 0;
        let digits = 0;
        let d = c - ZERO;
        while (d >= 0 && d <= 9) {
          mantissa = mantissa * 10 + d;
          digits++;
          c = ++p < n ? bytes[p] : LF;
          d = c - ZERO;
        }
        let fraction = 0;
        if (c === decimalMark && c !== delimiter) {
          c = ++p < n ? bytes[p] : LF;
          d = c - ZERO;
          while (d >= 0 && d <= 9) {
            mantissa = mantissa * 10 + d;
            digits++;
            fraction++;
            c = ++p < n ? bytes[p] : LF;
            d = c - ZERO;
          }
        }
        if (digits > 0 && digits <= 15 && (c === delimiter || c === LF || c === CR || (collapse && c === TAB))) {
          const magnitude = fraction === 0 ? mantissa : mantissa / POWERS_OF_TEN[fraction];
          target[row] = negative ? -magnitude : magnitude;
          lastNonEmpty = field;
          pos = p;
          b = c;
          done = true;
        }
      }
      if (!done) {
        pos = scanGeneralField(bytes, pos, slot, field, row, line, plan, values, scratch);
        b = pos < n ? bytes[pos] : LF;
        if (scratch.filled) lastNonEmpty = field;
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

function checkRowWidth(fields: number, lastNonEmpty: number, plan: ScanPlan, line: number): void {
  if (fields < plan.width) {
    throw new EngineError('ragged-row', `row has ${fields} fields, the header has ${plan.width}`, { file: plan.fileName, line, column: fields + 1 }, `${plan.width} fields`);
  }
  if (lastNonEmpty >= plan.width) {
    throw new EngineError('ragged-row', `row has a value beyond the ${plan.width} header columns`, { file: plan.fileName, line, column: lastNonEmpty + 1 }, `${plan.width} fields`);
  }
}
