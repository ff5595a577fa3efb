import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { logGamma, regularisedIncompleteBeta, studentTCdf, studentTQuantile } from '../../../src-renderer/engine/model/student-t';

describe('student-t', () => {
  it('should reproduce published critical values of the t distribution', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.6.7.2 "Critical values of
    // the Student's t distribution", 3 decimals as printed (checked against a public copy of
    // that table, "Upper critical values of Student's t distribution with n degrees of freedom").
    const table: [number, number, number][] = [
      [0.975, 1, 12.706], [0.95, 1, 6.314], [0.995, 1, 63.657],
      [0.975, 2, 4.303], [0.975, 5, 2.571], [0.95, 5, 2.015],
      [0.975, 10, 2.228], [0.995, 10, 3.169], [0.9, 10, 1.372],
      [0.975, 20, 2.086], [0.975, 30, 2.042], [0.975, 100, 1.984],
    ];
    for (const [p, nu, t] of table) expect(studentTQuantile(p, nu)).toBeCloseTo(t, 3);
  });

  it('should match the closed forms for one and two degrees of freedom', () => {
    // Exact: nu = 1 is the Cauchy distribution, t = tan(pi (p - 1/2)); nu = 2 has
    // t = (2p - 1) / sqrt(2 p (1 - p)) (Hill 1970, Comm. ACM 13(10), algorithm 396 notes).
    for (const p of [0.6, 0.75, 0.9, 0.975, 0.999]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 9);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 9);
    }
  });

  it('should approach the normal quantile for many degrees of freedom', () => {
    // Standard normal 97.5 % quantile: 1.960 in the same NIST/SEMATECH table (infinite degrees
    // of freedom); 1.959964 to more digits (Abramowitz & Stegun table 26.1, from memory).
    expect(studentTQuantile(0.975, 1e6)).toBeCloseTo(1.959964, 4);
  });

  it('should be symmetric and invert its own CDF', () => {
    expect(studentTQuantile(0.025, 7)).toBeCloseTo(-studentTQuantile(0.975, 7), 12);
    expect(studentTQuantile(0.5, 3)).toBe(0);
    for (const nu of [1, 3, 8.5, 40]) {
      for (const p of [0.05, 0.3, 0.8, 0.99]) expect(studentTCdf(studentTQuantile(p, nu), nu)).toBeCloseTo(p, 10);
    }
  });

  it('should compute ln Gamma and the incomplete beta function at known points', () => {
    // Gamma(1/2) = sqrt(pi), Gamma(10) = 9! (exact).
    expect(logGamma(0.5)).toBeCloseTo(Math.log(Math.sqrt(Math.PI)), 12);
    expect(logGamma(10)).toBeCloseTo(Math.log(362880), 11);
    // I_x(a, 1) = x^a and I_x(1, b) = 1 - (1 - x)^b (DLMF 8.17.8 special cases).
    expect(regularisedIncompleteBeta(0.3, 2.5, 1)).toBeCloseTo(0.3 ** 2.5, 12);
    expect(regularisedIncompleteBeta(0.3, 1, 4)).toBeCloseTo(1 - 0.7 ** 4, 12);
  });

  it('should throw out-of-range for a bad probability or degrees of freedom', () => {
    expect(() => studentTQuantile(1, 5)).toThrow(EngineError);
    expect(() => studentTQuantile(0.9, 0)).toThrow(/degrees of freedom/);
  });
});
