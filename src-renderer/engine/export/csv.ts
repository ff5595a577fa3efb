/**
 * CSV export of the regional stress table (RFC 4180: comma separated, CRLF line ends,
 * fields with comma, quote, CR or LF enclosed in double quotes, quotes doubled). A header
 * block of provenance lines comes first, each a single field starting with "#", then a
 * blank line, the column headers and the rows. Text fields are neutralised against
 * formula injection; numbers are written as plain numbers.
 */
import type { RegionalModel, StressTableRow } from '../model/regional-model';
import { neutraliseText } from './neutralise';
import { provenanceLines, type ExportContext } from './provenance';
import { exportTable } from './table-units';

/**
 * One RFC 4180 field: numbers as written by JavaScript (no exponent for the table's
 * rounded values), null as empty, text neutralised then quoted when needed.
 *
 * @param value a cell. @returns the field text.
 * @example csvField('a,b') // '"a,b"'
 */
export function csvField(value: number | string | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = neutraliseText(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * The stress table as CSV text with its provenance header block and the safety caution.
 *
 * @param model the regional model (for provenance). @param rows from stressTable (SI).
 * @param context app version, date, unit system, title.
 * @returns CSV text, CRLF line ends, ending with CRLF.
 * @throws nothing for rows from stressTable.
 * @example stressTableCsv(model, rows, { appVersion: '0.1.0', date: new Date().toISOString(), unitSystem: 'si' })
 */
export function stressTableCsv(model: RegionalModel, rows: StressTableRow[], context: ExportContext): string {
  const table = exportTable(rows, context.unitSystem);
  const lines: string[] = [];
  for (const p of provenanceLines(model, context)) lines.push(csvField(`# ${p.label}: ${p.value}`));
  const used = model.tests.filter((t) => t.used);
  lines.push(csvField(`# Tests fitted (${used.length}): ${used.map((t) => `${t.testId} ${t.well} grade ${t.grade} ${t.reviewer ? `signed off by ${t.reviewer}` : 'not signed off'}`).join('; ')}`));
  lines.push('');
  lines.push(table.columns.map((c) => csvField(c.header)).join(','));
  for (const r of table.rows) lines.push(r.map(csvField).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
