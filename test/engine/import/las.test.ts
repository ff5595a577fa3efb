import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { parseLasFile, type LasImport } from '../../../src-renderer/engine/import/lasImport';
import type { DepthLog } from '../../../src-renderer/engine/record';
import { normaliseUnitName } from '../../../src-renderer/engine/units/unitNames';
import { unitDimension, unitFactorToSI } from '../../../src-renderer/engine/units/units';
import { referencePath } from '../../support/reference';

// LAS corpus: CWLS LAS 1.2/2.0 standard examples and the lasio project's test files (MIT),
// shared/reference/las-corpus (SOURCES.md section 5). Expected values for the standard
// examples: expected-standard-examples.json, read directly from each file's ~C and ~A.
const CORPUS = referencePath('las-corpus');
const read = (rel: string, options = {}) => parseLasFile(new Uint8Array(readFileSync(join(CORPUS, rel))), rel, options);
const expected: Record<string, { curves: string[]; rows: number; null: number; wrap: boolean; first_row: number[]; last_row: number[] }> =
  JSON.parse(readFileSync(join(CORPUS, 'expected-standard-examples.json'), 'utf8'));

function allLasFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? allLasFiles(p) : p.endsWith('.las') ? [p.slice(CORPUS.length + 1)] : [];
  });
}

/** A log row back in the file's own units (the importer converts recognised units to SI). */
function rowAsWritten(log: DepthLog, i: number): number[] {
  return [log.depth[i], ...Object.values(log.curves).map((c) => {
    const name = c.unitWritten ? normaliseUnitName(c.unitWritten) : null;
    const dimension = name ? unitDimension(name) : null;
    const factor = name && dimension && c.unit !== c.unitWritten ? unitFactorToSI(name, dimension) : 1;
    return c.values[i] / factor;
  })];
}

function expectRow(actual: number[], wanted: number[], nullValue: number): void {
  expect(actual.length).toBe(wanted.length);
  wanted.forEach((w, k) => (w === nullValue ? expect(actual[k]).toBeNaN() : expect(actual[k]).toBeCloseTo(w, 6)));
}

describe('LAS standard examples', () => {
  for (const [rel, want] of Object.entries(expected)) {
    it(`should read ${rel} as the standard lists it`, () => {
      const result = read(rel, { allowMissingRateAndVolume: true });
      if (result.kind === 'test') {
        // time-indexed example (ETIM in s, BSG1 in psig)
        const r = result.record;
        expect(r.time.length).toBe(want.rows);
        expect(r.time[want.rows - 1]).toBeCloseTo(want.last_row[0] - want.first_row[0], 9);
        expect(r.pressure[0]).toBeCloseTo(want.first_row[2] * 6894.757293168361, 3); // psi, NIST SP 811
        return;
      }
      const log = result.log;
      expect(Object.keys(log.curves)).toEqual(want.curves.slice(1));
      expect(log.depth.length).toBe(want.rows);
      expect(log.nullValue).toBe(want.null);
      expectRow(rowAsWritten(log, 0), want.first_row, want.null);
      expectRow(rowAsWritten(log, want.rows - 1), want.last_row, want.null);
    });
  }

  it('should convert bulk density to kg/m3 and keep other curves as written', () => {
    const { log } = read('cwls-standard-examples/2.0/sample_2.0.las') as Extract<LasImport, { kind: 'log' }>;
    expect(log.curves.RHOB).toMatchObject({ unit: 'kg/m3', unitWritten: 'K/M3' });
    expect(log.curves.RHOB.values[0]).toBe(2550);
    expect(log.curves.DT.unit).toBe('US/M');
    expect(log.indexKind).toBe('md');
  });
});

