import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDelimitedTest, previewDelimited } from '../../../src-renderer/engine/import/delimitedImport';
import { readHeader, splitHeaderUnit } from '../../../src-renderer/engine/import/columnRoles';

// Exact unit factors (NIST SP 811 App. B.8 definitions): psi, bbl, ft, in, ppg; g_n (CODATA, exact).
const PSI = 6894.757293168361;
const BBL = 0.158987294928;
const FT = 0.3048;
const PPG = 119.8264273168966;
const G = 9.80665;

const fixture = (name: string) => new Uint8Array(readFileSync(`${__dirname}/../../fixtures/import/${name}`));
const bytesOf = (text: string) => new TextEncoder().encode(text);

// The fixtures are synthetic Harrow Flats records whose truth is set by formula (see each test).
describe('delimited import', () => {
  it('should read a comma file with a "key: value" metadata block and units in the header', () => {
    const r = parseDelimitedTest(fixture('hf3-lot-comma.csv'), 'hf3-lot-comma.csv');
    expect(r.time.length).toBe(21);
    expect(Array.from(r.time.slice(0, 3))).toEqual([0, 5, 10]);
    // p = 120 psi until 10 s, then 120 + 14 (t - 10) psi
    expect(r.pressure[0]).toBeCloseTo(120 * PSI, 6);
    expect(r.pressure[4]).toBeCloseTo(260 * PSI, 6);
    // 0.5 bbl/min from 10 s; V = 0.5 (t - 10) / 60 bbl
    expect(r.rate[2]).toBeCloseTo((0.5 * BBL) / 60, 15);
    expect(r.volume[20]).toBeCloseTo(0.75 * BBL, 9);
    expect(r.source.derived).toEqual({ rate: false, volume: false });
    expect(r.source.delimiter).toBe(',');
    expect(r.source.decimalMark).toBe('.');
    expect(r.source.columns.map((c) => [c.role, c.unit])).toEqual([['time', 's'], ['pressure', 'psi'], ['rate', 'bbl/min'], ['volume', 'bbl']]);
    const m = r.metadata;
    expect(m).toMatchObject({ well: 'HF-3', field: 'Harrow Flats', contractor: 'Cobalt Ridge Test Services', testType: 'lot', date: '2026-11-03', gaugePosition: 'surface', mudType: 'water-based' });
    expect(m.depthTvd).toBe(2033);
    expect(m.casingShoeMd).toBeCloseTo(6670 * FT, 9);
    expect(m.mudDensity).toBeCloseTo(10.4 * PPG, 9);
    expect(m.holeDiameter).toBeCloseTo(8.5 * 0.0254, 12);
    expect(m.systemVolume).toBe(62);
    expect(m.compressibility).toBeCloseTo(3.4e-6 / PSI, 20);
    expect(m.gaugeRange).toBeCloseTo(10000 * PSI, 4);
    // pore pressure 1.05 sg EMW at 2033 m TVD: 1050 x g_n x 2033
    expect(m.porePressure).toBeCloseTo(1050 * G * 2033, 3);
  });

  it('should read semicolons, decimal commas, CRLF, a "key;value" block and a units row', () => {
    const r = parseDelimitedTest(fixture('hf3-fit-semicolon.csv'), 'hf3-fit-semicolon.csv');
    expect(r.source.delimiter).toBe(';');
    expect(r.source.decimalMark).toBe(',');
    // time 0-3 min in 0.25 min steps; p = 1000 + 850 t kPa; 200 L/min; V = 200 t L
    expect(r.time[12]).toBe(180);
    expect(r.pressure[4]).toBeCloseTo(1850e3, 6);
    expect(r.rate[5]).toBeCloseTo(0.2 / 60, 15);
    expect(r.volume[12]).toBeCloseTo(0.6, 12);
    expect(r.metadata).toMatchObject({ well: 'HF-3', testType: 'fit', depthTvd: 1520.5, mudDensity: 1250 });
    expect(r.metadata.casingInnerDiameter).toBeCloseTo(8.681 * 0.0254, 12);
    expect(r.source.columns.map((c) => c.unit)).toEqual(['min', 'kPa', 'L/min', 'L']);
  });

  it('should read tabs, clock times across midnight, "=" metadata and a bottom-hole pressure column', () => {
    const r = parseDelimitedTest(fixture('hf3-xlot-tab.tsv'), 'hf3-xlot-tab.tsv');
    // clock from 23:59:50 every 2 s, 20 rows: elapsed 0..38 s through midnight
    expect(Array.from(r.time)).toEqual(Array.from({ length: 20 }, (_, i) => 2 * i));
    // BHP = 26 + 0.5 i MPa is preferred over the surface column and sets the gauge downhole
    expect(r.pressure[6]).toBeCloseTo(29e6, 3);
    expect(r.metadata.gaugePosition).toBe('downhole');
    expect(r.metadata.depthTvd).toBeCloseTo(6670 * FT, 9);
    // volume integrated from 0.3 m3/min (trapezoid): 0.005 + 17 x 0.01 = 0.175 m3
    expect(r.source.derived).toEqual({ rate: false, volume: true });
    expect(r.volume[19]).toBeCloseTo(0.175, 12);
    expect(r.source.warnings.some((w) => /midnight/.test(w))).toBe(true);
  });

  it('should read ISO timestamps and derive the rate from a volume-only file', () => {
    const r = parseDelimitedTest(fixture('hf3-srt-iso.csv'), 'hf3-srt-iso.csv');
    expect(r.source.startTime).toBe('2026-11-04T08:00:00');
    expect(r.source.derived).toEqual({ rate: true, volume: false });
    // steps of 1, 2 and 3 bbl/min (set when the fixture was made)
    // (volumes are written to 1e-6 bbl, so the rate is good to about 1e-7 bbl/s)
    expect(r.rate[20]).toBeCloseTo(BBL / 60, 7);
    expect(r.rate[60]).toBeCloseTo((2 * BBL) / 60, 7);
    expect(r.rate[100]).toBeCloseTo((3 * BBL) / 60, 7);
    expect(r.pressure[1]).toBeCloseTo(510 * PSI, 6);
  });

  it('should read every encoding of the same file alike', () => {
    const text = readFileSync(`${__dirname}/../../fixtures/import/hf3-lot-comma.csv`, 'utf8');
    const reference = parseDelimitedTest(bytesOf(text), 'a.csv');
    const utf16 = (s: string, bigEndian: boolean, bom: boolean) => {
      const le = Buffer.from((bom ? '\ufeff' : '') + s, 'utf16le');
      if (bigEndian) for (let i = 0; i < le.length; i += 2) [le[i], le[i + 1]] = [le[i + 1], le[i]];
      return new Uint8Array(le);
    };
    const variants: [string, Uint8Array][] = [
      ['utf-8 BOM', new Uint8Array([0xef, 0xbb, 0xbf, ...bytesOf(text)])],
      ['utf-16le BOM', utf16(text, false, true)],
      ['utf-16be BOM', utf16(text, true, true)],
      ['utf-16le', utf16(text, false, false)],
      ['CRLF', bytesOf(text.replace(/\n/g, '\r\n'))],
      ['windows-1252', new Uint8Array(Buffer.from(text.replace('water-based', 'water-based (60 °C)'), 'latin1'))],
    ];
    for (const [name, bytes] of variants) {
      const r = parseDelimitedTest(bytes, name);
      expect(Array.from(r.pressure), name).toEqual(Array.from(reference.pressure));
      expect(r.metadata.depthTvd, name).toBe(2033);
    }
    expect(parseDelimitedTest(variants[5][1], 'w').metadata.mudType).toBe('water-based (60 °C)');
  });

  it('should read units in a comma part, name tokens, square brackets and a units hint', () => {
    const tab = 'Elapsed time [min]\tAnnulus pressure, kPa\tPump rate, bbl/min\tVol_bbl\n0\t100\t0\t0\n0.5\t200\t1\t0.5\n1\t300\t1\t1\n';
    const r = parseDelimitedTest(bytesOf(tab), 't.tsv');
    expect(Array.from(r.time)).toEqual([0, 30, 60]);
    expect(r.pressure[2]).toBe(300e3);
    expect(r.rate[1]).toBeCloseTo(BBL / 60, 15);
    const hinted = parseDelimitedTest(bytesOf('Pressure units: psi\nTime units: h\nTime,Pressure,Q (gpm)\n0,1,0\n1,2,10\n'), 'h.csv');
    expect(hinted.time[1]).toBe(3600);
    expect(hinted.pressure[1]).toBeCloseTo(2 * PSI, 9);
    expect(hinted.rate[1]).toBeCloseTo((10 * 0.003785411784) / 60, 15);
  });

  it('should tolerate blank optional cells and trailing empty lines, filling the gaps', () => {
    const r = parseDelimitedTest(bytesOf('Time (s),Pressure (kPa),Rate (L/min)\n0,100,0\n1,200,\n2,300,60\n\n,,\n'), 'g.csv');
    expect(r.time.length).toBe(3);
    expect(r.rate[1]).toBeCloseTo(0.5e-3, 15); // linear interpolation between 0 and 60 L/min
    expect(r.source.warnings.some((w) => /interpolation/.test(w))).toBe(true);
  });

  it('should apply a forced column mapping, test type and metadata overrides', () => {
    const text = 'a,b,c\n0,10,0\n1,20,1\n2,30,1\n';
    const r = parseDelimitedTest(bytesOf(text), 'm.csv', {
      columns: [{ index: 0, role: 'time', unit: 'min' }, { index: 1, role: 'pressure', unit: 'bar' }, { index: 2, role: 'rate', unit: 'm3/min' }],
      testType: 'fit', metadata: { depthTvd: 1520 as never },
    });
    expect(r.time[2]).toBe(120);
    expect(r.pressure[2]).toBe(30e5);
    expect(r.metadata.testType).toBe('fit');
    expect(r.metadata.depthTvd).toBe(1520);
  });

  it('should give the same layout signature to files of the same contractor layout', () => {
    const a = parseDelimitedTest(bytesOf('Well: HF-3\nTime (s),Pressure (psi),Rate (bpm)\n0,1,0\n1,2,1\n'), 'a.csv');
    const b = parseDelimitedTest(bytesOf('Well: HF-4\nTime (s),Pressure (psi),Rate (bpm)\n0,5,0\n1,6,1\n2,7,1\n'), 'b.csv');
    expect(a.source.layout).toBe(b.source.layout);
  });

  it('should preview columns, metadata and the first 20 rows without importing', () => {
    const p = previewDelimited(fixture('hf3-srt-iso.csv'), 'hf3-srt-iso.csv');
    expect(p.rows.length).toBe(20);
    expect(p.columns.map((c) => c.role)).toEqual(['timestamp', 'pressure', 'volume']);
    const bad = previewDelimited(bytesOf('Stamp,Reading (psi)\n0,1\n1,2\n'), 'x.csv');
    expect(bad.problem?.code).toBe('no-time-column');
    expect(bad.columns[1].unit).toBe('psi');
  });
});

