import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { XLSX_HEADER_ROW, XLSX_SHEETS, stressTableXlsx } from '../../../src-renderer/engine/export/xlsx';
import { harrowModel } from './fixtures';

const context = { appVersion: '0.1.0', date: '2026-12-01T12:00:00.000Z', unitSystem: 'si' as const };

async function load(bytes: Uint8Array) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  return wb;
}

describe('xlsx', () => {
  it('should write the table as numeric cells with number formats that read back to the model', async () => {
    const { model, rows } = harrowModel();
    const wb = await load(await stressTableXlsx(model, rows, context));
    const sheet = wb.getWorksheet(XLSX_SHEETS.table)!;
    expect(String(sheet.getCell(1, 1).value)).toMatch(/qualified engineer.*well-control policy.*local regulations and licensed practice/);
    const headers = (sheet.getRow(XLSX_HEADER_ROW).values as unknown[]).slice(1).map(String);
    const col = (h: string) => headers.indexOf(h) + 1;
    rows.forEach((r, i) => {
      const row = sheet.getRow(XLSX_HEADER_ROW + 1 + i);
      const shmin = row.getCell(col('Shmin [MPa]'));
      expect(typeof shmin.value).toBe('number');
      expect(shmin.numFmt).toBe('0.000');
      expect(shmin.value as number).toBeCloseTo(r.shmin! / 1e6, 3);
      expect(row.getCell(col('Pp [MPa]')).value as number).toBeCloseTo(r.pp / 1e6, 3);
      expect(row.getCell(col('Shmin low [MPa]')).value as number).toBeCloseTo(r.shminLow! / 1e6, 3);
    });
  });

  it('should hold the provenance: tests, grades, who signed off, settings, version, date and cautions', async () => {
    const { model, rows } = harrowModel();
    const wb = await load(await stressTableXlsx(model, rows, context));
    const prov = wb.getWorksheet(XLSX_SHEETS.provenance)!;
    const text: string[] = [];
    prov.eachRow((row) => text.push((row.values as unknown[]).slice(1).map((v) => String(v ?? '')).join('|')));
    const all = text.join('\n');
    expect(all).toMatch(/Caution\|Results are for review by a qualified engineer/);
    expect(all).toMatch(/Application\|Stress Ledger 0\.1\.0/);
    expect(all).toMatch(/Date\|2026-12-01T12:00:00\.000Z/);
    expect(all).toMatch(/Friction coefficient\|0\.6/);
    expect(all).toMatch(/hf-1\|cobalt-ridge-hf-1\.csv\|Harrow Flats\|HF-2\|xlot\|1200\|.*\|B\|accepted\|A\. Brandt\|yes/);
    // Formula-like names are neutralised: well "+HF-1" and reviewer "=cmd|calc".
    expect(all).toContain("'+HF-1");
    expect(all).toContain("'=cmd|calc");
    expect(all).not.toMatch(/\|=cmd/);
  });
});
