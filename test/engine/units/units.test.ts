import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { isEngineError } from '../../../src-renderer/engine/errors';
import { STANDARD_GRAVITY } from '../../../src-renderer/engine/units/quantity';
import {
  BARREL, CUBIC_FOOT, FOOT, INCH, POUND, POUND_FORCE, POUND_PER_CUBIC_FOOT, POUND_PER_GALLON, PSI, US_GALLON,
} from '../../../src-renderer/engine/units/unitDefinitions';
import { normaliseUnitName } from '../../../src-renderer/engine/units/unitNames';
import { fromSI, toSI, unitDimension, unitsOfDimension } from '../../../src-renderer/engine/units/units';
import { referencePath } from '../../support/reference';

const REFERENCE = referencePath('units');

/** Rows of nist_sp811_factors.csv (NIST SP 811, 2008, Appendix B.8, via CRAN NISTunits; see SOURCES.md section 3). */
function sp811Rows(): Record<string, string>[] {
  const lines = readFileSync(`${REFERENCE}/nist_sp811_factors.csv`, 'utf8').trim().split('\n');
  const split = (line: string) => line.match(/("([^"]|"")*"|[^,]*)(,|$)/g)!.map((c) => c.replace(/,$/, '').replace(/^"|"$/g, '').replace(/""/g, '"'));
  const header = split(lines[0]);
  return lines.slice(1).map((l) => Object.fromEntries(split(l).map((v, i) => [header[i], v])));
}

/** Engine factor for each SP 811 row we implement (from unit -> to unit). */
const ENGINE_FACTOR: Record<string, number> = {
  'foot (ft)|metre (m)': FOOT,
  'inch (in)|metre (m)': INCH,
  'pound-force per square inch (psi) (lbf/in2)|pascal (Pa)': PSI,
  'pound-force per square inch (psi) (lbf/in2)|kilopascal (kPa)': PSI / 1000,
  'pound-force (lbf)|newton (N)': POUND_FORCE,
  'pound (avoirdupois) (lb)|kilogram (kg)': POUND,
  'gallon (U.S.) (gal)|cubic metre (m3)': US_GALLON,
  'barrel [for petroleum, 42 gallons (U.S.)] (bbl)|cubic metre (m3)': BARREL,
  'barrel [for petroleum, 42 gallons (U.S.)] (bbl)|litre (L)': BARREL * 1000,
  'cubic inch (in3)|cubic metre (m3)': INCH ** 3,
  'cubic foot (ft3)|cubic metre (m3)': CUBIC_FOOT,
  'pound per gallon (U.S.) (lb/gal)|kilogram per cubic metre (kg/m3)': POUND_PER_GALLON,
  'pound per cubic foot (lb/ft3)|kilogram per cubic metre (kg/m3)': POUND_PER_CUBIC_FOOT,
  'standard acceleration of free fall (gn)|metre per second squared (m/s2)': STANDARD_GRAVITY,
};

