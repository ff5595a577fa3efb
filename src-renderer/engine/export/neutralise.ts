/**
 * Protection of exported text against spreadsheet formula injection (OWASP, "CSV
 * Injection": a cell starting with =, +, -, @, tab or carriage return may be run as a
 * formula by a spreadsheet). Text cells so starting get a leading single quote; numbers
 * are written as numbers and never altered.
 */

const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Neutralises a text cell: prefixes a single quote when it begins with = + - @, tab or CR.
 *
 * @param text any text.
 * @returns the text, safe to place in a spreadsheet cell.
 * @example neutraliseText('=HYPERLINK("x")') // "'=HYPERLINK(\"x\")"
 */
export function neutraliseText(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}
