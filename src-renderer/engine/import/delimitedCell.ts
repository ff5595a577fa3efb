/**
 * The general path of the delimited-table scanner (delimitedBody.ts) for one cell that is
 * not a plain decimal ending at its delimiter: quoted cells, spaces around a number, signs,
 * exponents, clock times and ISO timestamps, blanks and text, each read exactly as the
 * scanner always read them, with the error for a cell that is not what its column expects.
 */
import { EngineError } from '../errors';
import { latin1Text, parseDecimalBytes, POWERS_OF_TEN } from './byteNumbers';
import type { BodyColumn } from './delimitedBody';
import { parseClockTime, parseIsoTimestamp } from './cellValues';

const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;
const QUOTE = 34;
const MINUS = 45;
const ZERO = 48;

/** Column kinds as the scanning loop stores them. */
export const KIND_NUMBER = 0;
export const KIND_CLOCK = 1;
export const KIND_ISO = 2;

/** The settings the scanning loop needs, prepared once. */
export interface ScanPlan {
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
 * Reads one field by the general path (quotes, spaces, signs, exponents, clock and ISO
 * times; a plain decimal with spaces around it, "  -12.5 ", is still parsed while it is
 * scanned), stores its value when the field belongs to a column, and says whether it held
 * anything but spaces. Numbers: a mantissa of up to 15 digits divided once by an exact
 * power of ten (correctly rounded, IEEE 754 division), else Number() of the text
 * (byteNumbers.ts); clock and ISO times in seconds (cellValues.ts).
 *
 * @param bytes ASCII-compatible text
 * @param start offset of the field's first byte
 * @param slot column slot of the field (-1: not read)
 * @param field 0-based field index (for errors)
 * @param row row index to store at
 * @param line 1-based line number (for errors)
 * @param plan the scan settings
 * @param values the column arrays, by slot
 * @param scratch receives `filled`: whether the field held anything but spaces and tabs
 * @returns the offset of the field's terminator (delimiter, line end, or bytes.length)
 * @throws EngineError 'non-numeric-cell' for text where a number is expected, or a blank required cell
 * @example scanGeneralField(bytes, 0, 0, 0, 0, 2, plan, values, { filled: false }) // offset of the next delimiter
 */
export function scanGeneralField(
  bytes: Uint8Array, start: number, slot: number, field: number, row: number, line: number,
  plan: ScanPlan, values: Float64Array[], scratch: { filled: boolean },
): number {
  const n = bytes.length;
  const { kinds, delimiter, decimalMark } = plan;
  const collapse = delimiter === SPACE;
  let pos = start;
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
  scratch.filled = filled;
  if (slot >= 0) {
    if (simple && digits > 0 && digits <= 15) {
      const magnitude = fraction === 0 ? mantissa : mantissa / POWERS_OF_TEN[fraction];
      values[slot][row] = negative ? -magnitude : magnitude;
    } else {
      values[slot][row] = readCell(bytes, start, fieldEnd, kinds[slot], plan, slot, line, field);
    }
  }
  return pos;
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

