/**
 * Key/value entries of the metadata block above a contractor table: "Well: HF-3",
 * "TVD (m),2033", "Mud weight;1,25 sg", "Casing shoe MD = 6670 ft", or a key cell and a
 * value cell in a workbook.
 */
import type { SourceLocation } from '../errors';

/** One metadata entry as written. */
export interface MetadataEntry {
  key: string;
  value: string;
  location: SourceLocation;
}

const KEY_WITH_SEPARATOR = /^\s*([A-Za-z\u00C0-\u024F#][^:=]*?)\s*[:=]\s*(.*)$/;

/**
 * The entry of one metadata row: a first cell "key: value" (or "key = value") with the other
 * cells appended, else the first cell as key and the remaining non-empty cells as value.
 * Comment rows ("# ...", "-----") and rows with no value give null.
 *
 * @param cells cell texts of the row
 * @param location where the row is
 * @returns the entry or null
 * @example metadataEntryOfRow(['TVD', '2033', 'm'], {line: 2}) // {key:'TVD', value:'2033 m', ...}
 */
export function metadataEntryOfRow(cells: readonly string[], location: SourceLocation): MetadataEntry | null {
  const filled = cells.map((c) => c.trim()).filter((c) => c !== '');
  if (filled.length === 0 || /^[-=*_~]{3,}/.test(filled[0])) return null;
  const first = filled[0].replace(/^[#/]+\s*/, '');
  const separated = KEY_WITH_SEPARATOR.exec(first);
  if (separated) {
    const value = [separated[2], ...filled.slice(1)].filter((c) => c !== '').join(' ').trim();
    return value === '' ? null : { key: separated[1].trim(), value, location };
  }
  if (filled.length < 2) return null;
  return { key: first, value: filled.slice(1).join(' '), location };
}