describe('unit factors', () => {
  const rows = sp811Rows().filter((r) => ENGINE_FACTOR[`${r.from_unit}|${r.to_unit}`] !== undefined);

  it('should cover every SP 811 row of the quantities the engine converts', () => {
    expect(rows.length).toBe(Object.keys(ENGINE_FACTOR).length);
  });

  for (const row of sp811Rows()) {
    const factor = ENGINE_FACTOR[`${row.from_unit}|${row.to_unit}`];
    if (factor === undefined) continue;
    it(`should match SP 811's printed factor for ${row.from_unit} -> ${row.to_unit} to 7 significant figures`, () => {
      // NIST SP 811 (2008) App. B.8 printed value, 7 significant figures.
      const printed = Number(row.sp811_printed_factor.replace(/\s/g, '').replace('E', 'e'));
      expect(Number(factor.toPrecision(7))).toBe(Number(printed.toPrecision(7)));
      // Exact value from the definitions (rational arithmetic, SOURCES.md section 3), to double precision.
      expect(Math.abs(factor / Number(row.exact_value) - 1)).toBeLessThan(4e-16);
    });
  }

  it('should give 4/77 psi/ft per ppg (constants_and_derivations.json)', () => {
    const derivation = JSON.parse(readFileSync(`${REFERENCE}/constants_and_derivations.json`, 'utf8')).mud_gradient_constant_0_052;
    const perPpg = fromSI(toSI(1, 'ppg', 'gradient'), 'psi/ft', 'gradient');
    expect(perPpg).toBeCloseTo(4 / 77, 15);
    expect(perPpg).toBeCloseTo(Number(derivation.exact_decimal.replace(/\.{3}$/, '')), 15);
    // related exact values printed in the same file
    expect(toSI(1, 'ppg', 'gradient') / 1000).toBeCloseTo(Number(derivation.related_exact_values.kPa_per_m_per_ppg.split(' ')[0]), 12);
    expect(toSI(1, 'psi/ft', 'gradient') / 1000).toBeCloseTo(Number(derivation.related_exact_values.kPa_per_m_per_psi_per_ft.split(' ')[0]), 12);
    // worked examples of the same file: 10 ppg over 10,000 ft
    for (const ex of derivation.test_examples_computed_here) {
      if (ex.tvd_ft !== undefined && ex.pressure_psi_exact !== undefined) {
        const p = toSI(ex.mud_weight_ppg, 'ppg', 'gradient') * toSI(ex.tvd_ft, 'ft', 'length');
        expect(fromSI(p, 'psi', 'pressure')).toBeCloseTo(ex.pressure_psi_exact, 9);
      }
      if (ex.gradient_psi_per_ft_exact !== undefined) {
        expect(fromSI(toSI(ex.mud_weight_ppg, 'ppg', 'gradient'), 'psi/ft', 'gradient')).toBeCloseTo(ex.gradient_psi_per_ft_exact, 13);
      }
    }
  });

  it('should convert the remaining units from their definitions', () => {
    expect(toSI(1, 'bar', 'pressure')).toBe(1e5); // SP 811 B.8: bar = 1.0 E+05 Pa (exact)
    expect(toSI(1, 'atm', 'pressure')).toBe(101325); // SP 811 B.8: standard atmosphere = 1.01325 E+05 Pa (exact)
    expect(toSI(1, 'GPa', 'pressure')).toBe(1e9); // SI prefix
    expect(toSI(1, 'bbl/min', 'rate')).toBeCloseTo(0.158987294928 / 60, 15); // bbl = 42 US gal (SP 811)
    expect(toSI(1, 'gal/min', 'rate')).toBeCloseTo(0.003785411784 / 60, 17);
    expect(toSI(1, 'L/min', 'rate')).toBeCloseTo(1e-3 / 60, 18);
    expect(toSI(1, 'h', 'time')).toBe(3600);
    expect(toSI(1, 'g/cm3', 'density')).toBe(1000);
    expect(toSI(1, 'sg', 'density')).toBe(1000); // common practice: sg relative to 1000 kg/m3
    expect(toSI(1, 'MPa/km', 'gradient')).toBe(1000);
    expect(toSI(1, 'sg', 'gradient')).toBeCloseTo(9806.65, 9); // 1000 kg/m3 x g_n
    expect(toSI(1, '1/psi', 'compressibility')).toBeCloseTo(1 / 6894.757293168361, 20);
    expect(toSI(1, '1/kPa', 'compressibility')).toBe(1e-3);
  });

  it('should round-trip every unit through SI', () => {
    for (const dimension of ['pressure', 'length', 'time', 'rate', 'volume', 'density', 'gradient', 'compressibility'] as const) {
      for (const unit of unitsOfDimension(dimension)) {
        expect(fromSI(toSI(123.456, unit, dimension), unit, dimension)).toBeCloseTo(123.456, 10);
      }
    }
  });

  it('should refuse a unit of the wrong dimension with unknown-unit', () => {
    try {
      toSI(1, 'psi', 'length');
      expect.unreachable();
    } catch (e) {
      expect(isEngineError(e) && e.code).toBe('unknown-unit');
    }
  });
});

describe('unit names', () => {
  it('should recognise unit names as contractors write them', () => {
    const cases: [string, string][] = [
      ['psi', 'psi'], ['PSI', 'psi'], ['psig', 'psi'], ['kPa', 'kPa'], ['Mpa', 'MPa'], ['bar', 'bar'],
      ['bbl/min', 'bbl/min'], ['bpm', 'bbl/min'], ['BPM', 'bbl/min'], ['m3/min', 'm3/min'], ['m³/min', 'm3/min'],
      ['l/min', 'L/min'], ['L/min', 'L/min'], ['gpm', 'gal/min'], ['gal/min', 'gal/min'], ['sg', 'sg'], ['SG', 'sg'],
      ['s.g.', 'sg'], ['ppg', 'ppg'], ['lb/gal', 'ppg'], ['kg/m3', 'kg/m3'], ['kg/m³', 'kg/m3'], ['g/cc', 'g/cm3'],
      ['g/cm3', 'g/cm3'], ['psi/ft', 'psi/ft'], ['kPa/m', 'kPa/m'], ['sec', 's'], ['s', 's'], ['min', 'min'],
      ['hr', 'h'], ['h', 'h'], ['ft', 'ft'], ['m', 'm'], ['M', 'm'], ['F', 'ft'], ['[psi]', 'psi'], ['K/M3', 'kg/m3'],
      ['G/C3', 'g/cm3'], ['1/psi', '1/psi'], ['/Pa', '1/Pa'], ['psi-1', '1/psi'],
    ];
    for (const [written, canonical] of cases) expect(normaliseUnitName(written), written).toBe(canonical);
  });

  it('should return null for unknown names and give the primary dimension of known ones', () => {
    expect(normaliseUnitName('furlong')).toBeNull();
    expect(normaliseUnitName('')).toBeNull();
    expect(unitDimension('BPM')).toBe('rate');
    expect(unitDimension('ppg')).toBe('density');
    expect(unitDimension('psi/ft')).toBe('gradient');
    expect(unitDimension('xyz')).toBeNull();
  });
});
