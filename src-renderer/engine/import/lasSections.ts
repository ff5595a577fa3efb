/**
 * The header sections of a LAS file (Canadian Well Logging Society, LAS 1.2 and 2.0):
 * ~V version, ~W well, ~C curves, ~P parameters, ~O other, ~A data. A header line is
 * "MNEM.UNIT  DATA : DESCRIPTION" (the unit runs from the first dot to the first space; the
 * data to the last colon). In LAS 1.2 the ~W values other than STRT/STOP/STEP/NULL are
 * written in the description place ("WELL.  WELL: ANY ET AL 12").
 */
import { EngineError } from '../errors';

/** One header line. */
export interface LasItem {
  mnemonic: string;
  unit: string;
  value: string;
  description: string;
  line: number;
}

/** The sections of a LAS file before the data are read. */
export interface LasSections {
  version: LasItem[];
  well: LasItem[];
  curves: LasItem[];
  parameters: LasItem[];
  /** Data lines after ~A, with their line numbers. */
  dataLines: { text: string; line: number }[];
  /** Text after "~A" on its own line (column names some writers put there). */
  dataHeader: string;
  hasDataSection: boolean;
  warnings: string[];
}

const HEADER_LINE = /^([^.]*?)\s*\.(\S*)\s*(.*)$/;

/**
 * Parses one header line; a line without a dot gives null.
 *
 * @param text the line (trimmed)
 * @param line its 1-based number
 * @returns the item or null
 * @example parseLasHeaderLine('STRT.M  1670.0 : START DEPTH', 7) // {mnemonic:'STRT', unit:'M', value:'1670.0', ...}
 */
export function parseLasHeaderLine(text: string, line: number): LasItem | null {
  const parts = splitMnemonicAndUnit(text);
  if (!parts) return null;
  const rest = parts.rest;
  const colon = rest.lastIndexOf(':');
  const value = (colon >= 0 ? rest.slice(0, colon) : rest).trim();
  const description = colon >= 0 ? rest.slice(colon + 1).trim() : '';
  return { mnemonic: parts.mnemonic, unit: parts.unit, value, description, line };
}

/** Mnemonic, unit and the rest; a line starting with "." has an empty mnemonic unless a " ." follows (".ILM .OHMM"). */
function splitMnemonicAndUnit(text: string): { mnemonic: string; unit: string; rest: string } | null {
  if (text.startsWith('.')) {
    const dotted = /^(\.[^\s.]+)\s+\.(\S*)\s*(.*)$/.exec(text);
    if (dotted) return { mnemonic: dotted[1], unit: dotted[2], rest: dotted[3] };
    const bare = /^\.(\S*)\s*(.*)$/.exec(text)!;
    return { mnemonic: '', unit: bare[1], rest: bare[2] };
  }
  const m = HEADER_LINE.exec(text);
  return m ? { mnemonic: m[1].trim(), unit: m[2], rest: m[3] } : null;
}

/**
 * Splits LAS text into sections.
 *
 * @param text decoded file text
 * @param fileName for errors
 * @returns the sections
 * @throws EngineError 'bad-las' when the text has no "~" section marks (not a LAS file)
 * @example splitLasSections('~V\nVERS. 2.0 :\n~C\nDEPT.M :\n~A\n1\n', 'a.las').curves.length // 1
 */
export function splitLasSections(text: string, fileName: string): LasSections {
  const out: LasSections = { version: [], well: [], curves: [], parameters: [], dataLines: [], dataHeader: '', hasDataSection: false, warnings: [] };
  const lines = text.split(/\r\n|\r|\n/);
  let section = '';
  let sawMark = false;
  for (let i = 0; i < lines.length; i++) {
    const trimmed = lines[i].trim();
    if (section === 'A' && trimmed !== '' && !trimmed.startsWith('#') && !trimmed.startsWith('~')) {
      out.dataLines.push({ text: trimmed, line: i + 1 });
      continue;
    }
    if (trimmed === '' || trimmed.startsWith('#')) continue;
    if (trimmed.startsWith('~')) {
      sawMark = true;
      section = trimmed.charAt(1).toUpperCase();
      if (section === 'A') {
        out.hasDataSection = true;
        out.dataHeader = trimmed.replace(/^~\S*\s*/, '');
      }
      continue;
    }
    if (!sawMark) break;
    addHeaderLine(out, section, trimmed, i + 1);
  }
  if (!sawMark) throw new EngineError('bad-las', 'not a LAS file: no "~V" section', { file: fileName, line: 1 }, 'a LAS 1.2 or 2.0 file starting with ~VERSION');
  return out;
}

function addHeaderLine(out: LasSections, section: string, text: string, line: number): void {
  const target = section === 'V' ? out.version : section === 'W' ? out.well : section === 'C' ? out.curves : section === 'P' ? out.parameters : null;
  if (!target) return;
  const item = parseLasHeaderLine(text, line);
  if (item) target.push(item);
  else out.warnings.push(`line ${line} in ~${section} is not "MNEM.UNIT DATA : DESCRIPTION"; skipped`);
}

/**
 * Value of a ~W item as LAS 1.2 or 2.0 places it.
 *
 * @param item the item
 * @param version LAS version number (1.2, 2.0 ...)
 * @returns the value text
 * @example wellItemValue({mnemonic:'WELL', value:'WELL', description:'HF-3', ...}, 1.2) // 'HF-3'
 */
export function wellItemValue(item: LasItem, version: number): string {
  if (version < 2 && !/^(STRT|STOP|STEP|NULL)$/i.test(item.mnemonic) && item.description !== '') return item.description;
  return item.value;
}