describe('LAS corpus', () => {
  const files = allLasFiles(CORPUS);

  it('should read or refuse with a typed error every file of the corpus', () => {
    expect(files.length).toBeGreaterThanOrEqual(100);
    for (const rel of files) {
      try {
        const r = read(rel, { allowMissingRateAndVolume: true });
        const n = r.kind === 'log' ? r.log.depth.length : r.record.time.length;
        expect(n, rel).toBeGreaterThan(0);
      } catch (e) {
        expect(e, rel).toBeInstanceOf(EngineError);
        expect((e as EngineError).location.file, rel).toBe(rel);
      }
    }
  });

  it('should give the clear error of each malformed file', () => {
    const cases: [string, string][] = [
      ['lasio-tests/not_a_las_file.las', 'bad-las'],
      ['lasio-tests/header_only.las', 'empty-table'],
      ['lasio-tests/missing_a_section.las', 'empty-table'],
      ['lasio-tests/issue79.las', 'unsupported-format'], // LAS 3.0
      ['lasio-tests/null_policy_runon.las', 'bad-las'], // run-on values "7.020101130.188"
      ['lasio-tests/barebones2.las', 'bad-las'],
      ['lasio-tests/data_characters.las', 'no-pressure-column'], // time-indexed, no pressure curve
    ];
    for (const [rel, code] of cases) expect(() => read(rel), rel).toThrow(expect.objectContaining({ code }));
  });

  it('should read every encoding of the same file alike (UTF-8, BOM, UTF-16 LE/BE with and without BOM, cp1252, ISO-8859-1)', () => {
    const reference = read('lasio-tests/encodings_utf8.las') as Extract<LasImport, { kind: 'log' }>;
    for (const name of ['utf8wbom', 'utf16be', 'utf16bebom', 'utf16le', 'utf16lebom', 'cp1252', 'iso88591']) {
      const r = read(`lasio-tests/encodings_${name}.las`) as Extract<LasImport, { kind: 'log' }>;
      expect(Array.from(r.log.depth), name).toEqual(Array.from(reference.log.depth));
      // (the files differ in one mnemonic's characters, so only the shape is compared)
      expect(Object.keys(r.log.curves).length, name).toBe(Object.keys(reference.log.curves).length);
      expect(Array.from(r.log.curves.NPHI.values), name).toEqual(Array.from(reference.log.curves.NPHI.values));
    }
  });

  it('should read depth units F, FT, M, lower case and tenths of an inch', () => {
    const depthOf = (f: string) => (read(`lasio-tests/${f}.las`) as Extract<LasImport, { kind: 'log' }>).log.depth;
    expect(depthOf('autodepthindex_F')[1]).toBeCloseTo(0.3048, 12); // 1 ft
    expect(depthOf('autodepthindex_FT')[1]).toBeCloseTo(0.3048, 12);
    expect(depthOf('autodepthindex_M')[1]).toBe(1);
    expect(depthOf('autodepthindex_point_one_inch')[0]).toBeCloseTo(986904 * 0.00254, 6); // .1IN = 0.1 in
  });

  it('should read nulls, comma decimal marks, wrapped rows and skip a NULL index', () => {
    const comma = read('lasio-tests/comma_decimal_mark.las') as Extract<LasImport, { kind: 'log' }>;
    expect(comma.log.curves.SFLU.values[1]).toBeCloseTo(123.42, 9);
    const err = read('lasio-tests/null_policy_ERR.las') as Extract<LasImport, { kind: 'log' }>;
    expect(err.log.curves.RHOB.values[2]).toBeNaN(); // "ERR"
    expect(err.log.curves.SFLA.values[2]).toBeNaN(); // -999.25 = NULL
    const indexNull = read('lasio-tests/index_null.las') as Extract<LasImport, { kind: 'log' }>;
    expect(indexNull.log.depth.length).toBe(2);
    expect(indexNull.log.warnings?.some((w) => /NULL/.test(w))).toBe(true);
  });

  it('should turn a time-indexed LAS file with pressure and rate into a test record', () => {
    const las = [
      '~VERSION INFORMATION', ' VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0', ' WRAP. NO : ONE LINE PER TIME STEP',
      '~WELL INFORMATION', ' STRT.S 0 : START', ' STOP.S 3 : STOP', ' STEP.S 1 : STEP', ' NULL. -999.25 : NULL VALUE',
      ' WELL. HF-3 : WELL', ' FLD . Harrow Flats : FIELD', ' SRVC. Cobalt Ridge Test Services : SERVICE COMPANY',
      '~CURVE INFORMATION', ' ETIM.S : ELAPSED TIME', ' PSUR.KPA : SURFACE PRESSURE', ' QINJ.M3/MIN : PUMP RATE',
      '~PARAMETER INFORMATION', ' MW  .SG 1.25 : MUD WEIGHT', ' TVD .M 2033 : TVD',
      '~A', '0 1000 0', '1 1500 0.6', '2 2000 0.6', '3 2500 0.6', '',
    ].join('\n');
    const r = parseLasFile(new TextEncoder().encode(las), 'hf3-lot.las');
    expect(r.kind).toBe('test');
    if (r.kind !== 'test') return;
    expect(r.record.pressure[3]).toBe(2.5e6);
    expect(r.record.rate[1]).toBeCloseTo(0.01, 15);
    expect(r.record.volume[3]).toBeCloseTo(0.005 + 0.02, 12); // trapezoid of 0, 0.6, 0.6, 0.6 m3/min at 1 s
    expect(r.record.metadata).toMatchObject({ well: 'HF-3', field: 'Harrow Flats', contractor: 'Cobalt Ridge Test Services', mudDensity: 1250, depthTvd: 2033 });
  });
});

describe('LAS depth reference', () => {
  it('should read a DEPT-indexed log whose ~P DREF says TVD as TVD-indexed (CWLS LAS 2.0 parameter section; Harrow Flats demo log)', () => {
    const bytes = new Uint8Array(readFileSync(new URL('../../../demo/HF-6_density.las', import.meta.url)));
    const parsed = parseLasFile(bytes, 'HF-6_density.las');
    expect(parsed.kind).toBe('log');
    if (parsed.kind === 'log') expect(parsed.log.indexKind).toBe('tvd');
  });
});
