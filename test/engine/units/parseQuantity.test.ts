import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { parseQuantity } from '../../../src-renderer/engine/units/parseQuantity';

// Expected SI values from the exact definitions (NIST SP 811 App. B.8): ft = 0.3048 m,
// ppg = 119.8264273168966 kg/m3, psi = 6894.757293168361 Pa, bbl = 0.158987294928 m3, g_n = 9.80665.
describe('parseQuantity', () => {
  const cases: [string, Parameters<typeof parseQuantity>[1], number, string, string][] = [
    ['1520m', 'length', 1520, 'length', 'm'],
    ['4987ft', 'length', 4987 * 0.3048, 'length', 'ft'],
    ['4987 F', 'length', 4987 * 0.3048, 'length', 'F'],
    ['1.25sg', 'density', 1250, 'density', 'sg'],
    ['10.4ppg', 'density', 10.4 * 119.8264273168966, 'density', 'ppg'],
    ['1250kg/m3', 'density', 1250, 'density', 'kg/m3'],
    ['1.25 g/cc', 'density', 1250, 'density', 'g/cc'],
    ['21.3MPa', 'pressureOrGradient', 21.3e6, 'pressure', 'MPa'],
    ['10.2kPa/m', 'pressureOrGradient', 10200, 'gradient', 'kPa/m'],
    ['0.45psi/ft', 'pressureOrGradient', 0.45 * 6894.757293168361 / 0.3048, 'gradient', 'psi/ft'],
    ['1.05sg', 'pressureOrGradient', 1050 * 9.80665, 'gradient', 'sg'],
    ['62m3', 'volume', 62, 'volume', 'm3'],
    ['390bbl', 'volume', 390 * 0.158987294928, 'volume', 'bbl'],
    ['5e-10/Pa', 'compressibility', 5e-10, 'compressibility', '/Pa'],
    ['3.4e-6/psi', 'compressibility', 3.4e-6 / 6894.757293168361, 'compressibility', '/psi'],
    ['3,4e-6 1/psi', 'compressibility', 3.4e-6 / 6894.757293168361, 'compressibility', '1/psi'],
    ['2 bpm', 'rate', 2 * 0.158987294928 / 60, 'rate', 'bpm'],
    ['1520', 'length', 1520, 'length', ''],
  ];
  for (const [text, kind, value, dimension, unitWritten] of cases) {
    it(`should read "${text}" as ${kind}`, () => {
      const q = parseQuantity(text, kind);
      expect(q.value).toBeCloseTo(value, Math.abs(value) < 1e-6 ? 20 : 9);
      expect(q.dimension).toBe(dimension);
      expect(q.unitWritten).toBe(unitWritten);
    });
  }

  it('should throw unknown-unit for an unknown or mismatched unit, with the location', () => {
    for (const [text, kind] of [['12 furlongs', 'length'], ['21.3MPa', 'length'], ['3 bbl', 'pressureOrGradient']] as const) {
      let error: unknown;
      try {
        parseQuantity(text, kind, { file: 'cli', column: 2 });
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(EngineError);
      expect((error as EngineError).code).toBe('unknown-unit');
      expect((error as EngineError).location.column).toBe(2);
      expect((error as EngineError).expected).toBeTruthy();
    }
  });

  it('should throw bad-argument when there is no number', () => {
    expect(() => parseQuantity('deep', 'length')).toThrow(expect.objectContaining({ code: 'bad-argument' }));
  });
});
