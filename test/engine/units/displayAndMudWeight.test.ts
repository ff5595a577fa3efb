import { describe, expect, it } from 'vitest';
import {
  densityFromGradient, emwFromPressure, gradientFromDensity, gradientFromPressure, hydrostaticPressure, pressureFromGradient,
} from '../../../src-renderer/engine/units/mudWeight';
import { displayUnit, fromDisplay, toDisplay } from '../../../src-renderer/engine/units/unitSystem';
import { toSI } from '../../../src-renderer/engine/units/units';

describe('unit systems', () => {
  it('should show SI and oilfield display units', () => {
    expect(['pressure', 'length', 'volume', 'rate', 'density', 'gradient'].map((d) => displayUnit('si', d as never)))
      .toEqual(['MPa', 'm', 'm3', 'm3/min', 'sg', 'kPa/m']);
    expect(['pressure', 'length', 'volume', 'rate', 'density', 'gradient'].map((d) => displayUnit('oilfield', d as never)))
      .toEqual(['psi', 'ft', 'bbl', 'bbl/min', 'ppg', 'psi/ft']);
  });

  it('should convert to and from display units', () => {
    // NIST SP 811 B.8: 1 psi = 6.894 757 E+03 Pa
    expect(toDisplay(6894.757293168361, 'pressure', 'oilfield').value).toBeCloseTo(1, 12);
    expect(toDisplay(1e6, 'pressure', 'si')).toEqual({ value: 1, unit: 'MPa' });
    expect(fromDisplay(1, 'length', 'oilfield')).toBe(0.3048);
  });
});

describe('equivalent mud weight', () => {
  it('should give the EMW of a pressure at depth, p / (g_n TVD)', () => {
    // hydrostatics p = rho g h; 10 ppg over 10,000 ft = 5194.805 psi exactly (constants_and_derivations.json)
    const p = toSI(5194.805194805195, 'psi', 'pressure');
    const emw = emwFromPressure(p, toSI(10000, 'ft', 'length'));
    expect(emw / toSI(1, 'ppg', 'density')).toBeCloseTo(10, 10);
  });

  it('should relate density, gradient and pressure', () => {
    expect(gradientFromDensity(1000)).toBeCloseTo(9806.65, 9); // g_n exact (CODATA)
    expect(densityFromGradient(9806.65)).toBeCloseTo(1000, 9);
    expect(hydrostaticPressure(1250, 1520)).toBeCloseTo(1250 * 9.80665 * 1520, 6);
    expect(gradientFromPressure(15e6, 1000)).toBe(15000);
    expect(pressureFromGradient(10200, 2000)).toBe(20.4e6);
  });

  it('should refuse a depth that is not above zero', () => {
    expect(() => emwFromPressure(1e6, 0)).toThrow(expect.objectContaining({ code: 'bad-argument' }));
  });
});
