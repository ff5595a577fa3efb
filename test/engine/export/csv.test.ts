import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvField, stressTableCsv } from '../../../src-renderer/engine/export/csv';
import { neutraliseText } from '../../../src-renderer/engine/export/neutralise';
import { harrowModel } from './fixtures';

const context = { appVersion: '0.1.0', date: '2026-12-01T12:00:00.000Z', unitSystem: 'si' as const };

function readBack(csv: string) {
  const split = csv.indexOf('\r\n\r\n');
  const header = csv.slice(0, split);
  const parsed = Papa.parse<Record<string, number | string | null>>(csv.slice(split + 4), { header: true, dynamicTyping: true, skipEmptyLines: true });
  return { header, parsed };
}

describe('csv', () => {
  it('should quote fields per RFC 4180 and neutralise formula starts', () => {
    // RFC 4180 section 2: fields with comma, quote or line break in double quotes, quotes doubled.
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "x"')).toBe('"say ""x"""');
    expect(csvField('two\r\nlines')).toBe('"two\r\nlines"');
    // OWASP CSV Injection: text starting with = + - @ tab CR gets a leading quote.
    for (const t of ['=1+1', '+SUM(A1)', '-2+3', '@cmd', '\tx', '\rx']) expect(neutraliseText(t)).toBe(`'${t}`);
    expect(csvField('=HYPERLINK("http://x")')).toBe('"\'=HYPERLINK(""http://x"")"');
    // Numbers stay numbers, negative ones too.
    expect(csvField(-0.5)).toBe('-0.5');
    expect(csvField(null)).toBe('');
  });

  it('should read back to the model values in SI units with the caution in the header', () => {
    const { model, rows } = harrowModel();
    const csv = stressTableCsv(model, rows, context);
    const { header, parsed } = readBack(csv);
    expect(header).toMatch(/qualified engineer/);
    expect(header).toMatch(/well-control policy/);
    expect(header).toMatch(/local regulations and licensed practice/);
    expect(header).toMatch(/Stress Ledger 0\.1\.0/);
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(rows.length);
    rows.forEach((r, i) => {
      const d = parsed.data[i];
      expect(d['TVD [m]']).toBeCloseTo(r.tvd, 1);
      expect(d['Shmin [MPa]']).toBeCloseTo(r.shmin! / 1e6, 3);
      expect(d['Sv [MPa]']).toBeCloseTo(r.sv / 1e6, 3);
      expect(d['SHmax high [MPa]']).toBeCloseTo(r.shmaxHigh! / 1e6, 3);
      if (r.tvd > 0) {
        expect(d['Shmin gradient [kPa/m]']).toBeCloseTo(r.shmin! / r.tvd / 1e3, 3);
        // EMW [sg] = P / (1000 kg/m3 x g_n x TVD), g_n = 9.80665 (NIST SP 811).
        expect(d['Shmin EMW [sg]']).toBeCloseTo(r.shmin! / (1000 * 9.80665 * r.tvd), 3);
      } else {
        expect(d['Shmin gradient [kPa/m]']).toBeNull();
      }
    });
  });

  it('should write oilfield units with EMW [ppg] = P [psi] / (0.051948 TVD [ft])', () => {
    const { model, rows } = harrowModel();
    const { parsed } = readBack(stressTableCsv(model, rows, { ...context, unitSystem: 'oilfield' }));
    const r = rows[8];
    const d = parsed.data[8];
    // psi = 6894.757293168 Pa, ft = 0.3048 m (NIST SP 811); 0.051948 = 4/77 psi/ft per ppg (METHODS.md).
    const psi = r.shmin! / 6894.757293168361;
    const ft = r.tvd / 0.3048;
    expect(d['TVD [ft]']).toBeCloseTo(ft, 1);
    expect(d['Shmin [psi]']).toBeCloseTo(psi, 1);
    expect(d['Shmin gradient [psi/ft]']).toBeCloseTo(psi / ft, 4);
    expect(d['Shmin EMW [ppg]']).toBeCloseTo(psi / ((4 / 77) * ft), 2);
    expect(Math.abs((d['Shmin EMW [ppg]'] as number) - psi / (0.051948 * ft))).toBeLessThan(0.01);
  });

  it('should neutralise text from names in the table and header block', () => {
    const { model, rows } = harrowModel({ trend: { shape: { kind: 'intervals', intervals: [{ name: '=HYPERLINK("http://x")', top: 0, base: 4000 }] } } });
    const csv = stressTableCsv(model, rows, context);
    const { header, parsed } = readBack(csv);
    expect(parsed.data[3]['Trend line']).toBe('\'=HYPERLINK("http://x")');
    for (const line of header.split('\r\n')) expect(line).toMatch(/^"?#/);
  });
});
