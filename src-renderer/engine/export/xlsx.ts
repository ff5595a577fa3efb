/**
 * XLSX export of the regional stress table (Office Open XML, ECMA-376, written with
 * exceljs): a "Stress table" sheet with the safety caution on top and numbers as numeric
 * cells with number formats, and a "Provenance" sheet with the application version, date,
 * model settings, cautions and every test with its grade and who signed it off. Text cells
 * are neutralised against formula injection as in the CSV export.
 */
import type ExcelJSModule from 'exceljs';
import type { RegionalModel, StressTableRow } from '../model/regional-model';
import { neutraliseText } from './neutralise';
import { provenanceLines, testTable, type ExportContext } from './provenance';
import { SAFETY_CAUTION } from './safety';
import { exportTable } from './table-units';

/** Sheet names of the workbook. */
export const XLSX_SHEETS = { table: 'Stress table', provenance: 'Provenance' } as const;
/** Row of the table sheet holding the column headers (1-based); data start on the next row. */
export const XLSX_HEADER_ROW = 3;

function cellValue(v: number | string | null): number | string | null {
  if (v === null) return null;
  if (typeof v === 'number') return Number.isFinite(v) ? v : null;
  return neutraliseText(v);
}

function numberFormat(decimals: number): string {
  return decimals > 0 ? `0.${'0'.repeat(decimals)}` : '0';
}

/**
 * The stress table and its provenance as an XLSX workbook.
 *
 * @param model the regional model. @param rows from stressTable (SI).
 * @param context app version, date, unit system, title.
 * @returns the .xlsx file bytes.
 * @throws nothing for rows from stressTable (exceljs failures propagate as errors).
 * @example await stressTableXlsx(model, rows, { appVersion: '0.1.0', date: '2026-12-01T12:00:00Z', unitSystem: 'oilfield' })
 */
export async function stressTableXlsx(model: RegionalModel, rows: StressTableRow[], context: ExportContext): Promise<Uint8Array> {
  const table = exportTable(rows, context.unitSystem);
  // Loaded on first use, so the app's start does not carry the workbook library.
  const loaded = (await import('exceljs')) as unknown as { default?: typeof ExcelJSModule } & typeof ExcelJSModule;
  const ExcelJS = loaded.default ?? loaded;
  const wb = new ExcelJS.Workbook();
  wb.creator = `Stress Ledger ${context.appVersion}`;
  wb.created = new Date(context.date);
  const sheet = wb.addWorksheet(XLSX_SHEETS.table, { views: [{ state: 'frozen', ySplit: XLSX_HEADER_ROW }] });
  sheet.getCell(1, 1).value = neutraliseText(`Caution: ${SAFETY_CAUTION}`);
  sheet.getCell(1, 1).font = { bold: true };
  sheet.getCell(2, 1).value = neutraliseText(`${context.title ?? 'Regional stress table'} - Stress Ledger ${context.appVersion}, ${context.date}. See the Provenance sheet.`);
  const header = sheet.getRow(XLSX_HEADER_ROW);
  table.columns.forEach((c, j) => {
    header.getCell(j + 1).value = neutraliseText(c.header);
    header.getCell(j + 1).font = { bold: true };
    sheet.getColumn(j + 1).width = Math.max(10, Math.min(28, c.header.length + 2));
  });
  table.rows.forEach((r, i) => {
    const row = sheet.getRow(XLSX_HEADER_ROW + 1 + i);
    r.forEach((v, j) => {
      const cell = row.getCell(j + 1);
      cell.value = cellValue(v);
      if (typeof v === 'number') cell.numFmt = numberFormat(table.columns[j].decimals);
    });
  });
  const prov = wb.addWorksheet(XLSX_SHEETS.provenance);
  prov.getColumn(1).width = 24;
  prov.getColumn(2).width = 100;
  let r = 1;
  for (const line of provenanceLines(model, context)) {
    prov.getCell(r, 1).value = neutraliseText(line.label);
    prov.getCell(r, 2).value = neutraliseText(line.value);
    r++;
  }
  r++;
  const tests = testTable(model);
  prov.getCell(r, 1).value = 'Tests';
  prov.getCell(r, 1).font = { bold: true };
  r++;
  tests.header.forEach((h, j) => {
    prov.getCell(r, j + 1).value = h;
    prov.getCell(r, j + 1).font = { bold: true };
  });
  r++;
  for (const row of tests.rows) {
    row.forEach((v, j) => {
      prov.getCell(r, j + 1).value = cellValue(v);
    });
    r++;
  }
  const buffer = await wb.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}