describe('column headers', () => {
  it('should split names and units as contractors write them', () => {
    expect(splitHeaderUnit('Pressure (psi)')).toEqual({ name: 'Pressure', unit: 'psi' });
    expect(splitHeaderUnit('Time [s]')).toEqual({ name: 'Time', unit: 's' });
    expect(splitHeaderUnit('Rate, bbl/min')).toEqual({ name: 'Rate', unit: 'bbl/min' });
    expect(splitHeaderUnit('Vol_bbl')).toEqual({ name: 'Vol', unit: 'bbl' });
    expect(splitHeaderUnit('Surface pressure')).toEqual({ name: 'Surface pressure', unit: '' });
  });

  it('should recognise common column names and pressure positions', () => {
    expect(readHeader('SPP').role).toBe('pressure');
    expect(readHeader('BHP (psi)').pressureKind).toBe('downhole');
    expect(readHeader('Downhole pressure [MPa]').pressureKind).toBe('downhole');
    expect(readHeader('Annulus pressure').pressureKind).toBe('annulus');
    expect(readHeader('Q').role).toBe('rate');
    expect(readHeader('Flow rate (m3/min)').role).toBe('rate');
    expect(readHeader('Cumulative volume (m3)').role).toBe('volume');
    expect(readHeader('Pumped volume').role).toBe('volume');
    expect(readHeader('Date/Time').role).toBe('timestamp');
    expect(readHeader('t', 's')).toMatchObject({ role: 'time', unit: 's' });
    expect(readHeader('Elapsed', 'min')).toMatchObject({ role: 'time', unit: 'min' });
    expect(readHeader('Druck (bar)').role).toBe('pressure'); // by the unit's dimension
  });
});

