import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { detectColumns, detectImportFormat, importTestFile } from '../../../src-renderer/engine/import/import-test-file';
import { importTestFile as aliasImport } from '../../../src-renderer/engine/import/importTestFile';

const enc = (s: string) => new TextEncoder().encode(s);
const LAS = '~VERSION\n VERS. 2.0 :\n WRAP. NO :\n~WELL\n NULL. -999.25 :\n~CURVE\n TIME.S : time\n P.PSI : pressure\n Q.BPM : rate\n~A\n0 100 0\n1 150 1\n2 200 1\n';

describe('importTestFile', () => {
  it('should dispatch by content and extension', async () => {
    expect(detectImportFormat(enc('a,b\n1,2\n'), 'hf3.csv')).toBe('delimited');
    expect(detectImportFormat(enc(LAS), 'hf3.txt')).toBe('las');
    expect(detectImportFormat(new Uint8Array([0x50, 0x4b, 0x03, 0x04]), 'hf3.bin')).toBe('xlsx');
    const fromLas = await importTestFile(enc(LAS), 'hf3.txt');
    expect(fromLas.source.format).toBe('las');
    expect(fromLas.pressure[2]).toBeCloseTo(200 * 6894.757293168361, 6); // NIST SP 811 psi
    const csv = new Uint8Array(readFileSync(`${__dirname}/../../fixtures/import/hf3-lot-comma.csv`));
    expect((await importTestFile(csv, 'hf3-lot-comma.csv')).source.format).toBe('delimited');
    expect((await aliasImport(csv, 'hf3-lot-comma.csv')).time.length).toBe(21);
  });

  it('should preview LAS curves and delimited columns', async () => {
    const p = await detectColumns(enc(LAS), 'hf3.las');
    expect(p.columns.map((c) => c.role)).toEqual(['time', 'pressure', 'rate']);
    const q = await detectColumns(new Uint8Array(readFileSync(`${__dirname}/../../fixtures/import/hf3-fit-semicolon.csv`)), 'hf3-fit-semicolon.csv');
    expect(q.delimiter).toBe(';');
    expect(q.unitsRow).toEqual(['min', 'kPa', 'L/min', 'L']);
    expect(q.metadata.well).toBe('HF-3');
  });
});

describe('import options', () => {
  it('should refuse invalid options with bad-argument naming the option', async () => {
    const csv = enc('Time (s),Pressure (psi),Rate (bpm)\n0,1,0\n1,2,1\n');
    await expect(importTestFile(csv, 'a.csv', { testType: 'mini' as never })).rejects.toMatchObject({ code: 'bad-argument', message: expect.stringContaining('testType') });
    await expect(importTestFile(csv, 'a.csv', { columns: [{ index: -1, role: 'time' }] })).rejects.toMatchObject({ code: 'bad-argument' });
    await expect(importTestFile(csv, 'a.csv', { columns: [{ index: 7, role: 'time' }] })).rejects.toMatchObject({ code: 'bad-argument' });
  });
});
