/**
 * Reading of single cell texts: numbers with a point or comma decimal mark, ISO 8601
 * timestamps and hh:mm:ss clock times. The byte-level hot path is in byteNumbers.ts; these
 * serve the table head, metadata and workbook cells.
 */

const DECIMAL_POINT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?(?:\d+(?:,\d*)?|,\d+)(?:[eE][+-]?\d+)?$/;
const ISO_TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const CLOCK_TIME = /^(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?$/;

/**
 * A number from cell text, or NaN when the text is not a plain number.
 *
 * @param text cell text (surrounding spaces and quotes allowed)
 * @param decimalMark '.' or ','
 * @returns the number, NaN when not numeric (including blank)
 * @example parseNumberText('2033,5', ',') // 2033.5
 */
export function parseNumberText(text: string, decimalMark: '.' | ',' = '.'): number {
  const t = stripQuotes(text.trim());
  if (decimalMark === ',') return DECIMAL_COMMA.test(t) ? Number(t.replace(',', '.')) : NaN;
  return DECIMAL_POINT.test(t) ? Number(t) : NaN;
}

/**
 * Whether the text is a number with either decimal mark (used to recognise data rows).
 *
 * @param text cell text
 * @returns true when numeric
 * @example isNumericText('1,5') // true
 */
export function isNumericText(text: string): boolean {
  const t = stripQuotes(text.trim());
  return DECIMAL_POINT.test(t) || DECIMAL_COMMA.test(t);
}

/**
 * Removes one pair of surrounding double quotes (RFC 4180 quoting; doubled quotes inside unescaped).
 *
 * @param text cell text, already trimmed
 * @returns the text without the quotes
 * @example stripQuotes('"12,5"') // '12,5'
 */
export function stripQuotes(text: string): string {
  return text.length >= 2 && text[0] === '"' && text[text.length - 1] === '"' ? text.slice(1, -1).replace(/""/g, '"').trim() : text;
}

/**
 * Seconds since 1970-01-01 of an ISO 8601 timestamp ("2026-11-03T14:22:05.5",
 * "2026-11-03 14:22:05Z", "...+01:00"). Without a zone the time is taken as written (UTC
 * arithmetic), so only differences are meaningful; daylight-saving jumps are not applied.
 *
 * @param text timestamp text
 * @returns seconds, NaN when not an ISO timestamp
 * @example parseIsoTimestamp('1970-01-01T00:01:00Z') // 60
 */
export function parseIsoTimestamp(text: string): number {
  const m = ISO_TIMESTAMP.exec(stripQuotes(text.trim()));
  if (!m) return NaN;
  const ms = Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], m[6] ? +m[6] : 0);
  let seconds = ms / 1000 + (m[7] ? Number('0.' + m[7]) : 0);
  if (m[8] && m[8].toUpperCase() !== 'Z') {
    const sign = m[8][0] === '-' ? -1 : 1;
    const digits = m[8].slice(1).replace(':', '');
    seconds -= sign * (Number(digits.slice(0, 2)) * 3600 + Number(digits.slice(2)) * 60);
  }
  return isValidDate(+m[2], +m[3], +m[4], +m[5], m[6] ? +m[6] : 0) ? seconds : NaN;
}

function isValidDate(month: number, day: number, hour: number, minute: number, second: number): boolean {
  return month >= 1 && month <= 12 && day >= 1 && day <= 31 && hour <= 24 && minute < 60 && second <= 60;
}

/**
 * Seconds since midnight of a clock time "hh:mm", "hh:mm:ss" or "hh:mm:ss.fff".
 *
 * @param text clock text
 * @returns seconds in [0, 86400], NaN when not a clock time
 * @example parseClockTime('01:00:30') // 3630
 */
export function parseClockTime(text: string): number {
  const m = CLOCK_TIME.exec(stripQuotes(text.trim()));
  if (!m) return NaN;
  const h = +m[1];
  const min = +m[2];
  const s = m[3] ? +m[3] : 0;
  if (h > 24 || min > 59 || s > 60) return NaN;
  return h * 3600 + min * 60 + s + (m[4] ? Number('0.' + m[4]) : 0);
}

/**
 * Kind of time text: 'iso' timestamp, 'clock' time, 'number' or null.
 *
 * @param text cell text
 * @returns the kind, null when none
 * @example timeTextKind('14:22:05') // 'clock'
 */
export function timeTextKind(text: string): 'iso' | 'clock' | 'number' | null {
  if (!Number.isNaN(parseIsoTimestamp(text))) return 'iso';
  if (!Number.isNaN(parseClockTime(text))) return 'clock';
  return isNumericText(text) ? 'number' : null;
}

/**
 * Unwinds clock times (seconds of day) across midnight: whenever a time is more than 12 h
 * earlier than the previous one, a day is added from there on. Modifies in place.
 *
 * @param seconds seconds since midnight per sample
 * @returns the same array, monotone across midnight
 * @example unwindMidnight(new Float64Array([86390, 5])) // [86390, 86405]
 */
export function unwindMidnight(seconds: Float64Array): Float64Array {
  let offset = 0;
  let previous = -Infinity;
  for (let i = 0; i < seconds.length; i++) {
    const raw = seconds[i];
    if (raw + offset < previous - 43200) offset += 86400;
    seconds[i] = raw + offset;
    previous = seconds[i];
  }
  return seconds;
}