describe('column headers that only look like pressure', () => {
  it('should not take a gauge temperature or mud density column for pressure', () => {
    expect(readHeader('Pressure gauge temperature (degC)').role).toBe('other');
    expect(readHeader('Mud density (sg)').role).toBe('other');
    expect(readHeader('P1 (psi)').role).toBe('pressure');
    // the unit's dimension wins over a misleading name: a "rate" in bbl is a volume
    expect(readHeader('Rate total (bbl)').role).toBe('volume');
    const r = parseDelimitedTest(bytesOf('Time (s),Pressure gauge temperature (degC),Pressure (psi),Rate (bpm)\n0,60,100,0\n1,60,110,1\n'), 't.csv');
    expect(r.pressure[1]).toBeCloseTo(110 * PSI, 6);
  });
});

describe('aligned text tables', () => {
  it('should read columns separated by runs of spaces, with spaces inside header names', () => {
    // synthetic: t = 10 i s, p = 100 + 20 i psi, 0.5 bbl/min from 20 s (volume set to match)
    const r = parseDelimitedTest(fixture('hf3-fit-aligned.txt'), 'hf3-fit-aligned.txt');
    expect(r.source.delimiter).toBe(' ');
    expect(r.time[11]).toBe(110);
    expect(r.pressure[3]).toBeCloseTo(160 * PSI, 6);
    expect(r.rate[5]).toBeCloseTo((0.5 * BBL) / 60, 15);
    expect(r.metadata).toMatchObject({ well: 'HF-3', depthTvd: 2033 });
    expect(r.metadata.extra).toEqual({ 'Harrow Flats HF-3': 'Cobalt Ridge Test Services' });
    expect(r.source.columns.map((c) => c.header)).toEqual(['Time (s)', 'Surface pressure (psi)', 'Rate (bbl/min)', 'Volume (bbl)']);
  });
});

describe('line endings', () => {
  it('should read LF, CRLF, lone CR and mixed line ends alike', () => {
    const lines = ['Time (s),Pressure (kPa),Rate (L/min)', '0,100,0', '1,200,60', '2,300,60', '3,400,60'];
    for (const [name, text] of [['LF', lines.join('\n')], ['CRLF', lines.join('\r\n')], ['CR', lines.join('\r')], ['mixed', `${lines[0]}\n${lines[1]}\r${lines[2]}\r\n${lines[3]}\r${lines[4]}\n`]]) {
      const r = parseDelimitedTest(bytesOf(text), `${name}.csv`);
      expect(Array.from(r.pressure), name).toEqual([100e3, 200e3, 300e3, 400e3]);
    }
  });
});
