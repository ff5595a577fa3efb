import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { detectColumns, importTestFile } from '../../../src-renderer/engine/import/import-test-file';
import { cellAddress } from '../../../src-renderer/engine/import/workbookCells';

const PSI = 6894.757293168361; // NIST SP 811 App. B.8 (lbf/in2, exact definition)
const BBL = 0.158987294928; // 42 US gal (SP 811)

type Row = (string | number | Date | null)[];

/** A workbook with a cover sheet and a data sheet (metadata cells above the table). */
async function workbookBytes(dataRows: Row[], extraMeta: Row[] = []): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  wb.addWorksheet('Cover').addRows([['Cobalt Ridge Test Services'], ['Harrow Flats field report']]);
  const ws = wb.addWorksheet('Data');
  ws.addRows([
    ['Well', 'HF-3'],
    ['TVD (m)', 2033],
    ['Mud weight', '1,25 sg'],
    ...extraMeta,
    [],
    ['Time', 'Pressure (psi)', 'Rate (bbl/min)'],
    ...dataRows,
  ]);
  return new Uint8Array(await wb.xlsx.writeBuffer());
}

// Synthetic Harrow Flats record: clock times from 14:00:00 every 10 s, p = 100 + 50 i psi, 0.5 bbl/min.
const start = Date.UTC(2026, 10, 3, 14, 0, 0);
const rows: Row[] = Array.from({ length: 6 }, (_, i) => [new Date(start + i * 10_000), 100 + 50 * i, i === 0 ? 0 : i === 3 ? '0,5' : 0.5]);

describe('workbook import', () => {
  it('should find the data sheet, read metadata cells, numbers, decimal-comma text and date cells', async () => {
    const r = await importTestFile(await workbookBytes(rows), 'hf3.xlsx');
    expect(r.source.format).toBe('xlsx');
    expect(r.source.sheet).toBe('Data');
    expect(Array.from(r.time)).toEqual([0, 10, 20, 30, 40, 50]);
    expect(r.pressure[2]).toBeCloseTo(200 * PSI, 6);
    expect(r.rate[3]).toBeCloseTo((0.5 * BBL) / 60, 15);
    expect(r.metadata).toMatchObject({ well: 'HF-3', depthTvd: 2033, mudDensity: 1250 });
    expect(r.source.startTime).toBe('2026-11-03T14:00:00.000');
  });

  it('should name sheet, cell, row and column of a bad cell', async () => {
    const bad = rows.map((r) => [...r]);
    bad[2][1] = 'n/a';
    const bytes = await workbookBytes(bad);
    let error: unknown;
    try {
      await importTestFile(bytes, 'hf3.xlsx');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(EngineError);
    // metadata rows 1-3, blank row 4, header row 5, data from row 6: the third data row is row 8
    expect((error as EngineError).code).toBe('non-numeric-cell');
    expect((error as EngineError).location).toMatchObject({ file: 'hf3.xlsx', sheet: 'Data', cell: 'B8', line: 8, column: 2 });
  });

  it('should name the metadata cell that is out of range', async () => {
    const bytes = await workbookBytes(rows, [['Mud density', '5 sg']]);
    await expect(importTestFile(bytes, 'hf3.xlsx')).rejects.toMatchObject({ code: 'out-of-range', location: { sheet: 'Data', cell: 'A4', line: 4 } });
  });

  it('should read elapsed seconds in numeric cells and refuse a broken workbook', async () => {
    const numeric: Row[] = Array.from({ length: 4 }, (_, i) => [i * 2, 100 + i, 0.5]);
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('Test').addRows([['Time (s)', 'Pressure (kPa)', 'Q (m3/min)'], ...numeric]);
    const r = await importTestFile(new Uint8Array(await wb.xlsx.writeBuffer()), 'n.xlsx');
    expect(Array.from(r.time)).toEqual([0, 2, 4, 6]);
    expect(r.pressure[3]).toBe(103e3);
    const broken = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3, 4, 5]);
    await expect(importTestFile(broken, 'broken.xlsx')).rejects.toMatchObject({ code: 'bad-workbook' });
  });

  it('should preview the workbook table', async () => {
    const p = await detectColumns(await workbookBytes(rows), 'hf3.xlsx');
    expect(p.sheet).toBe('Data');
    expect(p.columns.map((c) => c.role)).toEqual(['timestamp', 'pressure', 'rate']);
    expect(p.rows.length).toBe(6);
  });

  it('should write A1 addresses', () => {
    expect([cellAddress(0, 0), cellAddress(6, 1), cellAddress(0, 25), cellAddress(9, 26), cellAddress(0, 701)]).toEqual(['A1', 'B7', 'Z1', 'AA10', 'ZZ1']);
  });
});

describe('workbook time-of-day cells', () => {
  it('should read Excel times without a date across midnight', async () => {
    // Excel stores a time of day as a fraction of a day; exceljs reads time-formatted cells as
    // dates on Excel day 0 (1899-12-30). Synthetic record: 23:59:40 + 10 s steps.
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('Data');
    ws.addRow(['Time', 'Pressure (kPa)', 'Rate (m3/min)']);
    for (let i = 0; i < 5; i++) {
      const row = ws.addRow([(86380 + 10 * i) % 86400 / 86400, 1000 + i, 0.5]);
      row.getCell(1).numFmt = 'hh:mm:ss';
    }
    const r = await importTestFile(new Uint8Array(await wb.xlsx.writeBuffer()), 'midnight.xlsx');
    expect(Array.from(r.time).map((t) => Math.round(t * 1000) / 1000)).toEqual([0, 10, 20, 30, 40]);
  });
});
