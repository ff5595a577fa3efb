/**
 * Entry point of file import: detects the format (XLSX by its zip signature, LAS by its
 * "~V" start or .las extension, delimited text otherwise) and reads the file into the
 * normalised SI TestRecord; plus a preview for the import confirmation screen.
 *
 * Imported values are for review by a qualified engineer; they are not a substitute for
 * the operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { TestRecord } from '../record';
import { parseDelimitedTest, previewDelimited } from './delimitedImport';
import type { ImportOptions } from './importOptions';
import { checkImportOptions } from './importOptionsCheck';
import { parseLasFile } from './lasImport';
import type { TablePreview } from './tableHead';
import { decodeText, detectEncoding } from './textEncoding';
import { parseXlsxTest, previewXlsx } from './xlsxImport';

export type { ImportOptions, ColumnOverride } from './importOptions';
// validateImportOptions (the zod schema) is exported by the folder's index.ts, not here, so
// that importing a file without options never loads the schema library (importOptionsCheck.ts).
export type { TablePreview } from './tableHead';
export { parseDelimitedTest, previewDelimited } from './delimitedImport';
export { parseLasFile, type LasImport } from './lasImport';
export { parseXlsxTest, previewXlsx } from './xlsxImport';

/** File formats the importer reads. */
export type ImportFormat = 'delimited' | 'xlsx' | 'las';

/**
 * Format of a file from its first bytes and name.
 *
 * @param bytes file content
 * @param fileName its name (extension used for LAS)
 * @returns the format
 * @throws EngineError 'unsupported-format' for legacy .xls (OLE2) workbooks and PDF
 * @example detectImportFormat(bytes, 'hf3.xlsx') // 'xlsx'
 */
export function detectImportFormat(bytes: Uint8Array, fileName: string): ImportFormat {
  if (bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) return 'xlsx';
  if (bytes.length >= 4 && bytes[0] === 0xd0 && bytes[1] === 0xcf && bytes[2] === 0x11 && bytes[3] === 0xe0) {
    throw new EngineError('unsupported-format', 'legacy .xls workbooks are not read', { file: fileName }, 'an .xlsx workbook, CSV or LAS file (save the workbook as .xlsx)');
  }
  if (bytes.length >= 4 && bytes[0] === 0x25 && bytes[1] === 0x50 && bytes[2] === 0x44 && bytes[3] === 0x46) {
    throw new EngineError('unsupported-format', 'PDF reports are not read', { file: fileName }, 'the data as CSV, XLSX or LAS');
  }
  if (/\.las$/i.test(fileName)) return 'las';
  return /^\s*~V/i.test(openingText(bytes, fileName)) ? 'las' : 'delimited';
}

/** The first characters of a file, decoded leniently (a multi-byte character may be cut at the end). */
function openingText(bytes: Uint8Array, fileName: string): string {
  const found = detectEncoding(bytes);
  const lenient = found.encoding === 'utf-8' ? { ...found, encoding: 'windows-1252' as const } : found;
  try {
    return decodeText(bytes.subarray(0, 512), fileName, lenient);
  } catch {
    return '';
  }
}

/**
 * Reads a test file (CSV/TSV/semicolon text, XLSX or time-indexed LAS) into the normalised
 * SI record.
 *
 * @param bytes file content
 * @param fileName shown in errors and kept in `record.source`
 * @param options forced mapping, test type, metadata overrides, sheet, allowMissingRateAndVolume
 * @returns the record: time s from 0, pressure Pa at the gauge, rate m3/s, volume m3
 * @throws EngineError 'bad-argument' for invalid options (zod-checked, importOptionsCheck.ts); (file, line, column / sheet, cell): see parseDelimitedTest,
 *   parseXlsxTest, parseLasFile; 'unsupported-format' for a depth log or legacy workbook
 * @example const record = await importTestFile(bytes, 'hf3-lot.csv');
 */
export async function importTestFile(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): Promise<TestRecord> {
  await checkImportOptions(options, fileName);
  const format = detectImportFormat(bytes, fileName);
  if (format === 'xlsx') return parseXlsxTest(bytes, fileName, options);
  if (format === 'delimited') return parseDelimitedTest(bytes, fileName, options);
  const las = parseLasFile(bytes, fileName, options);
  if (las.kind === 'log') {
    throw new EngineError('unsupported-format', 'this LAS file is a depth-indexed log, not a pressure test', { file: fileName }, 'a time-indexed LAS file with a pressure curve (depth logs are imported as logs)');
  }
  return las.record;
}

/**
 * Preview for the import confirmation screen, without converting the whole file: header,
 * columns with detected roles and units, metadata, first ~20 rows, and the problem that
 * would stop the import as it stands (so the user can set a mapping).
 *
 * @param bytes file content
 * @param fileName for errors
 * @param options a mapping or sheet to try
 * @returns the preview
 * @throws EngineError 'empty-table', 'bad-encoding', 'bad-workbook', 'bad-las'
 * @example (await detectColumns(bytes, 'hf3-lot.csv')).columns
 */
export async function detectColumns(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): Promise<TablePreview> {
  await checkImportOptions(options, fileName);
  const format = detectImportFormat(bytes, fileName);
  if (format === 'xlsx') return previewXlsx(bytes, fileName, options);
  if (format === 'delimited') return previewDelimited(bytes, fileName, options);
  return previewLas(bytes, fileName, options);
}

/** LAS preview: the curves as columns, from a full read (LAS files are small). */
function previewLas(bytes: Uint8Array, fileName: string, options: ImportOptions): TablePreview {
  const las = parseLasFile(bytes, fileName, { ...options, allowMissingRateAndVolume: true });
  if (las.kind === 'log') {
    const names = Object.keys(las.log.curves);
    return {
      fileName, format: 'las', header: ['DEPTH', ...names],
      columns: [{ index: 0, header: 'DEPTH', role: 'depth', unit: 'm', unitStated: true },
        ...names.map((n, i) => ({ index: i + 1, header: n, role: 'other' as const, unit: las.log.curves[n].unit, unitStated: true }))],
      metadata: las.log.well ? { well: las.log.well } : {}, rows: [], layout: `las|${names.join('|').toLowerCase()}`,
      warnings: las.log.warnings ?? [], problem: { code: 'unsupported-format', message: 'depth-indexed log, not a pressure test' },
    };
  }
  const r = las.record;
  const rows: string[][] = [];
  for (let i = 0; i < Math.min(20, r.time.length); i++) rows.push([r.time[i], r.pressure[i], r.rate[i], r.volume[i]].map(String));
  return {
    fileName, format: 'las', header: r.source.columns.map((c) => c.header), columns: r.source.columns,
    metadata: r.metadata, rows, layout: r.source.layout, warnings: r.source.warnings,
  };
}
