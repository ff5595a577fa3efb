/**
 * Number reading straight from bytes of ASCII-compatible text, for the delimited-table hot
 * path: no string is built for plain decimals. A mantissa of up to 15 digits divided once by
 * an exact power of ten is correctly rounded (IEEE 754 division of two exact doubles), so the
 * result equals Number(text); exponents and longer mantissas fall back to Number().
 */

/** Exact powers of ten 10^0 ... 10^22 (all exactly representable doubles). */
export const POWERS_OF_TEN: readonly number[] = Array.from({ length: 23 }, (_, i) => 10 ** i);

const SPACE = 32;
const TAB = 9;
const QUOTE = 34;
const PLUS = 43;
const MINUS = 45;
const DOT = 46;
const COMMA = 44;
const ZERO = 48;
const NINE = 57;

/**
 * Parses the number in bytes[start, end). Spaces, tabs and one pair of double quotes around
 * the number are ignored.
 *
 * @param bytes ASCII-compatible text
 * @param start first byte of the field
 * @param end one past the last byte
 * @param decimalMark byte of the decimal mark: 46 ('.') or 44 (',')
 * @returns the value, NaN when the field is blank or not a number
 * @example parseDecimalBytes(new TextEncoder().encode('-12.5'), 0, 5, 46) // -12.5
 */
export function parseDecimalBytes(bytes: Uint8Array, start: number, end: number, decimalMark: number): number {
  let s = start;
  let e = end;
  while (s < e && (bytes[s] === SPACE || bytes[s] === TAB)) s++;
  while (e > s && (bytes[e - 1] === SPACE || bytes[e - 1] === TAB)) e--;
  if (e - s >= 2 && bytes[s] === QUOTE && bytes[e - 1] === QUOTE) {
    s++;
    e--;
  }
  if (s >= e) return NaN;
  let i = s;
  let negative = false;
  if (bytes[i] === MINUS || bytes[i] === PLUS) {
    negative = bytes[i] === MINUS;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let fraction = 0;
  let seenMark = false;
  for (; i < e; i++) {
    const b = bytes[i];
    if (b >= ZERO && b <= NINE) {
      mantissa = mantissa * 10 + (b - ZERO);
      digits++;
      if (seenMark) fraction++;
    } else if (b === decimalMark && !seenMark) {
      seenMark = true;
    } else {
      return parseDecimalFallback(bytes, s, e, decimalMark);
    }
  }
  if (digits === 0) return NaN;
  if (digits > 15) return parseDecimalFallback(bytes, s, e, decimalMark);
  const value = fraction === 0 ? mantissa : mantissa / POWERS_OF_TEN[fraction];
  return negative ? -value : value;
}

const NUMBER_PATTERN = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Slow path: exponents, long mantissas; validated by a pattern so "12abc" is NaN. */
function parseDecimalFallback(bytes: Uint8Array, s: number, e: number, decimalMark: number): number {
  let text = latin1Text(bytes, s, e);
  if (decimalMark === COMMA) {
    if (text.includes('.')) return NaN;
    text = text.replace(',', '.');
  } else if (decimalMark === DOT && text.includes(',')) {
    return NaN;
  }
  return NUMBER_PATTERN.test(text) ? Number(text) : NaN;
}

/**
 * Text of bytes[start, end) read one byte per character (exact for ASCII fields).
 *
 * @param bytes the bytes
 * @param start first byte
 * @param end one past the last byte
 * @returns the text
 * @example latin1Text(new Uint8Array([0x41, 0x42]), 0, 2) // 'AB'
 */
export function latin1Text(bytes: Uint8Array, start: number, end: number): string {
  let out = '';
  if (end - start <= 64) {
    for (let i = start; i < end; i++) out += String.fromCharCode(bytes[i]);
    return out;
  }
  for (let i = start; i < end; i += 4096) {
    out += String.fromCharCode.apply(null, Array.from(bytes.subarray(i, Math.min(end, i + 4096))));
  }
  return out;
}
