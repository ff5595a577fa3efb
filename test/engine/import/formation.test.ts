import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { importTestFile } from '../../../src-renderer/engine/import/import-test-file';
import { parseLasFile } from '../../../src-renderer/engine/import/lasImport';
import { metadataEntryOfRow } from '../../../src-renderer/engine/import/metadataEntries';
import { readMetadataEntries } from '../../../src-renderer/engine/import/metadataFields';

// Synthetic Harrow Flats fixtures (tests by Cobalt Ridge Test Services); the formation
// names are invented. The truth is the name written in the file, kept as written.

const PSI = 6894.757293168361; // NIST SP 811 App. B.8 (lbf/in2, exact definition)

function read(rows: string[][]) {
  const entries = rows.map((r, i) => metadataEntryOfRow(r, { line: i + 1 })).filter((e) => e !== null);
  return readMetadataEntries(entries);
}

const encode = (text: string) => new TextEncoder().encode(text);

describe('formation metadata', () => {
  it('should read the formation from the keys "Formation", "Formation name", "Zone" and "Tested formation"', () => {
    expect(read([['Formation: Ashgrove Shale']]).metadata.formation).toBe('Ashgrove Shale');
    expect(read([['Formation name', 'Millrace Sandstone']]).metadata.formation).toBe('Millrace Sandstone');
    expect(read([['Zone = Ashgrove Shale']]).metadata.formation).toBe('Ashgrove Shale');
    expect(read([['Tested formation', 'Millrace Sandstone']]).metadata.formation).toBe('Millrace Sandstone');
    expect(read([['FORMATION_NAME', 'Ashgrove Shale']]).metadata.formation).toBe('Ashgrove Shale');
  });

  it('should keep formation pressure a pressure and leave the formation name unset', () => {
    // "Formation pressure" is the pore pressure (common practice), not a formation name.
    const { metadata } = read([['Formation pressure', '20 MPa']]);
    expect(metadata.porePressure).toBe(20e6);
    expect(metadata.formation).toBeUndefined();
    expect(metadata.extra).toBeUndefined();
  });

  it('should carry the formation of a delimited Harrow Flats file into the record', async () => {
    const text = [
      'Well: HF-3', 'Field: Harrow Flats', 'Contractor: Cobalt Ridge Test Services', 'TVD (m): 2033', 'Mud weight: 1.25 sg',
      'Formation: Millrace Sandstone', '', 'Time (s),Pressure (psi),Rate (bbl/min)', '0,100,0', '10,150,0.5', '20,200,0.5', '30,250,0.5', '',
    ].join('\n');
    const r = await importTestFile(encode(text), 'hf3-lot.csv');
    expect(r.metadata).toMatchObject({ well: 'HF-3', formation: 'Millrace Sandstone', depthTvd: 2033 });
    expect(r.pressure[1]).toBeCloseTo(150 * PSI, 6);
    expect(r.metadata.extra?.Formation).toBeUndefined();
  });

  it('should read the formation from workbook metadata cells', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('Data');
    ws.addRows([
      ['Well', 'HF-4'], ['TVD (m)', 1480], ['Mud weight', '1.15 sg'], ['Tested formation', 'Ashgrove Shale'], [],
      ['Time (s)', 'Pressure (psi)', 'Rate (bbl/min)'], [0, 100, 0], [10, 150, 0.5], [20, 200, 0.5], [30, 250, 0.5],
    ]);
    const r = await importTestFile(new Uint8Array(await wb.xlsx.writeBuffer()), 'hf4-fit.xlsx');
    expect(r.metadata).toMatchObject({ well: 'HF-4', depthTvd: 1480, formation: 'Ashgrove Shale' });
  });

  const lasHead = [
    '~VERSION INFORMATION', ' VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0', ' WRAP. NO : ONE LINE PER TIME STEP',
    '~WELL INFORMATION', ' STRT.S 0 : START', ' STOP.S 3 : STOP', ' STEP.S 1 : STEP', ' NULL. -999.25 : NULL VALUE',
    ' WELL. HF-3 : WELL', ' FLD . Harrow Flats : FIELD', ' SRVC. Cobalt Ridge Test Services : SERVICE COMPANY',
  ];
  const lasCurves = ['~CURVE INFORMATION', ' ETIM.S : ELAPSED TIME', ' PSUR.KPA : SURFACE PRESSURE', ' QINJ.M3/MIN : PUMP RATE'];
  const lasData = ['~A', '0 1000 0', '1 1500 0.6', '2 2000 0.6', '3 2500 0.6', ''];

  it('should read FORM from the LAS ~P section (CWLS LAS 2.0 parameter lines "MNEM.UNIT VALUE : DESCRIPTION")', () => {
    const las = [...lasHead, ...lasCurves, '~PARAMETER INFORMATION', ' MW  .SG 1.25 : MUD WEIGHT', ' TVD .M 2033 : TVD', ' FORM. Millrace Sandstone : TESTED INTERVAL', ...lasData].join('\n');
    const r = parseLasFile(encode(las), 'hf3-lot.las');
    expect(r.kind).toBe('test');
    if (r.kind !== 'test') return;
    expect(r.record.metadata).toMatchObject({ well: 'HF-3', depthTvd: 2033, formation: 'Millrace Sandstone' });
  });

  it('should read FORMATION from the LAS ~W section', () => {
    const las = [...lasHead, ' FORMATION. Ashgrove Shale : FORMATION', ...lasCurves, '~PARAMETER INFORMATION', ' TVD .M 1480 : TVD', ...lasData].join('\n');
    const r = parseLasFile(encode(las), 'hf4-fit.las');
    expect(r.kind).toBe('test');
    if (r.kind !== 'test') return;
    expect(r.record.metadata.formation).toBe('Ashgrove Shale');
    expect(r.record.metadata.depthTvd).toBe(1480);
  });
});
