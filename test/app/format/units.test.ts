import { describe, expect, it } from 'vitest';
import { equivalentMudDensity, formatNumber, formatQuantity, fromDisplay, toDisplay, unitLabel } from '../../../src-renderer/app/format/units';

describe('display units', () => {
  it('should show pressure in psi using the NIST SP 811 factor', () => {
    // NIST SP 811 (2008) Appendix B.8: 1 psi = 6.894757 E+03 Pa.
    expect(toDisplay('oilfield', 'pressure', 6894.757)).toBeCloseTo(1, 6);
    expect(formatQuantity('oilfield', 'pressure', 6894.757 * 5000)).toBe('5,000 psi');
  });

  it('should show depth in feet using the exact international foot', () => {
    // NIST SP 811 Appendix B.8: 1 ft = 3.048 E-01 m (exact).
    expect(toDisplay('oilfield', 'depth', 3048)).toBeCloseTo(10000, 9);
  });

  it('should show rate in barrels per minute', () => {
    // NIST SP 811 Appendix B.8: 1 barrel (42 US gal) = 1.589873 E-01 m3.
    expect(toDisplay('oilfield', 'rate', 0.1589873 / 60)).toBeCloseTo(1, 6);
  });

  it('should show SI pressures in MPa and round-trip typed values', () => {
    expect(formatQuantity('si', 'pressure', 32.5e6)).toBe('32.50 MPa');
    expect(fromDisplay('oilfield', 'pressure', toDisplay('oilfield', 'pressure', 1.234e7))).toBeCloseTo(1.234e7, 3);
    expect(fromDisplay('si', 'stiffness', toDisplay('si', 'stiffness', 5e9))).toBeCloseTo(5e9, 3);
  });

  it('should convert an equivalent mud weight to ppg as the drilling formula does', () => {
    // METHODS.md / Bourgoyne et al. (1986): EMW[ppg] = P[psi] / (0.051948 TVD[ft]).
    // 5000 psi at 10,000 ft -> 9.625 ppg.
    const p = 5000 * 6894.757293168;
    const tvd = 10000 * 0.3048;
    const rho = equivalentMudDensity(p, tvd)!;
    expect(toDisplay('oilfield', 'emw', rho)).toBeCloseTo(5000 / (0.051948 * 10000), 2);
  });

  it('should show missing values as a dash and never a negative zero', () => {
    expect(formatQuantity('si', 'pressure', null)).toBe('–');
    expect(formatQuantity('si', 'pressure', Number.NaN)).toBe('–');
    expect(formatNumber(-0.0001, 2)).toBe('0.00');
    expect(unitLabel('si', 'volume')).toBe('m³');
  });
});
